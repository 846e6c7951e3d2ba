using WindingNotes.Text;
using WindingNotes.Syntax;

namespace WindingNotes.Model;

// Messages of the binding stage: names, units, dimensions and the network they describe.
public static partial class ModelMessages
{
    extension(DiagnosticBag bag)
    {
        public Diagnostic ReportUnknownUnit(Token unit, string? suggestion, bool isName)
        {
            var d = bag.Error("unknown-unit", unit.Span, $"unknown unit '{unit.Text}'");
            if (isName)
                return bag.Amend(d, x => x with { Hints = [new DiagnosticHint($"to multiply by '{unit.Text}', write '* {unit.Text}'", unit.Span, $"* {unit.Text}")] });
            return bag.WithSuggestion(d, suggestion, unit.Span);
        }

        /// <summary>"give a bound on loading a unit: 100 %", with the fix where the number is a literal.</summary>
        public Diagnostic ReportMissingUnit(TextSpan span, string what, string written, IReadOnlyList<string> units, bool fixable)
        {
            var fixes = string.Join(" or ", units.Select(u => $"{written} {u}"));
            var d = bag.Error("missing-unit", span, $"give {what} a unit: {fixes}");
            return fixable ? bag.Amend(d, x => x with { Hints = [new DiagnosticHint("a bare number is not a quantity", span, $"{written} {units[0]}")] }) : d;
        }

        public Diagnostic ReportWrongDimension(TextSpan span, string expected, Dimension found) =>
            bag.Error("wrong-dimension", span, $"expected {expected}, found {found.Describe()}");

        public Diagnostic ReportMixedDimensions(Token op, Dimension left, Dimension right) =>
            bag.Error("mixed-dimensions", op.Span,
                $"cannot {(op.Text == "+" ? "add" : "subtract")} {right.Describe()} {(op.Text == "+" ? "to" : "from")} {left.Describe()}");

        public Diagnostic ReportToleranceDimension(TextSpan span, Dimension value, Dimension tolerance) =>
            bag.Error("wrong-dimension", span, $"a tolerance on {value.Describe()} must be in % or in the same unit, found {tolerance.Describe()}");

        public Diagnostic ReportSqrtDimension(TextSpan span, Dimension dimension) =>
            bag.Error("wrong-dimension", span, $"the square root of {dimension.Describe()} has no unit");

        public Diagnostic ReportDivisionByZero(Token op) => bag.Error("division-by-zero", op.Span, "division by zero");

        public Diagnostic ReportOutOfRange(TextSpan span) =>
            bag.Error("out-of-range", span, $"the value is out of range: magnitudes from {ValueEvaluator.Smallest:0e0} to {ValueEvaluator.Largest:0e0} (in SI units) can be computed with");

        public Diagnostic ReportTooDeep(TextSpan span) =>
            bag.Error("too-deep", span, $"the expression nests deeper than {ValueEvaluator.MaxDepth} levels");

        public Diagnostic ReportAngleWithoutUnit(TextSpan span) =>
            bag.Warning("angle-unit", span, "an angle without a unit is read as degrees; write 'deg' or 'rad'");

        public Diagnostic ReportOutOfBounds(TextSpan span, string what, string bounds) =>
            bag.Error("out-of-bounds", span, $"{what} must be {bounds}");

        public Diagnostic ReportNearShort(TextSpan span, double ohms) =>
            bag.Warning("load-near-short", span, $"a load of {Numbers.Format(ohms, "ohm")} is nearly a short circuit and may draw a fault's current; a short circuit is studied with a 'fault'");

        public Diagnostic ReportUnknownName(Token name, string kind, string? suggestion) =>
            bag.WithSuggestion(bag.Error("unknown-name", name.Span, $"unknown {kind} '{name.Text}'"), suggestion, name.Span);

        public Diagnostic ReportLetUsedEarly(Token name, TextSpan definition) =>
            bag.Amend(bag.Error("used-before-let", name.Span, $"'{name.Text}' is used before its let; a let can use only the lets above it"),
                d => d with { Related = [new RelatedSpan("defined here", definition)] });

        public Diagnostic ReportWrongKind(Token name, string found, string expected) =>
            bag.Error("wrong-kind", name.Span, $"'{name.Text}' is {found}, not {expected}");

