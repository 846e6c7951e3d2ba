using WindingNotes.Text;
using WindingNotes.Syntax;

namespace WindingNotes.Model;

// Messages of binding the thermal statements.
public static partial class ModelMessages
{
    extension(DiagnosticBag bag)
    {
        public Diagnostic ReportUnknownCooling(Token name, string? suggestion) =>
            bag.WithSuggestion(bag.Error("unknown-cooling", name.Span, $"unknown cooling mode '{name.Text}': ONAN, ONAF, OF or OD for an oil-immersed unit, AN or AF for a dry-type unit"), suggestion, name.Span);

        public Diagnostic ReportDuplicateThermal(Token core, TextSpan first) =>
            bag.Amend(bag.Error("duplicate-statement", core.Span, $"core '{core.Text}' has thermal data already"),
                d => d with { Related = [new RelatedSpan("first given here", first)] });

        public Diagnostic ReportThermalDefaults(TextSpan span, CoolingMode cooling, string unitClass, IReadOnlyList<string> defaulted) =>
            bag.Info("thermal-defaults", span, $"typical values of {cooling} cooling for a {unitClass} transformer are used: {string.Join("; ", defaulted)}");

        public Diagnostic ReportDuplicateCyclePoint(TextSpan span, TextSpan first) =>
            bag.Amend(bag.Error("duplicate-statement", span, "a cycle point at this time is given already"),
                d => d with { Related = [new RelatedSpan("first given here", first)] });

        public Diagnostic ReportCyclePointWithoutCycle(TextSpan span) =>
            bag.Error("no-load-cycle", span, "a 'cycle-point' needs a 'load-cycle' line, which says what its load is a value of");

        public Diagnostic ReportCycleWithoutPoints(TextSpan span) =>
            bag.Error("no-cycle-points", span, "the load cycle has no 'cycle-point' lines: give the load at one time of day at least");

        public Diagnostic ReportCycleWithoutAmbient(TextSpan span) =>
            bag.Error("no-ambient", span, "the load cycle has no ambient temperature: give 'ambient' here or on a cycle point");

        public Diagnostic ReportClassOfOil(TextSpan span) =>
            bag.Error("thermal-class", span, "an insulation class is given for a dry-type unit (cooling AN or AF); an oil-immersed unit's insulation is its 'paper'");

        public Diagnostic ReportDryWithoutClass(TextSpan span) =>
            bag.Error("thermal-class", span, "a dry-type unit needs its insulation system temperature: 'class' and one of 105, 120, 130, 155, 180, 200, 220 degC, such as 'cooling AN class 155 degC'");

        public Diagnostic ReportRiseOfOtherCooling(TextSpan span, bool dry) =>
            bag.Error("thermal-class", span, dry
                ? "a dry-type unit has no oil: give its average winding rise with 'winding-rise'"
                : "an oil-immersed unit's rise is its top oil's: give 'top-oil-rise'");

        public Diagnostic ReportThermalClauseMissing(TextSpan span, string clause) =>
            bag.Error("thermal-incomplete", span, $"the thermal data of an oil-immersed unit needs {clause}");

        public Diagnostic ReportPaperOfDry(TextSpan span) =>
            bag.Error("thermal-class", span, "a dry-type unit has no paper in oil: its ageing follows its insulation class");

        public Diagnostic ReportDuplicateCapability(Token core, TextSpan first) =>
            bag.Amend(bag.Error("duplicate-statement", core.Span, $"core '{core.Text}' has this capability already"),
                d => d with { Related = [new RelatedSpan("first given here", first)] });
    }
}
