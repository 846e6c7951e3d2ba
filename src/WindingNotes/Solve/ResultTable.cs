using System.Collections.Immutable;
using System.Numerics;
using WindingNotes.Model;
using WindingNotes.Text;

namespace WindingNotes.Solve;

/// <summary>How a result is written in the JSON report, and so in its schema.</summary>
public enum ResultKind
{
    /// <summary>A number in SI units or a fraction.</summary>
    Number,
    /// <summary>A number, or null where it is unknown (never a misleading zero).</summary>
    NumberOrNull,
    /// <summary>{rms, deg}; its band is of the rms value.</summary>
    Phasor,
    Integer,
    /// <summary>A name or other string.</summary>
    Word,
    /// <summary>One of <see cref="ResultField.Choices"/>.</summary>
    Choice,
    /// <summary>A list of names.</summary>
    Names,
    /// <summary>An object of the fields of <see cref="ResultField.Nested"/>.</summary>
    Object,
    /// <summary>true or false.</summary>
    Boolean,
    /// <summary>Symmetrical components {zero, positive, negative}, each a phasor (a <see cref="Solve.Sequence"/>).</summary>
    Sequence,
    /// <summary>An object of elements by name (what <see cref="ResultField.Read"/> gives: name and element pairs), each as <see cref="ResultField.Item"/> says.</summary>
    Map,
    /// <summary>An array of the elements <see cref="ResultField.Read"/> gives, each as <see cref="ResultField.Item"/> says.</summary>
    List,
}

/// <summary>
/// One result of an element: its key in the JSON report, how it is written, the unit it is read in
/// ("%" for a fraction shown as percent, "" for a plain ratio), what it means, and where it comes from.
/// </summary>
public sealed record ResultField(string Key, ResultKind Kind, string Unit, string Description, Func<object, object?> Read)
{
    /// <summary>How a person says it ("copper loss"), where the key is not already that: the diff's words. Fields of one key share it.</summary>
    public string Label { get; init; } = Key;

    /// <summary>Every element has it: the schema requires it.</summary>
    public bool Required { get; init; }

    /// <summary>Its range over the tolerances is kept (a phasor's rms value): it is a path of <see cref="CaseValues"/>.</summary>
    public bool Band { get; init; }

    public ImmutableArray<string> Choices { get; init; } = [];

    /// <summary>The fields of an <see cref="ResultKind.Object"/>, read from what <see cref="Read"/> gives.</summary>
    public ImmutableArray<ResultField> Nested { get; init; } = [];

    /// <summary>Each element of a <see cref="ResultKind.Map"/> or <see cref="ResultKind.List"/>, read from the element (its key unused). A map's <see cref="Choices"/> are the names it may have, where they are fixed.</summary>
    public ResultField? Item { get; init; }

    /// <summary>
    /// A <see cref="ResultKind.Number"/> field's <see cref="Read"/> without boxing (null where the element lacks it): the
    /// walk of a case (<see cref="CaseLeaves"/>) reads every number of every kept sweep point by it.
    /// </summary>
    public Func<object, double?>? ReadNumber { get; init; }

    /// <summary>The same for a <see cref="ResultKind.Phasor"/> field.</summary>
    public Func<object, Complex?>? ReadPhasor { get; init; }

    /// <summary>An integer's bounds, for the schema.</summary>
    public int? Minimum { get; init; }

    public int? Maximum { get; init; }
}

/// <summary>
/// One column of a group in the text and Markdown reports, in the order they show it: its Markdown
/// header, its phrase in the text line (<c>{}</c> the value; the phrase carries its own separator,
/// and is left out where the element has no value), the unit the value is read in, and the value:
/// a field of the group (<see cref="Field"/>) or one of its own (<see cref="Read"/>), for what
/// only a person reads (a supply's voltage, a power factor with its sense, a tap changer's setting
/// joining its position, range, state and relay voltage in one phrase).
/// </summary>
public sealed record ResultColumn(string Header, string Text)
{
    /// <summary>The key of the field the column shows, in the field's unit.</summary>
    public string? Field { get; init; }

