using System.Numerics;
using WindingNotes.Syntax;
using WindingNotes.Text;

namespace WindingNotes.Model;

/// <summary>A toleranced value in the file: where it is and how far it may stray, as a fraction of its nominal.</summary>
public sealed record ToleranceSite(TextSpan Span, double Spread, string Description);

/// <summary>
/// Evaluates values to SI quantities with dimension checks. An error is reported once, where it
/// happens (an addition of volts to amperes at the '+'), and the value becomes null so nothing
/// downstream reports it again.
/// </summary>
internal sealed class ValueEvaluator(
    DiagnosticBag diagnostics, Func<Token, Quantity?> resolveName, Func<string, bool> isLet, IReadOnlyDictionary<int, double> deviations)
{
    public const int MaxDepth = 200;

    /// <summary>
    /// Values as written lie within these magnitudes (SI, or a fraction for %): far beyond any winding,
    /// yet products of a dozen of them stay finite, so no later stage overflows to infinity or NaN.
    /// </summary>
    public const double Smallest = 1e-30, Largest = 1e30;

    public List<ToleranceSite> Tolerances { get; } = [];

    /// <summary>A value with its angle and tolerance applied; <paramref name="description"/> names it in tolerance reports.</summary>
    public Quantity? Evaluate(ValueSyntax value, string description)
    {
        var nominal = Evaluate(value.Expression, 0);
        if (nominal is null) return null;
        var q = nominal.Value;
        if (q.Magnitude != 0 && !(q.Magnitude >= Smallest && q.Magnitude <= Largest))
        {
            diagnostics.ReportOutOfRange(value.Expression.Span);
            return null;
        }
        if (value.Angle is not null)
        {
            var angle = Evaluate(value.Angle, 0);
            if (angle is null) return null;
            double radians;
            if (angle.Value.Dimension == Dimension.AngleDim) radians = angle.Value.Real;
            else if (angle.Value.Dimension.IsNone)
            {
                diagnostics.ReportAngleWithoutUnit(value.Angle.Span);
                radians = angle.Value.Real * Math.PI / 180;
            }
            else
            {
                diagnostics.ReportWrongDimension(value.Angle.Span, "an angle", angle.Value.Dimension);
                return null;
            }
            q = q with { Value = q.Value * Complex.FromPolarCoordinates(1, radians) };
        }
        if (value.Tolerance is null) return q;

        var tolerance = Evaluate(value.Tolerance, 0);
        if (tolerance is null) return q;
        // "5.75 % +- 7.5" would be ±7.5 as a fraction, 130 times the value: a quantity's tolerance carries % or a unit.
        if (tolerance.Value.IsBare && !q.IsBare)
        {
            var written = value.Tolerance is NumberSyntax { Unit: null } n ? n.Number.Text : null;
            var unit = q.IsPercent ? "" : q.Flags.HasFlag(QuantityFlags.Turns) ? "turns" : q.Dimension.SiUnit();
            diagnostics.ReportMissingUnit(value.Tolerance.Span, "the tolerance", written ?? "…", unit.Length == 0 ? ["%"] : ["%", unit], written is not null);
            return null;
        }
        double spread;
        if (tolerance.Value.IsPercent) spread = tolerance.Value.Real;
        else if (tolerance.Value.Dimension.Fits(q.Dimension) && q.Magnitude > 0) spread = tolerance.Value.Magnitude / q.Magnitude;
        else
        {
            diagnostics.ReportToleranceDimension(value.Tolerance.Span, q.Dimension, tolerance.Value.Dimension);
            return q;
        }
        spread = Math.Abs(spread);
        // The value at the edge of its band must be one that can be computed with, as the value itself must.
        if (!(q.Magnitude * (1 + spread) <= Largest))
        {
            diagnostics.ReportOutOfRange(value.Tolerance.Span);
            return q;
        }
        Tolerances.Add(new ToleranceSite(value.Span, spread, description));
        return deviations.TryGetValue(value.Span.Start, out var deviation)
            ? q with { Value = q.Value * (1 + deviation * spread) }
            : q;
    }

    public Quantity? Evaluate(ExpressionSyntax expression, int depth)
    {
        if (depth > MaxDepth)
        {
            diagnostics.ReportTooDeep(expression.Span);
            return null;
        }
        var result = expression switch
        {
            NumberSyntax n => Literal(n.Number, n.Unit, imaginary: false),
            ImaginarySyntax i => Literal(i.Number, i.Unit, imaginary: true),
            ComplexSyntax c => Rectangular(c, depth),
            NameSyntaxExpression n => resolveName(n.Name),
            ParenthesisedSyntax p => Evaluate(p.Inner, depth + 1),
            UnarySyntax u => Evaluate(u.Operand, depth + 1) is { } q ? (u.Operator.Text == "-" ? q with { Value = -q.Value } : q) : null,
            CallSyntax c => Sqrt(c, depth),
            BinarySyntax b => Binary(b, depth),
            _ => null,
        };
        if (result is { } r && !(double.IsFinite(r.Value.Real) && double.IsFinite(r.Value.Imaginary)))
        {
            diagnostics.ReportOutOfRange(expression.Span);
            return null;
        }
        return result;
    }

    private Quantity? Literal(Token number, Token? unitToken, bool imaginary)
    {
        // Read from the text once (a token keeps no value).
        var read = number.Number;
        // 1e-400 reads as zero: a number written with a digit other than 0 before its exponent is not zero.
        if (read == 0 && number.Text.TakeWhile(c => c is not ('e' or 'E')).Any(c => c is >= '1' and <= '9'))
        {
            diagnostics.ReportOutOfRange(number.Span);
            return null;
        }
        var value = imaginary ? new Complex(0, read) : new Complex(read, 0);
        if (unitToken is null) return new Quantity(value, Dimension.None);
        var unit = Unit(unitToken);
        if (unit is null) return null;
        if (imaginary && unit.Offset != 0)
        {
            diagnostics.ReportWrongDimension(unitToken.Span, "a unit without an offset", unit.Dimension);
            return null;
        }
        return new Quantity(value * unit.Factor + unit.Offset, unit.Dimension, unit.Flags);
    }

    private UnitInfo? Unit(Token token)
    {
        var unit = Units.Find(token.Text);
        if (unit is null) diagnostics.ReportUnknownUnit(token, Units.Suggest(token.Text), isLet(token.Text));
        return unit;
    }

    private Quantity? Rectangular(ComplexSyntax c, int depth)
    {
        var real = Evaluate(c.Real, depth + 1);
        var imaginary = Evaluate(c.Imaginary with { Unit = null }, depth + 1);
        if (real is null || imaginary is null) return null;
        var sign = c.Operator.Text == "-" ? -1 : 1;
        var value = real.Value.Value + sign * imaginary.Value.Value;
        if (c.Imaginary.Unit is null) return new Quantity(value, Dimension.None);
        var unit = Unit(c.Imaginary.Unit);
        return unit is null ? null : new Quantity(value * unit.Factor, unit.Dimension, unit.Flags);
    }

    private Quantity? Sqrt(CallSyntax call, int depth)
    {
        if (Evaluate(call.Argument, depth + 1) is not { } q) return null;
        if (q.Dimension.Sqrt() is not { } dimension)
        {
            diagnostics.ReportSqrtDimension(call.Span, q.Dimension);
            return null;
        }
        return new Quantity(System.Numerics.Complex.Sqrt(q.Value), dimension);
    }

    private Quantity? Binary(BinarySyntax b, int depth)
    {
        var left = Evaluate(b.Left, depth + 1);
        var right = Evaluate(b.Right, depth + 1);
        if (left is not { } l || right is not { } r) return null;
        switch (b.Operator.Text)
        {
            case "+" or "-":
                if (!l.Dimension.Fits(r.Dimension))
                {
                    diagnostics.ReportMixedDimensions(b.Operator, l.Dimension, r.Dimension);
                    return null;
                }
                var dimension = l.Dimension.Power == PowerKind.Any ? r.Dimension : l.Dimension;
                var value = b.Operator.Text == "+" ? l.Value + r.Value : l.Value - r.Value;
                return new Quantity(value, dimension, l.Flags & r.Flags);
            case "*":
                return Underflowed(b, l, r, new Quantity(l.Value * r.Value, l.Dimension * r.Dimension, ScalarFlags(l, r)));
            default:
                if (r.Value == System.Numerics.Complex.Zero)
                {
                    diagnostics.ReportDivisionByZero(b.Operator);
                    return null;
                }
                return Underflowed(b, l, r, new Quantity(l.Value / r.Value, l.Dimension / r.Dimension, r.Flags == QuantityFlags.None ? l.Flags : QuantityFlags.None));
        }
    }

    /// <summary>A product or quotient of two values that are not zero is not zero: where it rounds to zero it is out of range.</summary>
    private Quantity? Underflowed(BinarySyntax b, Quantity l, Quantity r, Quantity result)
    {
        if (result.Value != System.Numerics.Complex.Zero || l.Value == System.Numerics.Complex.Zero || r.Value == System.Numerics.Complex.Zero) return result;
        diagnostics.ReportOutOfRange(b.Span);
        return null;
    }

    // 2 * 5 % is still a percentage; 5 % * 5 % is a plain fraction.
    private static QuantityFlags ScalarFlags(Quantity l, Quantity r) =>
        l.Flags == QuantityFlags.None ? r.Flags : r.Flags == QuantityFlags.None ? l.Flags : QuantityFlags.None;
}
