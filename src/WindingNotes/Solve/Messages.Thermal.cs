using WindingNotes.Text;
using WindingNotes.Model;

namespace WindingNotes.Solve;

// Messages of the load cycle and the thermal model. The limits and the bubble temperature are
// those of IEC 60076-7 (from memory, REFERENCES R48).
public static partial class SolveMessages
{
    extension(DiagnosticBag bag)
    {
        public Diagnostic ReportThermalWithoutCycle(TextSpan span) =>
            bag.Info("no-load-cycle", span, "thermal data is followed over a load cycle: give a 'load-cycle' line and its 'cycle-point' lines");

        public Diagnostic ReportCycleWithoutUnits(TextSpan span) =>
            bag.Error("no-thermal-data", span, "the load cycle has no unit to follow: give a 'thermal' line for a core");

        public Diagnostic ReportStepTooLong(TextSpan span, string core, double step, double most) =>
            bag.Error("step-too-long", span,
                $"a step of {Numbers.Format(step, "s")} is too long for the time constants of '{core}': the difference equations need a step of at most {Numbers.Format(most, "s")} (half the shortest time constant)");

        public Diagnostic ReportCyclePointUnsolved(TextSpan span, string problem) =>
            bag.Error("cycle-point-unsolved", span, $"the network could not be solved at this cycle point's load{(problem.Length == 0 ? "" : $": {problem}")}");

        public Diagnostic ReportThermalNoWindings(TextSpan span, string core) =>
            bag.Error("no-thermal-data", span, $"core '{core}' has no winding in the network to heat it");

        public Diagnostic ReportThermalNoRating(TextSpan span, string winding) =>
            bag.Error("no-thermal-data", span, $"the rated current of winding '{winding}' is unknown, so its load factor is: give it a rating or 'rated-current', or its core a rating");

        public Diagnostic ReportThermalNoLossRatio(TextSpan span, string core) =>
            bag.Error("no-thermal-data", span, $"the loss ratio of '{core}' is unknown: give 'loss-ratio', or the windings' resistances and a 'no-load' line for the core");

        public Diagnostic ReportHotSpotHigh(TextSpan span, string core, double peak, string at, string winding, double limit, string duty) =>
            bag.Warning("hot-spot-high", span,
                $"the hot-spot of '{core}' reaches {Numbers.Format(peak, "degC")} at {at} in winding '{winding}', above the {Numbers.Plain(limit)} degC limit of {duty} loading");

        public Diagnostic ReportTopOilHigh(TextSpan span, string core, double peak, string at, double limit, string duty) =>
            bag.Warning("top-oil-high", span,
                $"the top oil of '{core}' reaches {Numbers.Format(peak, "degC")} at {at}, above the {Numbers.Plain(limit)} degC limit of {duty} loading");

        public Diagnostic ReportCycleCurrentHigh(TextSpan span, string core, string winding, double load, string at, double limit, string duty, string unitClass) =>
            bag.Warning("cycle-current-high", span,
                $"winding '{winding}' of '{core}' carries {Numbers.Plain(load)} times its rated current from {at}, above the {Numbers.Plain(limit)} pu limit of {duty} loading for a {unitClass} transformer");

        public Diagnostic ReportHotSpotCaution(TextSpan span, string core, double peak, string at) =>
            bag.Info("caution-hot-spot", span,
                $"the hot-spot of '{core}' reaches {Numbers.Format(peak, "degC")} at {at}: above {Numbers.Plain(Solve.ThermalStudy.BubbleRisk)} degC gas bubbles may form in the insulation and lower its dielectric strength; such loading needs the maker's agreement and a unit in good condition");
    }

    // Messages of the thermal capability ('capability' lines).
    extension(DiagnosticBag bag)
    {
        public Diagnostic ReportCapability(CapabilityModel c, string value, bool beyond, string binding, string there) =>
            bag.Info("capability", c.Line, beyond
                ? $"'{c.Core}' stays within its limits up to {value}, the end of the search ({binding} {there} there)"
                : $"the largest {(c.Kind == CapabilityKind.ConstantLoad ? "load held all day" : "multiple of the load cycle")} within the limits of '{c.Core}' is {value}, where the {binding} reaches its limit ({there})");

        public Diagnostic ReportCapabilityUnknown(CapabilityModel c, string problem) =>
            bag.Warning("capability-unknown", c.Line, $"the capability of '{c.Core}' is unknown: {problem}");
    }
}
