using WindingNotes.Text;
namespace WindingNotes.Model;

// Messages of binding tap changers and 'find'.
public static partial class ModelMessages
{
    extension(DiagnosticBag bag)
    {
        public Diagnostic ReportTapControlIncomplete(TextSpan span, string name, string missing) =>
            bag.Error("tap-control", span, $"the control of {name} needs {missing}");

        public Diagnostic ReportTapControlOffCircuit(TextSpan span, string name) =>
            bag.Error("tap-control", span, $"{name} is off-circuit: its position is stated with 'at', never chosen by a control");

        public Diagnostic ReportTapFollower(TextSpan span, string name, string master) =>
            bag.Error("tap-control", span, name == master
                ? $"{name} cannot follow itself: name the tap changer of the paralleled unit it follows"
                : $"{name} follows {master}, so it takes {master}'s position and has no control of its own: leave out 'regulate' or 'follows'");

        public Diagnostic ReportFindMeasure(TextSpan span) =>
            bag.Error("find-measure", span, "'find' solves for a number: measure a voltage, current, loading, flux, power, efficiency or regulation");

        public Diagnostic ReportPositionCondition(TextSpan span) =>
            bag.Error("position-condition", span, "a position is checked with bare whole numbers ('between -10 and 10', 'below 12', 'above -12', 'near 0 within 4') or 'clear-of-limits', and 'clear-of-limits' checks only a position");
    }
}
