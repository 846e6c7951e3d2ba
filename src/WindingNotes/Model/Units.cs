using System.Collections.Frozen;
using System.Globalization;
using UnitsNet;

namespace WindingNotes.Model;

/// <summary>A unit: its factor to SI (and offset, for degrees Celsius) and its dimension.</summary>
public sealed record UnitInfo(string Symbol, double Factor, Dimension Dimension, double Offset = 0, QuantityFlags Flags = QuantityFlags.None);

/// <summary>
/// The units the notation accepts. Abbreviations and factors come from UnitsNet; the ones it lacks
/// (ohm, mm2, degC, kcmil, pu, turns) are added here. UnitsNet reads some abbreviations as several
/// quantities ('A' is also the ångström, 'm' also the minute); the electrical reading wins.
/// </summary>
public static class Units
{
    // Quantities in priority order, each with its dimension and its value in SI units of a value in
    // any of its units. Typed, so that building the table touches these 14 quantities only: UnitsNet's
    // untyped conversion (Quantity.From) and its default abbreviation cache take in all of its ~130
    // quantities, which cost the command a tenth of a second at every start.
    private static readonly Kind[] Kinds =
    [
        Kind.Of(ElectricPotential.Info, Dimension.Voltage, (v, u) => ElectricPotential.From(v, u).Volts),
        Kind.Of(ElectricCurrent.Info, Dimension.CurrentDim, (v, u) => ElectricCurrent.From(v, u).Amperes),
        Kind.Of(Power.Info, Dimension.ActivePower, (v, u) => (double)Power.From(v, u).Watts),
        Kind.Of(ElectricApparentPower.Info, Dimension.ApparentPower, (v, u) => ElectricApparentPower.From(v, u).Voltamperes),
        Kind.Of(ElectricReactivePower.Info, Dimension.ReactivePower, (v, u) => ElectricReactivePower.From(v, u).VoltamperesReactive),
        Kind.Of(ElectricResistance.Info, Dimension.Impedance, (v, u) => ElectricResistance.From(v, u).Ohms),
        Kind.Of(Frequency.Info, Dimension.Frequency, (v, u) => Frequency.From(v, u).Hertz),
        Kind.Of(MagneticField.Info, Dimension.FluxDensity, (v, u) => MagneticField.From(v, u).Teslas),
        Kind.Of(ElectricInductance.Info, Dimension.Inductance, (v, u) => ElectricInductance.From(v, u).Henries),
        Kind.Of(Area.Info, Dimension.Area, (v, u) => Area.From(v, u).SquareMeters),
        Kind.Of(Length.Info, Dimension.LengthDim, (v, u) => Length.From(v, u).Meters),
        Kind.Of(Temperature.Info, Dimension.TemperatureDim, (v, u) => Temperature.From(v, u).Kelvins),
        Kind.Of(Duration.Info, Dimension.TimeDim, (v, u) => Duration.From(v, u).Seconds),
        Kind.Of(Angle.Info, Dimension.AngleDim, (v, u) => Angle.From(v, u).Radians),
    ];

    private sealed record Kind(QuantityInfo Info, Dimension Dimension, Func<double, Enum, double> ToSi)
    {
        public static Kind Of<TUnit>(QuantityInfo<TUnit> info, Dimension dimension, Func<double, TUnit, double> toSi) where TUnit : struct, Enum =>
            new(info, dimension, (value, unit) => toSi(value, (TUnit)unit));
    }

    private static readonly FrozenDictionary<string, UnitInfo> BySymbol = Build();

    /// <summary>The symbols suggested in completion and "did you mean" hints: the ones the notation names.</summary>
    public static readonly string[] Common =
    [
        "V", "kV", "mV", "A", "kA", "mA", "W", "kW", "MW", "VA", "kVA", "MVA", "var", "kvar", "Mvar", "ohm", "mohm", "kohm",
        "Hz", "T", "mT", "m", "cm", "mm", "mm2", "cm2", "m2", "kcmil", "degC", "K", "H", "mH", "s", "ms", "min", "h", "%", "pu", "deg", "rad", "turns",
    ];

    public static UnitInfo? Find(string symbol) => BySymbol.GetValueOrDefault(symbol);

    /// <summary>UnitsNet's quantities the table reads, in priority order.</summary>
    internal static IEnumerable<QuantityInfo> Quantities => Kinds.Select(k => k.Info);

    public static string? Suggest(string symbol) => Text.Spelling.Nearest(symbol, Common);

    private static FrozenDictionary<string, UnitInfo> Build()
    {
        var table = new Dictionary<string, UnitInfo>(StringComparer.Ordinal);
        // UnitsNet's abbreviations as UnitSymbols holds them; only a unit it lacks is read from UnitsNet's
        // resources (an empty cache loads a unit's when asked), which costs the command ~10 ms.
        UnitAbbreviationsCache? abbreviations = null;
        foreach (var (info, dimension, toSi) in Kinds)
        {
            // In the order of the unit enumeration, so the first unit to claim a shared abbreviation keeps it.
            foreach (var unit in info.UnitInfos.OrderBy(u => Convert.ToInt32(u.Value)))
            {
                var offset = toSi(0, unit.Value);
                var factor = toSi(1, unit.Value) - offset;
                var symbols = UnitSymbols.Of(info.Name, unit.Name)
                    ?? (abbreviations ??= UnitAbbreviationsCache.CreateEmpty()).GetAbbreviations(unit, CultureInfo.InvariantCulture);
                foreach (var symbol in symbols)
                    table.TryAdd(symbol, new UnitInfo(symbol, factor, dimension, offset));
            }
        }
        void Alias(string symbol, string existing) => table[symbol] = table[existing] with { Symbol = symbol };
        Alias("ohm", "Ω"); Alias("mohm", "mΩ"); Alias("kohm", "kΩ"); Alias("Mohm", "MΩ");
        Alias("mm2", "mm²"); Alias("cm2", "cm²"); Alias("m2", "m²");
        Alias("degC", "°C");
        // 1 kcmil = 1000 circular mils; a circular mil is the area of a circle 1 mil (25.4 µm) across.
        table["kcmil"] = new UnitInfo("kcmil", 1000 * Math.PI / 4 * 25.4e-6 * 25.4e-6, Dimension.Area);
        // An hour, not a hand (a length UnitsNet also writes h): times of day and time constants are in h and min.
        table["h"] = new UnitInfo("h", 3600, Dimension.TimeDim);
        table["%"] = new UnitInfo("%", 0.01, Dimension.None, Flags: QuantityFlags.Percent);
        table["pu"] = new UnitInfo("pu", 1, Dimension.None, Flags: QuantityFlags.Percent);
        table["turns"] = new UnitInfo("turns", 1, Dimension.None, Flags: QuantityFlags.Turns);
        table["turn"] = table["turns"] with { Symbol = "turn" };
        return table.ToFrozenDictionary(StringComparer.Ordinal);
    }
}