    /// <summary>The column's own value, where it shows no field as it is.</summary>
    public Func<object, object?>? Read { get; init; }

    /// <summary>The unit of <see cref="Read"/>'s value ("pf": a power factor with its sense, from the complex power).</summary>
    public string Unit { get; init; } = "";

    /// <summary>The Markdown header of a phasor's angle column; without it Markdown shows the magnitude only.</summary>
    public string? Angle { get; init; }

    /// <summary>A name: left-aligned in Markdown.</summary>
    public bool IsName { get; init; }

    /// <summary>Whether a case shows the column (a fault case shows loading as times rated).</summary>
    public Func<CaseResult, bool> When { get; init; } = _ => true;
}

/// <summary>
/// A group of results of a case in the JSON report (<c>sections</c>): its elements by name, each an
/// object of the group's fields, or for a group of no elements (<c>totals</c>) one object.
/// </summary>
public sealed record ResultGroup(string Key, string Description, ImmutableArray<ResultField> Fields)
{
    /// <summary>Whether a case has the group at all (loads and totals are not results of a fault case).</summary>
    public Func<CaseResult, bool> When { get; init; } = _ => true;

    /// <summary>The elements in source order, by name; null for a group that is one object.</summary>
    public Func<CaseResult, IEnumerable<(string Name, object Item)>>? Elements { get; init; }

    /// <summary>The one object of a group without elements.</summary>
    public Func<CaseResult, object>? Single { get; init; }

    /// <summary>Left out of the report where the case has no element of it.</summary>
    public bool OmitWhenEmpty { get; init; }

    /// <summary>The text report's heading of the group.</summary>
    public string Heading { get; init; } = "";

    /// <summary>What an element of it is called ("section"): the Markdown header of the names, and the diff's word for the element.</summary>
    public string Element { get; init; } = "";

    /// <summary>What the text and Markdown reports show of each element; empty where they write the group by hand.</summary>
    public ImmutableArray<ResultColumn> Columns { get; init; } = [];

    /// <summary>Which elements the text and Markdown reports list (a winding only where taps split it); a group listing none is left out.</summary>
    public Func<object, bool> Listed { get; init; } = _ => true;

    /// <summary>The group's tables of the sweep points, in the order the reports show them.</summary>
    public ImmutableArray<SweepTable> Sweep { get; init; } = [];

    /// <summary>A column's value of an element, and its unit.</summary>
    public (object? Value, string Unit) Shown(ResultColumn column, object item) => Shown(column, FieldOf(column), item);

    /// <summary>The field a column shows; null where the column reads its own value. Found once, it serves every element of a case.</summary>
    public ResultField? FieldOf(ResultColumn column) => column.Read is null ? Fields.First(f => f.Key == column.Field) : null;

    /// <summary>A column's value of an element and its unit, its field as <see cref="FieldOf"/> gives it.</summary>
    public static (object? Value, string Unit) Shown(ResultColumn column, ResultField? field, object item) =>
        field is null ? (column.Read!(item), column.Unit) : (field.Read(item), field.Unit);

    public IEnumerable<(string? Name, object Item)> Items(CaseResult c) =>
        Single is { } single ? [(null, single(c))] : Elements!(c).Select(e => ((string?)e.Name, e.Item));
}

/// <summary>
/// A table of the sweep points: its title, and the columns each element gives it (a row a point), each
/// headed by the element's name and the column's <see cref="ResultColumn.Header"/> ("mains I"), or by
/// either alone. Where an element has no value, a table of one column leaves the element out and a
/// table of several shows "-".
/// </summary>
public sealed record SweepTable(string Title, ImmutableArray<ResultColumn> Columns);

