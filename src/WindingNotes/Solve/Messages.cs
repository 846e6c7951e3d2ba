using WindingNotes.Kernel;
using WindingNotes.Text;
using WindingNotes.Model;

namespace WindingNotes.Solve;

// Messages of the solver and the checks, as members of the diagnostic bag: each stage words its own.
public static partial class SolveMessages
{
    extension(DiagnosticBag bag)
    {
        public Diagnostic ReportSingular(IReadOnlyList<Element> elements)
        {
            var named = elements.Where(e => e.Kind != ElementKind.Node).DefaultIfEmpty(elements.FirstOrDefault()).ToList();
            var list = string.Join(", ", named.Take(6).Select(e => $"{e.Word} '{e.Name}'"));
            var d = bag.Error("singular", named[0].Span,
                $"the network has no unique solution: {list} (ideally coupled sections in a loop); give the windings resistance or leakage impedance, or remove the loop");
            return bag.Amend(d, x => x with { Related = [.. elements.Skip(1).Where(e => e.Span != named[0].Span).Select(e => new RelatedSpan($"{e.Word} '{e.Name}'", e.Span))] });
        }

        public Diagnostic ReportSupplyShortedThrough(Element supply, IReadOnlyList<Element> through)
        {
            var list = through.Count == 0 ? "" : $" through {string.Join(", ", through.Take(6).Select(e => $"{e.Word} '{e.Name}'"))}";
            var d = bag.Error("supply-shorted", supply.Span,
                $"supply '{supply.Name}' is shorted{list} with no impedance in the path: give the windings leakage impedance or resistance, or the supply an internal impedance");
            return bag.Amend(d, x => x with { Related = [.. through.Where(e => e.Span != supply.Span).Select(e => new RelatedSpan($"{e.Word} '{e.Name}'", e.Span))] });
        }

        public Diagnostic ReportIllConditioned(IReadOnlyList<Element> elements, double condition, double residual)
        {
            var named = elements.Where(e => e.Kind != ElementKind.Node).DefaultIfEmpty(elements.FirstOrDefault()).ToList();
            static string Rough(double x) => Numbers.Json(double.Parse(x.ToString("G2", System.Globalization.CultureInfo.InvariantCulture), System.Globalization.CultureInfo.InvariantCulture));
            var measure = double.IsFinite(condition) ? $"condition number {Rough(condition)}" : $"relative residual {Rough(residual)}";
            var figures = double.IsFinite(condition) ? $"about {Math.Max(0, (int)Math.Floor(16 - Math.Log10(condition)))} significant figures can be trusted" : "results may be inaccurate";
            var list = named.Count > 0 && named[0].Name is not null ? $" around {string.Join(", ", named.Take(6).Select(e => $"{e.Word} '{e.Name}'"))}" : "";
            var d = bag.Warning("ill-conditioned", named.Count > 0 ? named[0].Span : default,
                $"the network is ill-conditioned{list} ({measure}): {figures}; look for impedances that differ by many orders of magnitude");
            return bag.Amend(d, x => x with { Related = [.. named.Skip(1).Where(e => e.Span != named[0].Span).Select(e => new RelatedSpan($"{e.Word} '{e.Name}'", e.Span))] });
        }

        public Diagnostic ReportNoConvergence(IReadOnlyList<LoadModel> loads, int iterations)
        {
            var span = loads[0].NameSpan;
            var names = string.Join(", ", loads.Select(l => $"'{l.Name}'"));
            var d = bag.Error("no-convergence", span,
                $"the loads {names} did not converge in {iterations} iterations: the supply may be too weak for the demand");
            return bag.Amend(d, x => x with { Related = [.. loads.Skip(1).Select(l => new RelatedSpan($"load '{l.Name}'", l.NameSpan))] });
        }

        public Diagnostic ReportLoadWithoutVoltage(LoadModel load) =>
            bag.Warning("load-without-voltage", load.NameSpan, $"load '{load.Name}' has no voltage across it and draws nothing");

        public Diagnostic ReportCurrentDensityHigh(TextSpan span, string winding, double density, double low, double high, string where) =>
            bag.Warning("current-density-high", span,
                $"the current density in '{winding}' is {Numbers.Format(density / 1e6, "A/mm2")}{where}, above the {Numbers.Plain(low / 1e6)} to {Numbers.Plain(high / 1e6)} A/mm2 usual for naturally cooled copper windings");

        /// <summary>One message for every core without an open-circuit test, at the first of them (a file of many units names four).</summary>
        public Diagnostic ReportCoreLossUnknown(IReadOnlyList<CoreModel> cores)
        {
            var names = string.Join(", ", cores.Take(4).Select(c => $"'{c.Name}'")) + (cores.Count > 4 ? $" and {cores.Count - 4} more" : "");
            return bag.Amend(bag.Info("core-loss-unknown", cores[0].NameSpan,
                    $"{(cores.Count == 1 ? "core" : "cores")} {names} {(cores.Count == 1 ? "has" : "have")} no 'no-load' line: core loss is unknown, so the efficiency and the load of highest efficiency are not given"),
                d => d with { Related = [.. cores.Skip(1).Take(3).Select(c => new RelatedSpan($"core '{c.Name}'", c.NameSpan))] });
        }