        public Diagnostic ReportDuplicateName(Token second, TextSpan first, string kind) =>
            bag.Amend(bag.Error("duplicate-name", second.Span, $"'{second.Text}' is already defined as {kind}"),
                d => d with { Related = [new RelatedSpan("first defined here", first)] });

        public Diagnostic ReportDuplicateStatement(Token keyword, TextSpan first) =>
            bag.Amend(bag.Error("duplicate-statement", keyword.Span, $"'{keyword.Text}' is given twice"),
                d => d with { Related = [new RelatedSpan("first given here", first)] });

        public Diagnostic ReportGroundedTwice(Token node, TextSpan first) =>
            bag.Amend(bag.Error("duplicate-statement", node.Span, $"'{node.Text}' is already earthed through an impedance, its element '{node.Text}_ground': one 'ground {node.Text} impedance' line gives it"),
                d => d with { Related = [new RelatedSpan("first earthed here", first)] });

        public Diagnostic ReportLonelyNode(TextSpan span, string name, string? suggestion) =>
            bag.WithSuggestion(bag.Error("lonely-node", span, $"node '{name}' connects nothing else: no winding, tap, join or other element touches it"), suggestion, span);

        public Diagnostic ReportNoFrequency(TextSpan span) =>
            bag.Info("default-frequency", span, "no 'frequency' line: 50 Hz is assumed");

        public Diagnostic ReportNoTurnsOrVoltage(Token name) =>
            bag.Error("winding-size", name.Span, $"winding '{name.Text}' needs 'turns', 'rated' or both");

        public Diagnostic ReportVoltsPerTurnMismatch(TextSpan span, string name, double perTurn, string other, double otherPerTurn) =>
            bag.Warning("volts-per-turn", span,
                $"winding '{name}' has {Numbers.Format(perTurn, "V")}/turn but '{other}' on the same core has {Numbers.Format(otherPerTurn, "V")}/turn");

        public Diagnostic ReportTapOutside(TextSpan span, string tap, double turns, double total) =>
            bag.Error("tap-outside", span, $"'{tap}' is at {Numbers.Plain(turns)} turns, outside the winding's 0 to {Numbers.Plain(total)}");

        public Diagnostic ReportTapNeedsRating(TextSpan span, string winding) =>
            bag.Error("tap-position", span, $"a tap in volts needs the rated voltage of '{winding}'");

        public Diagnostic ReportSameWinding(TextSpan span) =>
            bag.Error("same-winding", span, "an impedance needs two different windings or sections");

        public Diagnostic ReportDifferentCores(TextSpan span, string a, string b) =>
            bag.Error("different-cores", span, $"'{a}' and '{b}' are on different cores; leakage impedance links windings of one core");

        public Diagnostic ReportDuplicatePair(TextSpan span, string a, string b, TextSpan first) =>
            bag.Amend(bag.Error("duplicate-impedance", span, $"the impedance between '{a}' and '{b}' is given twice"),
                d => d with { Related = [new RelatedSpan("first given here", first)] });

        public Diagnostic ReportPercentNeedsRating(TextSpan span, string core) =>
            bag.FirstOrDefault(d => d.Code == "needs-rating" && d.Span == span) ?? bag.Error("needs-rating", span, $"an impedance in % or pu needs a base (the rating of core '{core}', or 'base') and the first winding's rated voltage");

        /// <summary>Once a line: a three-phase impedance line is one line for every phase it stands for (one mistake, one message).</summary>
        public Diagnostic ReportResistanceMismatch(TextSpan span, double fromLine, double fromWindings) =>
            bag.FirstOrDefault(d => d.Code == "resistance-mismatch" && d.Span == span) ?? bag.Warning("resistance-mismatch", span,
                $"this impedance implies {Numbers.Format(fromLine, "ohm")} of resistance but the windings' resistances give {Numbers.Format(fromWindings, "ohm")} (referred to the first winding)");

        public Diagnostic ReportPowerFactorSense(Token word, string meant) =>
            bag.WithSuggestion(bag.Error("unknown-word", word.Span, $"'{word.Text}' is not a unit; a power factor is followed by 'lagging' or 'leading'"), meant, word.Span);

