using System.Globalization;
using System.Text;
using UnitsNet;
using WindingNotes.Model;
using WindingNotes.Tests.Support;
using Xunit;

namespace WindingNotes.Tests.Model;

public class UnitsTests
{
    /// <summary>
    /// UnitsNet's quantities the table is made of, in priority order (the first quantity and unit to
    /// claim an abbreviation keep it: 'A' is the ampere, not the ångström), each with its dimension and
    /// its value in SI units of a value in any of its units (typed, as UnitsNet converts a quantity).
    /// </summary>
    private static readonly Kind[] Kinds =
    [
        Kind.Of(ElectricPotential.Info, nameof(Dimension.Voltage), (v, u) => ElectricPotential.From(v, u).Volts),
        Kind.Of(ElectricCurrent.Info, nameof(Dimension.CurrentDim), (v, u) => ElectricCurrent.From(v, u).Amperes),
        Kind.Of(Power.Info, nameof(Dimension.ActivePower), (v, u) => (double)Power.From(v, u).Watts),
        Kind.Of(ElectricApparentPower.Info, nameof(Dimension.ApparentPower), (v, u) => ElectricApparentPower.From(v, u).Voltamperes),
        Kind.Of(ElectricReactivePower.Info, nameof(Dimension.ReactivePower), (v, u) => ElectricReactivePower.From(v, u).VoltamperesReactive),
        Kind.Of(ElectricResistance.Info, nameof(Dimension.Impedance), (v, u) => ElectricResistance.From(v, u).Ohms),
        Kind.Of(Frequency.Info, nameof(Dimension.Frequency), (v, u) => Frequency.From(v, u).Hertz),
        Kind.Of(MagneticField.Info, nameof(Dimension.FluxDensity), (v, u) => MagneticField.From(v, u).Teslas),
        Kind.Of(ElectricInductance.Info, nameof(Dimension.Inductance), (v, u) => ElectricInductance.From(v, u).Henries),
        Kind.Of(Area.Info, nameof(Dimension.Area), (v, u) => Area.From(v, u).SquareMeters),
        Kind.Of(Length.Info, nameof(Dimension.LengthDim), (v, u) => Length.From(v, u).Meters),
        Kind.Of(Temperature.Info, nameof(Dimension.TemperatureDim), (v, u) => Temperature.From(v, u).Kelvins),
        Kind.Of(Duration.Info, nameof(Dimension.TimeDim), (v, u) => Duration.From(v, u).Seconds),
        Kind.Of(Angle.Info, nameof(Dimension.AngleDim), (v, u) => Angle.From(v, u).Radians),
    ];

    private sealed record Kind(QuantityInfo Info, string Dimension, Func<double, Enum, double> ToSi)
    {
        public static Kind Of<TUnit>(QuantityInfo<TUnit> info, string dimension, Func<double, TUnit, double> toSi) where TUnit : struct, Enum =>
            new(info, dimension, (value, unit) => toSi(value, (TUnit)unit));
    }

    /// <summary>
    /// Every abbreviation of the table's quantities must be in it as UnitsNet's default abbreviation
    /// cache and its untyped conversion give them, the first quantity and unit to claim it winning,
    /// with the same factor and offset to the quantity's SI unit, bit for bit.
    /// </summary>
    [Fact]
    public void The_table_holds_what_UnitsNet_gives_for_its_quantities()
    {
        var cache = UnitsNetSetup.Default.UnitAbbreviations;
        // "h" is the hour here (times of day in load cycles), not UnitsNet's hand.
        var claimed = new HashSet<string>(StringComparer.Ordinal) { "ohm", "mohm", "kohm", "Mohm", "mm2", "cm2", "m2", "degC", "kcmil", "%", "pu", "turns", "turn", "h" };
        var compared = 0;
        foreach (var info in Kinds.Select(k => k.Info))
        {
            foreach (Enum unit in Enum.GetValues(info.UnitType))
            {
                // The table is in SI units; UnitsNet's base unit of angle is the degree.
                Enum si = info.UnitType == typeof(UnitsNet.Units.AngleUnit) ? UnitsNet.Units.AngleUnit.Radian : info.BaseUnitInfo.Value;
                var offset = UnitsNet.Quantity.From(0.0, unit).As(si);
                var factor = UnitsNet.Quantity.From(1.0, unit).As(si) - offset;
                foreach (var symbol in cache.GetUnitAbbreviations(info.UnitType, Convert.ToInt32(unit), CultureInfo.InvariantCulture))
                {
                    if (!claimed.Add(symbol)) continue;
                    var found = Units.Find(symbol);
                    Assert.True(found is not null, $"{symbol} ({info.Name}) is missing");
                    Assert.True(found.Factor == factor && found.Offset == offset, $"{symbol} ({info.Name}): {found.Factor} + {found.Offset}, UnitsNet {factor} + {offset}");
                    compared++;
                }
            }
        }
        Assert.True(compared > 200, $"only {compared} abbreviations compared");
        // Spot checks by hand: a kilovolt is 1,000 V, a degree Celsius is 1 K from 273.15 K.
        Assert.Equal(1000, Units.Find("kV")!.Factor);
        Assert.Equal(1.0, Units.Find("degC")!.Factor, 1e-12);
        Assert.Equal(273.15, Units.Find("degC")!.Offset);
    }