        public Diagnostic ReportInternalError(TextSpan span, Exception e) =>
            bag.Error("internal-error", span, $"internal error, please report it: {e.GetType().Name}: {e.Message}");

        /// <summary>
        /// A check that failed: the worst value and where it was; over a sweep or a band, at how many of
        /// the points it failed, naming the first of them.
        /// </summary>
        public Diagnostic ReportCheckFailed(ExpectModel expect, double value, string where, IReadOnlyList<string> failing, int count, int points)
        {
            var at = where.Length == 0 ? "" : $" {where}";
            var over = points > 1 ? $"; fails at {count} of {points} points: {ListPoints(failing)}" : "";
            return bag.Error("expect-failed", expect.Line, $"{expect.MeasureText} is {Show(value, expect.Unit)}{at}: expected {expect.ConditionText}{over}");
        }

        /// <summary>"as written, BR=90 %, BR=100 %", the first six and an ellipsis.</summary>
        public static string ListPoints(IReadOnlyList<string> points) =>
            string.Join(", ", points.Take(6)) + (points.Count > 6 ? ", …" : "");

        /// <summary>" at BR=100 % (at 3 of 11 points)": where the worst value was, and how often, for rating messages.</summary>
        public static string PointsText(string where, int count, int points) =>
            (where.Length == 0 ? "" : $" {where}") + (points > 1 ? $" (over the rating at {count} of {points} points)" : "");

        public Diagnostic ReportCannotCheck(ExpectModel expect, string problem) =>
            bag.Error("expect-unknown", expect.Line, $"cannot check {expect.MeasureText}: {problem}");

        /// <summary>A measured value in the unit of its check; fractions as percent.</summary>
        public static string Show(double value, string unit) => unit switch
        {
            "%" => Numbers.Format(value * 100, "%"),
            ExpectModel.PositionUnit => value.ToString("+0;-0;0", System.Globalization.CultureInfo.InvariantCulture),
            _ => Numbers.Format(value, unit),
        };
    }

    // Messages of sweeps, tolerance bands and the points they solve.
    extension(DiagnosticBag bag)
    {
        private static string Thousands(double n) => n.ToString("#,0", System.Globalization.CultureInfo.InvariantCulture);

        public Diagnostic ReportSweepBudget(TextSpan span, double points, long budget) =>
            bag.Error("sweep-budget", span, $"the sweeps make {Thousands(points)} points, more than the budget of {Thousands(budget)}: use a larger step or fewer points");

        public Diagnostic ReportTimeLimit(TextSpan span, TimeSpan limit, long done, long total) =>
            bag.Error("time-limit", span,
                $"the evaluation reached its time limit of {Seconds(limit)} after {Thousands(done)} of {Thousands(total)} further solves: results, bands and checks cover only what was solved by then");

        public Diagnostic ReportTimeLimitWhile(TextSpan span, TimeSpan limit, string stage) =>
            bag.Error("time-limit", span, $"the evaluation reached its time limit of {Seconds(limit)} while {stage}: there are no results");

        private static string Seconds(TimeSpan t) => $"{Numbers.Plain(t.TotalSeconds)} s";

        /// <summary>A long sweep whose results are kept only at some of its points: which, and that the checks saw them all.</summary>
        public Diagnostic ReportSweepThinned(TextSpan span, long solved, long kept, long stride) =>
            bag.Info("sweep-thinned", span,
                $"{Thousands(solved)} sweep points solved: checks, ratings and cautions cover every one; the results of {Thousands(kept)} are kept, one point in every {Thousands(stride)} and the last");

        public Diagnostic ReportSweepDuplicate(TextSpan span, string name, TextSpan first) =>
            bag.Amend(bag.Error("sweep-duplicate", span, $"'{name}' is swept twice"), d => d with { Related = [new RelatedSpan("first swept here", first)] });

        public Diagnostic ReportSweepRange(TextSpan span, string problem) => bag.Error("sweep-range", span, problem);

        public Diagnostic ReportBandsNotSwept(TextSpan span, long points, int samples, long budget) =>
            bag.Info("bands-not-swept", span,
                $"tolerance bands are given for the normal and fault cases only: {Thousands(points)} sweep points with {Thousands(samples)} tolerance samples each would exceed the budget of {Thousands(budget)} solves");

        public Diagnostic ReportToleranceSamples(TextSpan span, int values, int samples, int seed) =>
            bag.Info("tolerance-samples", span,
                $"{values} toleranced values: bands from {Thousands(samples)} samples drawn uniformly within the tolerances (seed {seed}) instead of all {Thousands(Math.Pow(2, values))} corners");

