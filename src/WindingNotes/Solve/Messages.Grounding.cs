using WindingNotes.Text;

namespace WindingNotes.Solve;

// Messages about neutral-grounding impedances in bus faults.
public static partial class SolveMessages
{
    extension(DiagnosticBag bag)
    {
        public Diagnostic ReportGroundingDuty(ShortCircuitResult sc, GroundingDuty g) =>
            bag.Warning("fault-duty-high", g.Grounding.Line,
                $"in bus fault '{sc.Fault.Name}' ({sc.Extreme}): the grounding impedance at '{g.Grounding.Node.Name}' carries {Numbers.Format(g.Current.Magnitude, "A")} for {Numbers.Plain(g.Duration)} s, "
                + (g.CurrentExceeded
                    ? $"above its rated {Numbers.Format(g.Grounding.RatedCurrent!.Value, "A")}"
                    : $"I²t {Numbers.Plain(g.I2t)} A²s, above the {Numbers.Plain(g.RatedI2t!.Value)} A²s of its rated {Numbers.Format(g.Grounding.RatedCurrent!.Value, "A")} for {Numbers.Plain(g.Grounding.TimeRating!.Value)} s")
                + ": it may overheat before the protection clears the fault");
    }
}