        public Diagnostic ReportPowerFactor(TextSpan span) => bag.Error("out-of-bounds", span, "a power factor must be above 0 and at most 1");

        public Diagnostic ReportSupplyShorted(TextSpan span, string name, string a, string b) =>
            bag.Error("supply-shorted", span, $"supply '{name}' is shorted: '{a}' and '{b}' are one node");

        public Diagnostic ReportNoSource(IReadOnlyList<(string Name, TextSpan Span)> loads) =>
            bag.Amend(bag.Warning("no-source", loads[0].Span,
                    $"{(loads.Count == 1 ? "load" : "loads")} {string.Join(", ", loads.Select(l => $"'{l.Name}'"))} {(loads.Count == 1 ? "is" : "are")} in a part of the network with no supply: no current flows there"),
                d => d with { Related = [.. loads.Skip(1).Select(l => new RelatedSpan($"load '{l.Name}'", l.Span))] });

        public Diagnostic ReportNoGround(TextSpan span, string reference, IEnumerable<string> members) =>
            bag.Warning("no-ground", span,
                $"no ground in the part with {string.Join(", ", members.Take(4).Select(m => $"'{m}'"))}{(members.Count() > 4 ? ", …" : "")}: voltages are given against '{reference}'");
    }

    // Messages of the network builder.
    extension(DiagnosticBag bag)
    {
        public Diagnostic ReportRatioUnknown(TextSpan span, string winding) =>
            bag.Error("ratio-unknown", span, $"the turns ratio of '{winding}' to the other windings on its core is unknown: give 'turns' and 'rated' together on one winding of the core");

        public Diagnostic ReportNoLoadNeedsRating(TextSpan span, string winding) =>
            bag.Error("needs-rating", span, $"a no-load current in % needs the rated current of '{winding}'");

        public Diagnostic ReportDuplicateNoLoad(TextSpan span, string core, TextSpan first) =>
            bag.Amend(bag.Error("duplicate-no-load", span, $"core '{core}' has a no-load test already; one test defines its magnetising branch"),
                d => d with { Related = [new RelatedSpan("first given here", first)] });

        public Diagnostic ReportNoLoadOffCore(TextSpan span, string winding, string core) =>
            bag.Error("different-cores", span, $"winding '{winding}' is not on core '{core}'; a no-load test is made on a winding of its core");

        public Diagnostic ReportNoLoadInconsistent(TextSpan span) =>
            bag.Error("no-load-inconsistent", span, "the no-load loss is more than the no-load current can carry at this voltage (P > V·I)");

        /// <summary>Once a line, as the mismatch.</summary>
        public Diagnostic ReportResistanceExceedsImpedance(TextSpan span, double resistance, double impedance) =>
            bag.FirstOrDefault(d => d.Code == "resistance-exceeds-impedance" && d.Span == span) ?? bag.Error("resistance-exceeds-impedance", span,
                $"the windings' resistances ({Numbers.Format(resistance, "ohm")} referred) exceed this impedance ({Numbers.Format(impedance, "ohm")})");

        public Diagnostic ReportLeakageOverlap(TextSpan span, string part, string other, TextSpan otherSpan) =>
            bag.Amend(bag.Error("leakage-overlap", span, $"'{part}' overlaps '{other}': the parts of one winding named in impedance lines must not overlap"),
                d => d with { Related = [new RelatedSpan($"'{other}' is named here", otherSpan)] });

        public Diagnostic ReportLeakageMissing(TextSpan span, IReadOnlyList<string> pairs)
        {
            var shown = pairs.Count > 4 ? [.. pairs.Take(3), $"{pairs.Count - 3} more pairs"] : pairs;
            var list = shown.Count == 1 ? shown[0] : $"{string.Join(", ", shown.Take(shown.Count - 1))} and {shown[^1]}";
            return bag.Info("leakage-missing", span,
                $"no impedance is given for {list}: {(pairs.Count == 1 ? "the pair is" : "these pairs are")} taken as ideally coupled");
        }

        public Diagnostic ReportNotEvaluated(TextSpan span, string what) =>
            bag.Info("not-evaluated", span, $"{what} is read but not evaluated yet");
    }
}
