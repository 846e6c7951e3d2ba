using WindingNotes.Model;
using WindingNotes.Text;

namespace WindingNotes.Solve;

/// <summary>
/// Current density in windings whose conductor is given, against the band usual for naturally cooled
/// copper windings: 1.5 to 3.4 A/mm² (common practice, no source). Above it a winding runs hot; below
/// it is only generous, so that side is not warned. No band is given for aluminium.
/// </summary>
public static class CurrentDensity
{
    public const double CopperLow = 1.5e6;

    public const double CopperHigh = 3.4e6;

    /// <summary>Each copper winding above the band, at its conductor, with the highest density among its sections.</summary>
    public static IEnumerable<(TextSpan Span, string Winding, double Density)> AboveBand(CaseResult result)
    {
        foreach (var winding in result.Sections.GroupBy(s => s.Winding.Index))
        {
            var w = winding.First().Winding.Source;
            if (w.Conductor is not { Material: ConductorMaterial.Copper } conductor) continue;
            var highest = winding.Max(s => s.CurrentDensity ?? 0);
            if (highest > CopperHigh) yield return (conductor.Span, w.Name, highest);
        }
    }
}
