using WindingNotes.Text;
using WindingNotes.Model;

namespace WindingNotes.Solve;

// Messages of bus-fault studies. The limits come from IEC 60076-5 (the windings' average temperature
// after the fault, 250 °C copper and 200 °C aluminium) and IEEE C57.12.00 / C57.109 (through-fault
// categories), all from memory; the wording states the facts only.
public static partial class SolveMessages
{
    extension(DiagnosticBag bag)
    {
        public Diagnostic ReportBusFaultNoEarth(BusFaultModel fault) =>
            bag.Error("bus-fault-no-earth", fault.NameSpan, $"bus fault '{fault.Name}' goes to earth, but nothing in the network is grounded: add a 'ground' line");

        public Diagnostic ReportBusFaultLines(BusFaultModel fault) =>
            bag.Error("bus-fault-lines", fault.NameSpan, $"bus fault '{fault.Name}' needs three line terminals that are three nodes, none of them earth: '{fault.Lines[0].Name}', '{fault.Lines[1].Name}' and '{fault.Lines[2].Name}' are not");

        public Diagnostic ReportBusFaultDead(BusFaultModel fault) =>
            bag.Warning("bus-fault-dead", fault.NameSpan, $"bus fault '{fault.Name}': the bus has no voltage before the fault, so it is not studied");

        public Diagnostic ReportBusFaultDuty(ShortCircuitResult sc, WindingDuty? worst) =>
            bag.Info("caution-fault-duty", sc.Fault.NameSpan,
                $"bus fault '{sc.Fault.Name}' ({sc.Extreme}) drives {Numbers.Format(sc.Initial, "A")}, peak {Numbers.Format(sc.Peak, "A")}"
                + (worst?.Multiple is { } m ? $", {Numbers.Plain(m)} times the rated current of '{worst.Winding.Name}'" : "")
                + $": the windings must carry it for {Numbers.Plain(sc.Study.Duration)} s and the protection must clear it");

        public Diagnostic ReportWindingHotAfterFault(ShortCircuitResult sc, WindingDuty d) =>
            bag.Warning("fault-duty-high", d.Winding.Source.NameSpan,
                $"in bus fault '{sc.Fault.Name}' ({sc.Extreme}): winding '{d.Winding.Name}' at {Numbers.Format(d.CurrentDensity!.Value / 1e6, "A/mm2")} for {Numbers.Plain(sc.Study.Duration)} s "
                + (double.IsFinite(d.Temperature!.Value) ? $"reaches an average of {Numbers.Format(d.Temperature.Value - 273.15, "degC")}" : "has no finite end temperature")
                + $", above the {Numbers.Format(d.TemperatureLimit!.Value - 273.15, "degC")} allowed for {(d.Material == ConductorMaterial.Copper ? "copper" : "aluminium")} (IEC 60076-5)");

        public Diagnostic ReportPeakAboveWithstand(ShortCircuitResult sc, WindingDuty d) =>
            bag.Warning("fault-duty-high", d.Winding.Source.NameSpan,
                $"fault duty: in bus fault '{sc.Fault.Name}' ({sc.Extreme}) winding '{d.Winding.Name}' must withstand a peak of {Numbers.Format(d.Peak, "A")} "
                + $"(k·√2 {Numbers.Fixed(d.AsymmetryFactor)} times {Numbers.Format(d.Current, "A")}), above its peak withstand of {Numbers.Format(d.PeakWithstand!.Value, "A")}: "
                + "the short-circuit forces may deform or displace it (IEC 60076-5 dynamic ability)");

        public Diagnostic ReportFrequentFaultCurve(ShortCircuitResult sc, WindingDuty d) =>
            bag.Warning("fault-duty-high", d.Winding.Source.NameSpan,
                $"in bus fault '{sc.Fault.Name}' ({sc.Extreme}): winding '{d.Winding.Name}' carries {Numbers.Plain(d.Multiple!.Value)} times its rated current for {Numbers.Plain(sc.Study.Duration)} s; "
                + $"where faults are frequent, a category {d.Category} unit is allowed {Numbers.Plain(d.FrequentSeconds!.Value)} s at that current (IEEE C57.109 frequent-fault curve)");

        public Diagnostic ReportThroughFaultCategory(ShortCircuitResult sc, WindingDuty d) =>
            bag.Warning("fault-duty-high", d.Winding.Source.NameSpan,
                $"in bus fault '{sc.Fault.Name}' ({sc.Extreme}): winding '{d.Winding.Name}' carries {Numbers.Plain(d.Multiple!.Value)} times its rated current for {Numbers.Plain(sc.Study.Duration)} s; a category {d.Category} unit "
                + (d.MaxMultiple is { } max && d.Multiple > max ? $"is built for {Numbers.Plain(max)} times" : $"is allowed {Numbers.Plain(d.AllowedSeconds!.Value)} s at that current")
                + " (IEEE C57.12.00 through-fault duty)");
    }
}