/// <summary>
/// The results of a case as data, in the order of the JSON report: every group and field once, with
/// its unit, its meaning and where it comes from, and what the text and Markdown reports show of it.
/// The JSON report's case groups, the paths bands are kept by (<see cref="CaseValues"/>), the case
/// part of grammar/results.schema.json, the diff's words and units, and the text and Markdown lines of
/// the groups with columns are written from this one table, so they cannot drift apart (as
/// <c>Syntax/Grammar</c> is for statements). It is in Solve because bands are kept while solving. A
/// bus fault's study and the three-phase sets are in <see cref="StudyResultTable"/>, in the same
/// records; a case's name, its sweep values, the checks and the bands are written beside it by the
/// report (DEVELOPERS.md, "Adding a result").
/// </summary>
public static class ResultTable
{
    private static ResultField Field<T>(string key, ResultKind kind, string unit, Func<T, object?> read, string description = "", bool band = false, bool required = false) =>
        new(key, kind, unit, description, x => read((T)x)) { Band = band, Required = required };

    private static ResultField Number<T>(string key, string unit, Func<T, double?> read, string description = "", bool band = false, bool required = false) =>
        Field<T>(key, ResultKind.Number, unit, x => read(x), description, band, required) with { ReadNumber = x => read((T)x) };

    private static ResultField Phasor<T>(string key, string unit, Func<T, Complex?> read, string description = "", bool band = false, bool required = false) =>
        Field<T>(key, ResultKind.Phasor, unit, x => read(x), description, band, required) with { ReadPhasor = x => read((T)x) };

    private static ResultField Word<T>(string key, Func<T, string?> read, string description = "", bool required = false) =>
        Field<T>(key, ResultKind.Word, "", read, description, required: required);

    private static ResultGroup Group(string key, string description, Func<CaseResult, IEnumerable<(string, object)>> elements, params ResultField[] fields) =>
        new(key, description, [.. fields]) { Elements = elements };

    /// <summary>A column showing a field as it is.</summary>
    private static ResultColumn Show(string field, string header, string text, string? angle = null) =>
        new(header, text) { Field = field, Angle = angle };

    /// <summary>A column of its own value.</summary>
    private static ResultColumn Column<T>(string header, string text, string unit, Func<T, object?> read) =>
        new(header, text) { Read = x => read((T)x), Unit = unit };

    /// <summary>Loads and totals: results of a case with its loads, not of a fault's.</summary>
    private static bool Loaded(CaseResult c) => c.Fault is null && c.ShortCircuit is null;

    private static readonly ImmutableArray<string> TapStates = ["stated", "in-band", "at-limit", "hunting", "follows", "wired-backwards"];

    private static readonly ImmutableArray<string> FaultMethods = ["equivalent-source", "as-loaded"];