        /// <summary>A message that only some sweep points or tolerance samples gave: the first, where it came from, and how many more.</summary>
        public Diagnostic ReportAtPoints(Diagnostic first, string where, int more)
        {
            var message = (where.Length == 0 ? first.Message : $"{where}: {first.Message}") + (more > 0 ? $" (and at {more} more points)" : "");
            var d = first with { Message = message };
            bag.Add(d);
            return d;
        }

        public Diagnostic ReportBrushOutsideRange(TextSpan span, string brush) =>
            bag.Warning("brush-outside-range", span, $"brush '{brush}' is set outside its range");

        public Diagnostic ReportSweepOutsideRange(TextSpan span, string brush) =>
            bag.Warning("sweep-outside-range", span, $"the sweep takes brush '{brush}' outside its range");
    }

    // Messages of the rating checks.
    extension(DiagnosticBag bag)
    {
        public Diagnostic ReportLoadingHigh(TextSpan span, string winding, double loading, string where) =>
            bag.Warning("loading-high", span, $"winding '{winding}' carries {Show(loading, "%")} of its rated current{where}");

        public Diagnostic ReportFluxHigh(TextSpan span, string core, double flux, double limit, string where) =>
            bag.Warning("flux-high", span, $"the peak flux density of core '{core}' is {Numbers.Format(flux, "T")}, above its flux-limit of {Numbers.Format(limit, "T")}{where}");

        public Diagnostic ReportOverexcited(TextSpan span, string core, double ratio, double limit, string condition, string where) =>
            bag.Warning("overexcited", span,
                $"core '{core}' runs at {Show(ratio, "%")} of its rated volts per hertz {condition}, above the {Show(limit, "%")} IEEE C57.12.00 allows{where}");

        public Diagnostic ReportBrushCurrentHigh(TextSpan span, string brush, double current, double limit, string where) =>
            bag.Warning("brush-current-high", span, $"brush '{brush}' carries {Numbers.Format(current, "A")}, above its current-limit of {Numbers.Format(limit, "A")}{where}");

        public Diagnostic ReportConnectionRating(TextSpan span, string cores, double needed, double rating, string detail, string where) =>
            bag.Warning("connection-rating", span,
                $"the autotransformer connection needs a two-winding rating of {Numbers.Format(needed, "VA")} ({detail}) but core '{cores}' is rated {Numbers.Format(rating, "VA")}{where}");
    }

    // Cautions: information where a result bears on safety. Users read facts here; where each comes
    // from stays in these comments and in the tests (REFERENCES.md): no isolation and the open common
    // winding (published encyclopedic articles); the common terminal to the grounded conductor with no
    // overcurrent device in the common winding (NEC 210.9, 215.11, 450.4, from memory for edition
    // details); fusing a variable autotransformer's output and rating what an output above the supply
    // feeds (common practice, no source); the fault duty's 2 s (IEC 60076-5 thermal ability, from memory).
    // The current-density band is common practice; the over-excitation limits are IEEE C57.12.00 (from memory).
    extension(DiagnosticBag bag)
    {
        public Diagnostic ReportNoIsolation(TextSpan span, string load, string supply) =>
            bag.Info("caution-no-isolation", span,
                $"load '{load}' is connected to supply '{supply}' through the windings: an autotransformer connection gives no galvanic isolation, a fault can put the full input voltage on the output, and an open common winding leaves the series winding in the line");

        public Diagnostic ReportCommonTerminal(TextSpan span, string node, bool grounded) =>
            bag.Info("caution-common-terminal", span, grounded
                ? $"the common terminal '{node}' goes to the grounded conductor, and no overcurrent device goes in the common winding"
                : $"the common terminal '{node}' is not grounded: it goes to the grounded conductor, and no overcurrent device goes in the common winding");

        public Diagnostic ReportFuseOutput(TextSpan span, string brush) =>
            bag.Info("caution-fuse-output", span,
                $"fuse the output of the variable autotransformer at brush '{brush}': at a low setting the output current is far above the input current, so a fuse on the supply side does not protect the brush and winding");

        /// <param name="source">"of supply 'mains'", or "between L1 and L2" where the output spans points of two supplies.</param>
        public Diagnostic ReportAboveSupply(TextSpan span, string load, double voltage, string source, double supplyVoltage, string where) =>
            bag.Info("caution-above-supply", span,
                $"the output at load '{load}' reaches {Numbers.Format(voltage, "V")}{(where.Length == 0 ? "" : $" {where}")}, above the {Numbers.Format(supplyVoltage, "V")} {source}: the connection raises the output above the supply, and what it feeds must be rated for that");

        public Diagnostic ReportFaultDuty(TextSpan span, string fault, double current, double peak, double? multiple, string? winding) =>
            bag.Info("caution-fault-duty", span,
                $"fault '{fault}' drives {Numbers.Format(current, "A")} (asymmetrical peak {Numbers.Format(peak, "A")}){(multiple is { } m && winding is not null ? $", {Numbers.Plain(m)} times the rated current of '{winding}'" : "")}: the windings must carry it for {Numbers.Plain(Solve.Faults.ThermalDuration)} s (IEC 60076-5, thermal ability to withstand short circuit) and the protection must clear it");
    }
}
