using System.Globalization;
using WindingNotes.Model;
using Xunit;

namespace WindingNotes.Tests.Model;

public class UnitsTests
{
    /// <summary>
    /// The table is built from the 14 quantities alone (start-up reads no other); it must hold what
    /// UnitsNet's default abbreviation cache and its untyped conversion give for them: every
    /// abbreviation, the first quantity and unit to claim it winning, with the same factor and offset
    /// to the quantity's base unit, bit for bit.
    /// </summary>
    [Fact]
    public void The_table_holds_what_UnitsNet_gives_for_its_quantities()
    {
        var cache = UnitsNet.UnitsNetSetup.Default.UnitAbbreviations;
        // "h" is the hour here (times of day in load cycles), not UnitsNet's hand.
        var claimed = new HashSet<string>(StringComparer.Ordinal) { "ohm", "mohm", "kohm", "Mohm", "mm2", "cm2", "m2", "degC", "kcmil", "%", "pu", "turns", "turn", "h" };
        var compared = 0;
        foreach (var info in Units.Quantities)
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
}
