using WindingNotes.Text;
using WindingNotes.Model;

namespace WindingNotes.Solve;

// Messages of settling tap changers and of 'find'.
public static partial class SolveMessages
{
    extension(DiagnosticBag bag)
    {
        private static string Volts(double v) => Numbers.Format(v, "V");

        private static string Signed(int position) => position > 0 ? $"+{position}" : $"{position}";

        public Diagnostic ReportTapLimit(TapChangerModel t, int position, double relay, TapControlModel k) =>
            bag.Warning("tap-limit", t.NameSpan, position == t.High
                ? $"{t.Name} cannot reach its band: at its highest position {Signed(position)} the relay sees {Volts(relay)}, below the band {Volts(k.BandLow)} to {Volts(k.BandHigh)}"
                : $"{t.Name} cannot reach its band: at its lowest position {Signed(position)} the relay sees {Volts(relay)}, above the band {Volts(k.BandLow)} to {Volts(k.BandHigh)}");

        public Diagnostic ReportTapBackwards(TapChangerModel t, int from, int to, double before, double after, TapControlModel k) =>
            bag.Warning("tap-control-backwards", t.NameSpan,
                $"{t.Name}'s control is wired backwards: stepping toward its band {Volts(k.BandLow)} to {Volts(k.BandHigh)}, from {Signed(from)} to {Signed(to)}, moved its relay away from it ({Volts(before)} to {Volts(after)}), so it runs to a limit; check the voltage it regulates, the connection of its windings and the sense of its step");

        /// <summary>detail: <see cref="RegulatorLimitText"/>.</summary>
        public Diagnostic ReportRegulatorCurrentHigh(TextSpan span, string changer, double current, double rating, string detail, string where) =>
            bag.Warning("regulator-current-high", span, $"{changer}'s series winding {detail} carries {Numbers.Format(current, "A")}, above its current rating of {Numbers.Format(rating, "A")}{where}");

        /// <summary>"SER, at a range of regulation of ±10.00 % (100.0 % of rated current),".</summary>
        public static string RegulatorLimitText(Solve.RegulatorRating r) =>
            $"{r.Series}, at a range of regulation of ±{Numbers.Format(r.Range * 100, "%")} ({Numbers.Format(r.Multiplier * 100, "%")} of rated current),";

        public Diagnostic ReportTapHunting(TapChangerModel t, int from, int to, double relayFrom, double? relayTo, TapControlModel k, string where) =>
            bag.Warning("tap-hunting", t.NameSpan, relayTo is { } v
                ? $"{t.Name} hunts between positions {Signed(from)} and {Signed(to)}: one step moves its relay {Volts(Math.Abs(v - relayFrom))}, more than its bandwidth {Volts(k.Bandwidth)}; widen the bandwidth beyond one step (kept at {Signed(from)})"
                : $"{t.Name} does not settle: the tap changers keep moving each other (kept at {Signed(from)})");

        public Diagnostic ReportFound(FindModel f, string value, int unsolved) =>
            bag.Info("found", f.Line, $"{f.Let} = {value} gives {f.Measure.MeasureText} = {Target(f)}; every result is at this value"
                + (unsolved > 0 ? $" ({unsolved} of {Solve.SolveFor.Intervals + 1} points of the search were not solved)" : ""));

        public Diagnostic ReportFindSeveral(FindModel f, IReadOnlyList<string> values) =>
            bag.Error("find-several", f.Line, $"several values of {f.Let} give {f.Measure.MeasureText} = {Target(f)}: {string.Join(", ", values)}; narrow the range to one of them");

        public Diagnostic ReportFindNone(FindModel f, double lowest, double highest, IReadOnlyList<string> jumps, int unsolved) =>
            bag.Error("find-none", f.Line, $"no value of {f.Let} in the range gives {f.Measure.MeasureText} = {Target(f)}: "
                + (jumps.Count > 0 ? $"it jumps across the target near {string.Join(", ", jumps)} without taking it" : $"it runs from {Measured(f, lowest)} to {Measured(f, highest)} there")
                + (unsolved > 0 ? $" ({unsolved} of {Solve.SolveFor.Intervals + 1} points not solved)" : ""));

        public Diagnostic ReportFindUnsolved(FindModel f) =>
            bag.Error("find-none", f.Line, $"the network could not be solved at any value of {f.Let} in the range");

        public Diagnostic ReportFindSwept(TextSpan span, string let) =>
            bag.Error("find-swept", span, $"'{let}' is set by a 'find' or a tap changer, so it cannot be swept as well");

        private static string Target(FindModel f) => Measured(f, f.Target);

        private static string Measured(FindModel f, double v) => Show(v, f.Measure.Unit);
    }
}