    public static readonly ImmutableArray<ResultGroup> Case =
    [
        Group("nodes", "every connection point in the order the file first names it: its voltage against the reference",
            c => c.Points.Select(p => (p.Point, (object)p.Voltage)),
            Phasor<Complex>("v", "V", v => v, band: true, required: true) with { Label = "voltage" })
            with { Heading = "Nodes", Element = "node", Columns = [Show("v", "voltage", "{}", angle: "angle")], Sweep = [new("Nodes, voltage", [Show("v", "", "{}")])] },

        Group("sections", "by section name: the winding's name when it has no tap or brush, else 'WINDING:A-B'",
            c => c.Sections.Select(s => (s.Section.Name, (object)s)),
            Word<SectionResult>("winding", s => s.Winding.Name, required: true),
            Word<SectionResult>("from", s => s.Section.FromPoint, "the end nearer the winding's polarity end", required: true),
            Word<SectionResult>("to", s => s.Section.ToPoint, required: true),
            Number<SectionResult>("turns", "turns", s => s.Section.Turns, required: true),
            Phasor<SectionResult>("i", "A", s => s.Current, "the current entering the 'from' end", band: true, required: true) with { Label = "current" },
            Number<SectionResult>("s", "VA", s => s.Apparent, "apparent power, VA", band: true, required: true) with { Label = "S" },
            Number<SectionResult>("loading", "%", s => s.Loading, "current over the winding's rated current, where a rating is known; in a fault case the multiple of rated current", band: true),
            Number<SectionResult>("loss", "W", s => s.Loss, "copper loss, W", band: true),
            Number<SectionResult>("currentDensity", "A/m2", s => s.CurrentDensity, "current over the conductor's cross-section, A/m², where the winding gives its conductor") with { Label = "current density" })
            with
            {
                Heading = "Sections", Element = "section",
                Columns =
                [
                    Show("from", "from", "{}") with { IsName = true },
                    Show("to", "to", " to {}") with { IsName = true },
                    Show("turns", "turns", ", {} turns"),
                    Show("i", "current", ": {}", angle: "angle"),
                    Show("s", "apparent", ", {}"),
                    // Under a fault the loading is the multiple of rated current the winding carries.
                    Show("loading", "loading", ", loading {}") with { When = c => c.Fault is null },
                    Column<SectionResult>("times rated", ", {} x rated", "", s => s.Loading) with { When = c => c.Fault is not null },
                    Column<SectionResult>("current density", ", {}", "A/mm2", s => s.CurrentDensity / 1e6) with { When = c => c.Sections.Any(s => s.CurrentDensity is not null) },
                    Column<SectionResult>("loss", ", loss {}", "W", s => s.Loss > 0 ? s.Loss : null),
                ],
                Sweep = [new("Sections, current", [Show("i", "", "{}")]), new("Sections, loading", [Show("loading", "", "{}")])],
            },

        // A winding split by taps or a brush: its copper loss is the sum of its sections'.
        Group("windings", "by winding name: its copper loss, W, the sum over its sections",
            c => c.Sections.GroupBy(s => s.Winding.Name).Select(w => (w.Key, (object)w)),
            Number<IGrouping<string, SectionResult>>("loss", "W", w => w.Sum(s => s.Loss), required: true))
            with
            {
                // The text and Markdown reports list a winding's loss only where it is more than one section's.
                Heading = "Windings", Element = "winding", Listed = w => w is IGrouping<string, SectionResult> g && g.Count() > 1 && g.Sum(s => s.Loss) > 0,
                Columns = [Show("loss", "loss", "loss {}")],
            },

        Group("taps", "by tap or brush name, in source order: the current the winding gives out at that point into what it feeds (at a centre tap, the neutral or return current; at a brush, the current the brush carries)",
            c => c.Taps.Select(t => (t.Point, (object)t)),
            Word<TapResult>("winding", t => t.Winding.Name, required: true),
            Phasor<TapResult>("i", "A", t => t.Current, "the current out of the winding at the point: the current of the section ending there less that of the section starting there", band: true, required: true) with { Label = "current" })
            with
            {
                OmitWhenEmpty = true, Heading = "Taps, current out of the winding", Element = "tap",
                Columns = [Show("winding", "winding", "on {}") with { IsName = true }, Show("i", "current out", ": {}", angle: "angle")],
                Sweep = [new("Taps, current out of the winding", [Show("i", "", "{}")])],
            },

        Group("tapChangers", "by tap changer name, in source order: the position stated or settled on",
            c => c.TapPositions.Select(t => (t.Changer.Name, (object)t)),
            Field<TapPosition>("position", ResultKind.Integer, "", t => t.Position, band: true, required: true),
            Field<TapPosition>("state", ResultKind.Choice, "", t => TapStates[(int)t.State], "stated; settled in its band; stopped at a limit outside its band; hunting (kept at the first of two alternating positions); following its master; run to a limit by a control wired backwards (its steps move the relay away from the band)", required: true)
                with { Choices = TapStates },
            Number<TapPosition>("relay", "V", t => t.Relay, "a controlled tap changer: the voltage its relay sees, V (regulated voltage over the pt-ratio, less the line-drop compensation)", band: true),
            Field<TapPosition>("regulation", ResultKind.Object, "", t => t.Regulation, "a step-voltage regulator's tap changer (a reversing switch, its winding sharing its core with one other): its range of regulation and its series winding's current against the current rating at that range")
                with
            {
                Nested =
                [
                    Word<RegulatorRating>("series", r => r.Series, "the series winding, the one the tap changer is on", required: true),
                    Word<RegulatorRating>("shunt", r => r.Shunt, "the shunt winding, the other winding on its core", required: true),
                    Number<RegulatorRating>("range", "%", r => r.Range, "range of regulation, a fraction of the shunt winding's voltage: the largest position it can reach times the turns a step moves, over the shunt winding's turns", required: true),
                    Number<RegulatorRating>("currentMultiplier", "", r => r.Multiplier, "the current the series winding may carry at this range over its rated current (1 at ±10 %, up to 1.6 at ±5 %)", required: true) with { Label = "current multiplier" },
                    Number<RegulatorRating>("currentRating", "A", r => r.CurrentRating, "rated current times the multiplier, A; absent where the series winding's rated current is not known") with { Label = "current rating" },
                    Number<RegulatorRating>("current", "A", r => r.Current, "the largest current in the series winding's sections in this case, A", required: true),
                ],
            })
            with
            {
                OmitWhenEmpty = true, Heading = "Tap changers", Element = "tap changer",
                Columns =
                [
                    Column<TapPosition>("setting", "{}", "", TapText),
                    Column<TapPosition>("regulation", "; {}", "", t => t.Regulation is { } r ? RegulationText(r) : null) with { When = c => c.TapPositions.Any(t => t.Regulation is not null) },
                ],
                // A position the control did not settle on in its band says why.
                Sweep = [new("Tap changers, position", [Column<TapPosition>("", "{}", "", t => t.State is TapState.AtLimit or TapState.Hunting or TapState.Backwards ? $"{t.Position} ({t.StateText})" : $"{t.Position}")])],
            },

        Group("cores", "",
            c => c.Cores.Select(k => (k.Core.Name, (object)k)),
            Phasor<CoreResult>("voltsPerTurn", "V", k => k.VoltsPerTurn, "where every winding on the core gives its turns", band: true) with { Label = "volts per turn" },
            Number<CoreResult>("flux", "T", k => k.Flux, "peak flux density, T, where the core gives its area", band: true) with { Label = "peak flux" },
            Number<CoreResult>("loss", "W", k => k.LossKnown ? k.Loss : null, "core loss, W; absent without an open-circuit ('no-load') test", band: true),
            Phasor<CoreResult>("noLoadCurrent", "A", k => k.NoLoadCurrent, "the magnetising current the no-load test's winding draws at this volts per turn, where the core has a no-load test") with { Label = "no-load current" })
            with { Element = "core", Sweep = [new("Cores, peak flux", [Show("flux", "", "{}")])] },

        Group("supplies", "",
            c => c.Supplies.Select(s => (s.Supply.Name, (object)s)),
            Phasor<SupplyResult>("i", "A", s => s.Current, "the current leaving the positive terminal", band: true, required: true) with { Label = "current" },
            Number<SupplyResult>("p", "W", s => s.Power.Real, band: true, required: true) with { Label = "P" },
            Number<SupplyResult>("q", "var", s => s.Power.Imaginary, band: true, required: true) with { Label = "Q" },
            Number<SupplyResult>("s", "VA", s => s.Power.Magnitude, band: true, required: true) with { Label = "S" },
            Number<SupplyResult>("pf", "", s => s.PowerFactor, band: true, required: true))
            with
            {
                Heading = "Supplies", Element = "supply",
                Sweep = [new("Supplies, current and power", [Show("i", "I", "{}"), Show("p", "P", "{}")])],
                Columns =
                [
                    Column<SupplyResult>("voltage", "{}", "V", s => s.Voltage.Magnitude),
                    Show("i", "current", ", {}", angle: "angle"),
                    Show("p", "P", ": P {}"), Show("q", "Q", ", Q {}"), Show("s", "S", ", S {}"),
                    Column<SupplyResult>("pf", ", pf {}", "pf", s => s.Power),
                ],
            },

        Group("faults", "in a fault case: the fault's current; every section's current is then the fault duty it carries",
            c => c.Fault is { } f ? [(f.Fault.Name, (object)f)] : [],
            Phasor<FaultResult>("i", "A", f => f.Current, "from the fault's first node to its second", band: true, required: true) with { Label = "current" },
            Number<FaultResult>("peak", "A", f => f.Peak, "asymmetrical peak current of the fault, A: the peak factor times the rms current", band: true),
            Number<FaultResult>("xr", "", f => double.IsFinite(f.XR) ? f.XR : null, "X/R of the loop that feeds the fault; absent when it is purely reactive") with { Label = "X/R" },
            Number<FaultResult>("peakFactor", "", f => f.PeakFactor, "k·√2 with k = 1 + e^(−(φ+π/2)/(X/R))·sin φ, φ = atan(X/R), 2.55 above X/R 14 (IEC 60076-5)") with { Label = "peak factor" },
            Field<FaultResult>("method", ResultKind.Choice, "", f => FaultMethods[f.Method == FaultMethod.AsLoaded ? 1 : 0], "equivalent source (IEC 60909-0, loads left out) where the file has a fault-study line not saying as-loaded, else the network as loaded")
                with { Choices = FaultMethods },
            Number<FaultResult>("c", "", f => f.VoltageFactor, "the equivalent source's voltage factor, on the voltage across the fault at no load"),
            Field<FaultResult>("loadsAsImpedance", ResultKind.Names, "", f => f.LoadsAsImpedance.IsEmpty ? null : f.LoadsAsImpedance.Select(l => l.Name), "as loaded: the constant-power and constant-current loads taken as their pre-fault impedance"))
            with { When = c => c.Fault is not null, Element = "fault" },

        Group("loads", "",
            c => c.Loads.Select(l => (l.Load.Name, (object)new LoadRow(l, c.Connections.FirstOrDefault(x => x.Connection.Load == l.Load)))),
            Phasor<LoadRow>("v", "V", l => l.Load.Voltage, band: true, required: true) with { Label = "voltage" },
            Phasor<LoadRow>("i", "A", l => l.Load.Current, "the current entering the load's first node", band: true, required: true) with { Label = "current" },
            Number<LoadRow>("p", "W", l => l.Load.Power.Real, band: true, required: true) with { Label = "P" },
            Number<LoadRow>("q", "var", l => l.Load.Power.Imaginary, band: true, required: true) with { Label = "Q" },
            Number<LoadRow>("regulation", "%", l => l.Load.Regulation, "no-load voltage minus loaded voltage, over loaded voltage, at the load's terminals", band: true),
            Number<LoadRow>("coRatio", "", l => l.Connection?.CoRatio, "for a load fed through an autotransformer connection: the two-winding rating over the throughput, (V_H − V_X)/V_H where the common winding is across the lower voltage; absent with no throughput") with { Label = "co-ratio" },
            Number<LoadRow>("twoWindingRating", "VA", l => l.Connection?.TwoWindingRating, "the two-winding rating that connection needs: the series winding's voltage times its current (the windings between the load and the supply points it is fed from), shared among the loads of one connection by their VA") with { Label = "two-winding rating" })
            with
            {
                When = Loaded, Heading = "Loads", Element = "load",
                Sweep = [new("Loads, voltage, current, power, regulation", [Show("v", "V", "{}"), Show("i", "I", "{}"), Show("p", "P", "{}"), Show("regulation", "reg", "{}")])],
                Columns =
                [
                    Show("v", "voltage", "{}", angle: "angle"), Show("i", "current", ", {}"),
                    Show("p", "P", ": P {}"), Show("q", "Q", ", Q {}"),
                    Column<LoadRow>("S", ", S {}", "VA", l => l.Load.Power.Magnitude),
                    Column<LoadRow>("pf", ", pf {}", "pf", l => l.Load.Power),
                    Show("regulation", "regulation", ", regulation {}"),
                    Show("coRatio", "co-ratio", ", co-ratio {}") with { When = c => !c.Connections.IsEmpty },
                    Show("twoWindingRating", "two-winding rating needed", ", two-winding rating needed {}") with { When = c => !c.Connections.IsEmpty },
                ],
            },

        new ResultGroup("totals", "",
        [
            Number<Totals>("copperLoss", "W", t => t.CopperLoss, band: true, required: true) with { Label = "copper loss" },
            // Unknown without an open-circuit test of every core: null, never a misleading zero.
            Field<Totals>("coreLoss", ResultKind.NumberOrNull, "W", t => t.CoreLossKnown ? t.CoreLoss : null, "null where a core has no open-circuit ('no-load') test: its loss is unknown, and 'efficiency' and the maximum-efficiency load are then absent", band: true, required: true) with { Label = "core loss" },
            Number<Totals>("efficiency", "%", t => t.Efficiency, "power delivered to loads over power supplied", band: true),
            Number<Totals>("throughput", "VA", t => t.Throughput, "apparent power of the loads, VA", band: true, required: true),
            Number<Totals>("transformed", "VA", t => t.Transformed, "apparent power the windings transform, VA", band: true, required: true),
            Number<Totals>("maxEfficiencyLoad", "VA", t => t.MaxEfficiencyLoad, "the load (VA) at which efficiency is highest, where copper loss equals core loss", band: true) with { Label = "maximum-efficiency load" },
            Number<Totals>("maxEfficiencyFraction", "%", t => t.MaxEfficiencyFraction, "that load as a fraction of this case's load") with { Label = "maximum-efficiency fraction" },
            Number<Totals>("maxEfficiency", "%", t => t.MaxEfficiency, "the efficiency at that load, at this case's power factor", band: true) with { Label = "maximum efficiency" },
        ])
        {
            When = Loaded, Single = c => c.Totals,
            Sweep = [new("Totals", [Show("copperLoss", "copper loss", "{}"), Show("coreLoss", "core loss", "{}"), Show("efficiency", "efficiency", "{}")])],
        },
    ];

