
namespace WindingNotes.Model;

/// <summary>A unit: its factor to SI (and offset, for degrees Celsius) and its dimension.</summary>
public sealed record UnitInfo(string Symbol, double Factor, Dimension Dimension, double Offset = 0, QuantityFlags Flags = QuantityFlags.None);

/// <summary>
/// The units the notation accepts. Abbreviations and factors are UnitsNet's, as <see cref="UnitTable"/>
/// holds them (written from UnitsNet by a test, which the command does not carry); the ones it lacks
/// (ohm, mm2, degC, kcmil, pu, turns) are added here. UnitsNet reads some abbreviations as several
/// quantities ('A' is also the ångström, 'm' also the minute); the electrical reading wins.
/// </summary>
public static class Units
{
    private static readonly Dictionary<string, UnitInfo> BySymbol = Build();

    /// <summary>The symbols suggested in completion and "did you mean" hints: the ones the notation names.</summary>
    public static readonly string[] Common =
    [
        "V", "kV", "mV", "A", "kA", "mA", "W", "kW", "MW", "VA", "kVA", "MVA", "var", "kvar", "Mvar", "ohm", "mohm", "kohm",
        "Hz", "T", "mT", "m", "cm", "mm", "mm2", "cm2", "m2", "kcmil", "degC", "K", "H", "mH", "s", "ms", "min", "h", "%", "pu", "deg", "rad", "turns",
    ];

    public static UnitInfo? Find(string symbol) => BySymbol.GetValueOrDefault(symbol);

    public static string? Suggest(string symbol) => Text.Spelling.Nearest(symbol, Common);

    private static Dictionary<string, UnitInfo> Build()
    {
        var table = new Dictionary<string, UnitInfo>(StringComparer.Ordinal);
        // UnitTable is in priority order: the first unit to claim a shared abbreviation keeps it.
        foreach (var unit in UnitTable.Units) table.TryAdd(unit.Symbol, unit);
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
        return table; // not frozen: Grammar.ByKeyword says why
    }
}