    /// <summary>
    /// <c>Model/UnitTable.cs</c> holds what the table takes from UnitsNet (every abbreviation of its 14
    /// quantities as UnitsNet's resources give it in the invariant culture, and each unit's factor and
    /// offset to SI as UnitsNet's typed conversion gives them), written as code so that the command
    /// carries none of UnitsNet: its ~130 quantities' types and tables were most of the native binary's
    /// data, which the runtime writes out at every start. Doubles are written round-trip ("R"), so the
    /// table is UnitsNet's bit for bit. UPDATE_EXPECTED=1 rewrites it after a UnitsNet update or a new
    /// quantity.
    /// </summary>
    [Fact]
    public void UnitTable_holds_what_UnitsNet_gives()
    {
        var cache = UnitAbbreviationsCache.CreateEmpty();
        var o = new StringBuilder();
        o.Append("// Generated by UnitsTests.UnitTable_holds_what_UnitsNet_gives from UnitsNet's abbreviations (invariant\n");
        o.Append("// culture) and typed conversions of the quantities the notation reads; UPDATE_EXPECTED=1 dotnet test rewrites it.\n");
        o.Append("namespace WindingNotes.Model;\n\n");
        o.Append("/// <summary>\n");
        o.Append("/// UnitsNet's units of the quantities the notation reads, by abbreviation, in priority order (the first to\n");
        o.Append("/// claim an abbreviation keeps it): factor and offset to SI. As code, the command carries none of UnitsNet.\n");
        o.Append("/// </summary>\n");
        o.Append("internal static class UnitTable\n{\n");
        o.Append("    public static readonly UnitInfo[] Units =\n    [\n");
        foreach (var (info, dimension, toSi) in Kinds)
        {
            o.Append("        // ").Append(info.Name).Append('\n');
            // In the order of the unit enumeration, so the first unit to claim a shared abbreviation keeps it.
            foreach (var unit in info.UnitInfos.OrderBy(u => Convert.ToInt32(u.Value)))
            {
                var offset = toSi(0, unit.Value);
                var factor = toSi(1, unit.Value) - offset;
                foreach (var symbol in cache.GetAbbreviations(unit, CultureInfo.InvariantCulture))
                {
                    o.Append("        new(\"").Append(symbol.Replace("\\", "\\\\").Replace("\"", "\\\"")).Append("\", ")
                        .Append(Literal(factor)).Append(", Dimension.").Append(dimension);
                    if (offset != 0) o.Append(", ").Append(Literal(offset));
                    o.Append("), // ").Append(unit.Name).Append('\n');
                }
            }
        }
        o.Append("    ];\n}\n");
        Snapshot.Match(o.ToString(), Path.Combine("..", "..", "src", "WindingNotes", "Model", "UnitTable.cs"));
    }

    private static string Literal(double value)
    {
        var text = value.ToString("R", CultureInfo.InvariantCulture);
        Assert.Equal(value, double.Parse(text, CultureInfo.InvariantCulture));
        return text + "d";
    }
}
