using System.Collections.Frozen;
using System.Globalization;
using UnitsNet;
using UnitsNet.Units;

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
    // Quantity types in priority order, each with its dimension and SI unit.
    private static readonly (Type UnitType, Enum SiUnit, Dimension Dimension)[] Kinds =
    [
        (typeof(ElectricPotentialUnit), ElectricPotentialUnit.Volt, Dimension.Voltage),
        (typeof(ElectricCurrentUnit), ElectricCurrentUnit.Ampere, Dimension.CurrentDim),
        (typeof(PowerUnit), PowerUnit.Watt, Dimension.ActivePower),
        (typeof(ApparentPowerUnit), ApparentPowerUnit.Voltampere, Dimension.ApparentPower),
        (typeof(ReactivePowerUnit), ReactivePowerUnit.VoltampereReactive, Dimension.ReactivePower),
        (typeof(ElectricResistanceUnit), ElectricResistanceUnit.Ohm, Dimension.Impedance),
        (typeof(FrequencyUnit), FrequencyUnit.Hertz, Dimension.Frequency),
        (typeof(MagneticFieldUnit), MagneticFieldUnit.Tesla, Dimension.FluxDensity),
        (typeof(ElectricInductanceUnit), ElectricInductanceUnit.Henry, Dimension.Inductance),
        (typeof(AreaUnit), AreaUnit.SquareMeter, Dimension.Area),
        (typeof(LengthUnit), LengthUnit.Meter, Dimension.LengthDim),
        (typeof(TemperatureUnit), TemperatureUnit.Kelvin, Dimension.TemperatureDim),
        (typeof(DurationUnit), DurationUnit.Second, Dimension.TimeDim),
        (typeof(AngleUnit), AngleUnit.Radian, Dimension.AngleDim),
    ];

    private static readonly FrozenDictionary<string, UnitInfo> BySymbol = Build();

    /// <summary>The symbols suggested in completion and "did you mean" hints: the ones the notation names.</summary>
    public static readonly string[] Common =
    [
        "V", "kV", "mV", "A", "kA", "mA", "W", "kW", "MW", "VA", "kVA", "MVA", "var", "kvar", "Mvar", "ohm", "mohm", "kohm",
        "Hz", "T", "mT", "m", "cm", "mm", "mm2", "cm2", "m2", "kcmil", "degC", "K", "H", "mH", "s", "ms", "%", "pu", "deg", "rad", "turns",
    ];

    public static UnitInfo? Find(string symbol) => BySymbol.GetValueOrDefault(symbol);

    public static string? Suggest(string symbol) => Text.Spelling.Nearest(symbol, Common);

    private static FrozenDictionary<string, UnitInfo> Build()
    {
        var table = new Dictionary<string, UnitInfo>(StringComparer.Ordinal);
        var abbreviations = UnitsNetSetup.Default.UnitAbbreviations;
        foreach (var (unitType, siUnit, dimension) in Kinds)
        {
            foreach (Enum unit in Enum.GetValues(unitType))
            {
                if (!UnitsNet.Quantity.TryFrom(1.0, unit, out var one)) continue;
                var factor = one.As(siUnit);
                var offset = unitType == typeof(TemperatureUnit) ? UnitsNet.Quantity.From(0.0, unit).As(siUnit) : 0;
                if (offset != 0) factor -= offset;
                foreach (var symbol in abbreviations.GetUnitAbbreviations(unitType, Convert.ToInt32(unit), CultureInfo.InvariantCulture))
                    table.TryAdd(symbol, new UnitInfo(symbol, factor, dimension, offset));
            }
        }
        void Alias(string symbol, string existing) => table[symbol] = table[existing] with { Symbol = symbol };
        Alias("ohm", "Ω"); Alias("mohm", "mΩ"); Alias("kohm", "kΩ"); Alias("Mohm", "MΩ");
        Alias("mm2", "mm²"); Alias("cm2", "cm²"); Alias("m2", "m²");
        Alias("degC", "°C");
        // 1 kcmil = 1000 circular mils; a circular mil is the area of a circle 1 mil (25.4 µm) across.
        table["kcmil"] = new UnitInfo("kcmil", 1000 * Math.PI / 4 * 25.4e-6 * 25.4e-6, Dimension.Area);
        table["%"] = new UnitInfo("%", 0.01, Dimension.None, Flags: QuantityFlags.Percent);
        table["pu"] = new UnitInfo("pu", 1, Dimension.None, Flags: QuantityFlags.Percent);
        table["turns"] = new UnitInfo("turns", 1, Dimension.None, Flags: QuantityFlags.Turns);
        table["turn"] = table["turns"] with { Symbol = "turn" };
        return table.ToFrozenDictionary(StringComparer.Ordinal);
    }
}
