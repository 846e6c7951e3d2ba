using System.Collections.Immutable;
using WindingNotes.Model;
using WindingNotes.Text;

namespace WindingNotes.Solve;

/// <summary>An evaluated expectation: the value it measured, and whether it held.</summary>
public sealed record CheckResult(ExpectModel Expect, bool Passed, double? Value);

/// <summary>Evaluates each <c>expect</c> line on a case and reports the ones that fail.</summary>
public static class Checks
{
    public static ImmutableArray<CheckResult> Evaluate(Model.Model model, CaseResult result, DiagnosticBag diagnostics)
    {
        var checks = ImmutableArray.CreateBuilder<CheckResult>();
        foreach (var expect in model.Expects)
        {
            var value = Measure(expect, result, out var problem);
            if (value is not { } v)
            {
                diagnostics.ReportCannotCheck(expect, problem!);
                checks.Add(new CheckResult(expect, false, null));
                continue;
            }
            // Bounds written with four figures hold for values that round to them.
            var slack = 1e-9 * Math.Max(Math.Abs(expect.Low), Math.Abs(expect.High)) is var s && double.IsFinite(s) ? s : 1e-9 * Math.Abs(v);
            var passed = v >= expect.Low - slack && v <= expect.High + slack;
            if (!passed) diagnostics.ReportCheckFailed(expect, v);
            checks.Add(new CheckResult(expect, passed, v));
        }
        return checks.ToImmutable();
    }

    /// <summary>The measured value in SI or as a fraction; null with the reason when it cannot be measured.</summary>
    public static double? Measure(ExpectModel expect, CaseResult result, out string? problem)
    {
        problem = null;
        var t = expect.Targets;
        switch (expect.Measure)
        {
            case MeasureKind.Voltage:
                return (result.PointVoltage(t[0].Name) - result.PointVoltage(t[1].Name)).Magnitude;
            case MeasureKind.Current or MeasureKind.Loading:
                var terminal = result.Supplies.FirstOrDefault(s => s.Supply.Name == t[0].Name)?.Current
                    ?? result.Loads.FirstOrDefault(l => l.Load.Name == t[0].Name)?.Current;
                if (terminal is { } current)
                {
                    if (expect.Measure == MeasureKind.Current) return current.Magnitude;
                    problem = "loading is measured on windings and sections";
                    return null;
                }
                var sections = result.Sections.Where(s => s.Winding.Name == t[0].Name).ToList();
                if (t.Length == 3)
                {
                    var names = new HashSet<string> { t[1].Name, t[2].Name };
                    sections = sections.Where(s => names.SetEquals([s.Section.FromPoint, s.Section.ToPoint])).ToList();
                    if (sections.Count == 0)
                    {
                        problem = $"no section of '{t[0].Name}' runs from '{t[1].Name}' to '{t[2].Name}'";
                        return null;
                    }
                }
                else if (sections.Count > 1 && expect.Measure == MeasureKind.Current)
                {
                    problem = $"'{t[0].Name}' has {sections.Count} sections; name one by its two points";
                    return null;
                }
                if (sections.Count == 0)
                {
                    problem = $"'{t[0].Name}' was left out of the network";
                    return null;
                }
                if (expect.Measure == MeasureKind.Current) return sections[0].Current.Magnitude;
                if (sections.Any(s => s.Loading is null))
                {
                    problem = $"the rated current of '{t[0].Name}' is unknown: give a rating";
                    return null;
                }
                return sections.Max(s => s.Loading!.Value);
            case MeasureKind.Flux:
                var core = result.Cores.FirstOrDefault(c => c.Core.Name == t[0].Name);
                if (core?.Flux is { } flux) return flux;
                problem = $"the flux density of '{t[0].Name}' needs the core's 'area' and the windings' 'turns'";
                return null;
            case MeasureKind.Power:
                if (result.Supplies.FirstOrDefault(s => s.Supply.Name == t[0].Name) is { } ps) return ps.Power.Real;
                if (result.Loads.FirstOrDefault(l => l.Load.Name == t[0].Name) is { } pl) return pl.Power.Real;
                problem = $"'{t[0].Name}' was left out of the network";
                return null;
            case MeasureKind.Efficiency:
                if (result.Totals.Efficiency is { } efficiency) return efficiency;
                problem = "efficiency needs a supply that delivers power to a load";
                return null;
            default:
                if (result.Loads.FirstOrDefault(l => l.Load.Name == t[0].Name)?.Regulation is { } regulation) return regulation;
                problem = $"the regulation of '{t[0].Name}' is unknown";
                return null;
        }
    }
}