    /// <summary>A field of a value by its key, in any group (the first; such fields of one key share their unit and label).</summary>
    public static ResultField? FieldNamed(string key) => ByKey.Value.GetValueOrDefault(key);

    private static readonly Lazy<Dictionary<string, ResultField>> ByKey = new(() =>
    {
        var byKey = new Dictionary<string, ResultField>(StringComparer.Ordinal);
        foreach (var f in Case.SelectMany(g => g.Fields).SelectMany(f => f.Nested.Prepend(f)).Where(f => f.Kind != ResultKind.Object)) byKey.TryAdd(f.Key, f);
        return byKey;
    });

    /// <summary>The group of the table with this key.</summary>
    public static ResultGroup Named(string key) => Case.First(g => g.Key == key);

    /// <summary>"position +8 of -16 to +16, in band, relay 119.1 V".</summary>
    public static string TapText(TapPosition t) =>
        $"position {Signed(t.Position)} of {Signed(t.Changer.Low)} to {Signed(t.Changer.High)}, {t.StateText}" + (t.Relay is { } r ? $", relay {Numbers.Format(r, "V")}" : "");

    /// <summary>A step-voltage regulator's range of regulation and its series winding's current against its rating at that range.</summary>
    public static string RegulationText(RegulatorRating r) =>
        $"range of regulation ±{Numbers.Format(r.Range * 100, "%")}, series winding {r.Series} {Numbers.Format(r.Current, "A")}"
        + (r.CurrentRating is { } a ? $" of {Numbers.Format(a, "A")} ({Numbers.Format(r.Multiplier * 100, "%")} of rated current)" : $", its rated current not known ({Numbers.Format(r.Multiplier * 100, "%")} of it allowed)");

    private static string Signed(int k) => k > 0 ? $"+{k}" : $"{k}";

    /// <summary>A load with the autotransformer connection it is fed through, if any.</summary>
    public sealed record LoadRow(LoadResult Load, ConnectionResult? Connection);
}
