using System.Collections.Immutable;
using WindingNotes.Syntax;
using WindingNotes.Text;

namespace WindingNotes.Model;

/// <summary>Resolves names, evaluates values with their dimensions, and builds the <see cref="Model"/>.</summary>
public static class Binder
{
    /// <param name="cancel">Checked at every statement: a file of many thousand lines binds for a while.</param>
    public static Model Bind(SyntaxTree tree, BindOverrides? overrides = null, CancellationToken cancel = default) =>
        new BindRun(tree, overrides ?? BindOverrides.None, cancel).Run();

    /// <summary>
    /// <paramref name="nominal"/> (the document as written, bound) at the values <paramref name="overrides"/>
    /// gives, binding again only the statements they reach (<see cref="Model.Reach"/>): the model
    /// <see cref="Bind"/> would give, with what it reached. Null where that cannot be done alone (a
    /// statement of another kind, one that gives a message): the caller binds in full.
    /// </summary>
    internal static (Model Model, bool LoadsOnly)? Rebind(Model nominal, BindOverrides overrides)
    {
        if (nominal.Reach?.Of(overrides) is not { } reached) return null;
        return new BindRun(nominal, overrides).Replay(nominal, reached.Statements) is { } model ? (model, reached.LoadsOnly) : null;
    }
}

/// <summary>
/// One binding pass. Definitions are collected first, so statements may name what a later line
/// defines; let values are evaluated in source order, so a let may use only the lets above it.
/// </summary>
internal sealed partial class BindRun
{
    private readonly SyntaxTree tree;
    private readonly BindOverrides overrides;
    private readonly CancellationToken cancel;
    private readonly DiagnosticBag diagnostics = new();
    private readonly SymbolTable symbols;
    private readonly Dictionary<string, Quantity> lets = new(StringComparer.Ordinal);
    private readonly Dictionary<Symbol, HashSet<int>> nodeUses = [];
    private readonly ValueEvaluator evaluator;
    private Model model;

    // The model's lists, gathered here and put into the model once: adding to an immutable array copies it.
    private readonly ImmutableArray<CoreModel>.Builder cores = ImmutableArray.CreateBuilder<CoreModel>();
    private readonly ImmutableArray<NoLoadModel>.Builder noLoads = ImmutableArray.CreateBuilder<NoLoadModel>();
    private readonly ImmutableArray<WindingModel>.Builder windings = ImmutableArray.CreateBuilder<WindingModel>();
    private readonly ImmutableArray<TapModel>.Builder taps = ImmutableArray.CreateBuilder<TapModel>();
    private readonly ImmutableArray<ImpedanceModel>.Builder impedances = ImmutableArray.CreateBuilder<ImpedanceModel>();
    private readonly ImmutableArray<ImmutableArray<NodeRef>>.Builder joins = ImmutableArray.CreateBuilder<ImmutableArray<NodeRef>>();
    private readonly ImmutableArray<NodeRef>.Builder grounds = ImmutableArray.CreateBuilder<NodeRef>();
    private readonly ImmutableArray<SupplyModel>.Builder supplies = ImmutableArray.CreateBuilder<SupplyModel>();
    private readonly ImmutableArray<LoadModel>.Builder loads = ImmutableArray.CreateBuilder<LoadModel>();
    private readonly ImmutableArray<FaultModel>.Builder faults = ImmutableArray.CreateBuilder<FaultModel>();
    private readonly ImmutableArray<SweepModel>.Builder sweeps = ImmutableArray.CreateBuilder<SweepModel>();
    private readonly ImmutableArray<ExpectModel>.Builder expects = ImmutableArray.CreateBuilder<ExpectModel>();

    public BindRun(SyntaxTree tree, BindOverrides overrides, CancellationToken cancel)
    {
        this.tree = tree;
        this.overrides = overrides;
        this.cancel = cancel;
        symbols = new();
        evaluator = new ValueEvaluator(diagnostics, ResolveValueName, IsLet, overrides.Deviations);
        model = new Model(tree, symbols, []);
        // What each value reaches is recorded for the document as written, which points start from.
        if (overrides.Values.IsEmpty && overrides.Deviations.IsEmpty) reach = new Reach();
    }

    /// <summary>A run that binds statements of <paramref name="nominal"/> again at other values, with its names and lets.</summary>
    internal BindRun(Model nominal, BindOverrides overrides)
    {
        tree = nominal.Syntax;
        this.overrides = overrides;
        symbols = nominal.Symbols.Sharing();
        evaluator = new ValueEvaluator(diagnostics, ResolveValueName, IsLet, overrides.Deviations);
        model = nominal;
        foreach (var (name, value) in nominal.Lets) lets[name] = value;
        boundLets.UnionWith(nominal.Lets.Keys);
    }

    private readonly Reach? reach;

    /// <summary>
    /// The statements <paramref name="reached"/> bound again, in source order, each statement's records
    /// put in place of those it made in <paramref name="nominal"/>; null where one gives a message
    /// or a different number of records.
    /// </summary>
    internal Model? Replay(Model nominal, IReadOnlyList<Reach.Made> reached)
    {
        foreach (var m in reached)
        {
            tainted = false;
            var again = m.Statement.Kind switch
            {
                StatementKind.Let => Let(m),
                StatementKind.Load => Again(loads, nominal.Loads, m),
                StatementKind.Supply => Again(supplies, nominal.Supplies, m),
                StatementKind.Winding => Again(windings, nominal.Windings, m),
                StatementKind.Tap or StatementKind.Brush => Again(taps, nominal.Taps, m),
                StatementKind.Impedance => Again(impedances, nominal.Impedances, m),
                StatementKind.Fault => Again(faults, nominal.Faults, m),
                _ => false,
            };
            if (!again || diagnostics.Count > 0 || tainted) return null;
        }
        return nominal with
        {
            Loads = Replaced(loads, nominal.Loads),
            Supplies = Replaced(supplies, nominal.Supplies),
            Windings = Replaced(windings, nominal.Windings),
            Taps = Replaced(taps, nominal.Taps),
            Impedances = Replaced(impedances, nominal.Impedances),
            Faults = Replaced(faults, nominal.Faults),
            Lets = lets.Count == nominal.Lets.Count && lets.All(l => nominal.Lets.TryGetValue(l.Key, out var v) && v.Equals(l.Value)) ? nominal.Lets : lets.ToImmutableDictionary(),
            Reach = nominal.Reach,
        };

        bool Let(Reach.Made m)
        {
            BindLet(m.Statement);
            return true;
        }

        // The list as written, then the statement's records made after it and moved into their place.
        bool Again<T>(ImmutableArray<T>.Builder list, ImmutableArray<T> written, Reach.Made m)
        {
            if (list.Count == 0) list.AddRange(written);
            var before = list.Count;
            Bind(m.Statement);
            if (list.Count - before != m.Count) return false;
            for (var i = 0; i < m.Count; i++) list[m.Start + i] = list[before + i];
            list.Count = before;
            return true;
        }

        static ImmutableArray<T> Replaced<T>(ImmutableArray<T>.Builder list, ImmutableArray<T> written) => list.Count == 0 ? written : list.ToImmutable();
    }

    /// <summary>Binds a statement, recording what it reads and makes for <see cref="Reach"/>.</summary>
    private void Recorded(StatementSyntax statement, Action bind)
    {
        if (reach is null)
        {
            bind();
            return;
        }
        var (start, said, sites) = (Made(statement.Kind), diagnostics.Count, evaluator.Tolerances.Count);
        reach.Begin(statement);
        tainted = false;
        bind();
        for (var i = sites; i < evaluator.Tolerances.Count; i++) reach.Site(evaluator.Tolerances[i].Span.Start);
        var name = statement.Kind is StatementKind.Let or StatementKind.Tap or StatementKind.Brush ? statement.Head.Name(0)?.Text : null;
        reach.End(statement, name, start, Made(statement.Kind) - start, diagnostics.Count == said && !tainted);
    }

    /// <summary>How many records the list a statement of <paramref name="kind"/> adds to holds.</summary>
    private int Made(StatementKind kind) => kind switch
    {
        StatementKind.Load => loads.Count,
        StatementKind.Supply => supplies.Count,
        StatementKind.Winding => windings.Count,
        StatementKind.Tap or StatementKind.Brush => taps.Count,
        StatementKind.Impedance => impedances.Count,
        StatementKind.Fault => faults.Count,
        _ => 0,
    };

    public Model Run()
    {
        // A line with a syntax error (one that did not parse, or a statement whose clauses are
        // wrong: missing, given twice, exclusive) declares what it says, after the whole lines, so
        // a whole line never reports its name as taken by a broken one; nothing of it is bound.
        var errorStarts = tree.Diagnostics.Where(d => d.IsError).Select(d => d.Span.Start).Order().ToArray();
        bool HasError(LineSyntax line) => line.Error is not null
            || Array.BinarySearch(errorStarts, line.Span.Start) is var i && (i >= 0 || (~i < errorStarts.Length && errorStarts[~i] <= line.Span.End));
        var statements = new List<StatementSyntax>();
        var broken = new List<StatementSyntax>();
        var brokenLines = new List<LineSyntax>();
        foreach (var line in tree.Lines)
        {
            if (HasError(line))
            {
                brokenLines.Add(line);
                var said = line.Statement ?? line.Partial;
                if (said is not null) broken.Add(said);
                // A line of no known statement (or one refused as too long) gives no names: what
                // its words are is unknown, and a rename could not keep them in step. A word after a
                // number is its unit, not a name, as for the line's stray names: taken as a name, it
                // hid an error about that name elsewhere that a rename (which leaves units) brought
                // back (fuzz seed 6025812).
                if (said is not null)
                {
                    Token? before = null;
                    foreach (var t in line.Tokens.Where(t => !t.IsTrivia))
                    {
                        if (before is not { Kind: TokenKind.Number or TokenKind.Imaginary } && t.Kind is TokenKind.Word or TokenKind.Imaginary) brokenWords.Add(t.Text);
                        before = t;
                    }
                }
            }
            else if (line.Statement is { } statement) statements.Add(statement);
        }
        foreach (var statement in statements) Declare(statement);
        foreach (var statement in statements) DeclareTapPhases(statement);
        foreach (var partial in broken) DeclarePartial(partial);
        // A supply, load or fault that redefines a name is bound for its values, which uses its names.
        foreach (var said in broken.Concat(rejected.Where(r => r.Kind is not (StatementKind.Supply or StatementKind.Load or StatementKind.Fault))))
            ReferenceUses(said);
        foreach (var line in brokenLines) ReferenceStrayNames(line);
        foreach (var statement in statements.Where(s => s.Kind == StatementKind.Let))
        {
            cancel.ThrowIfCancellationRequested();
            if (rejected.Contains(statement)) Value(statement.Head.Value(), $"let {statement.Head.Name(0)!.Text}");
            else Recorded(statement, () => BindLet(statement));
        }
        foreach (var statement in statements.Where(s => s.Kind != StatementKind.Let))
        {
            cancel.ThrowIfCancellationRequested();
            if (!rejected.Contains(statement)) Recorded(statement, () => BindWhole(statement));
            else if (statement.Kind is StatementKind.Supply or StatementKind.Load or StatementKind.Fault) BindDiscarded(statement);
        }
        if (!statements.Concat(broken).Any(s => s.Kind == StatementKind.Frequency) && statements.Count > 0)
            // At the first line that says something (a file may begin with blank or comment lines).
            diagnostics.ReportNoFrequency((tree.Lines.FirstOrDefault(l => l.Statement is not null || l.Error is not null) ?? tree.Lines[0]).Span);
        CheckLonelyNodes();
        CheckZigzagMagnetising();
        foreach (var name in laterUses)
            if (symbols.Find(name.Text) is { } symbol) symbols.Reference(name.Name.Span, symbol);
        // Points the three-phase statements made (star points) come after the author's, so a node keeps the author's name.
        var points = symbols.References
            .Where(r => r.Symbol.IsConnectionPoint && !threePhaseTaps.Contains(r.Symbol.Name))
            .OrderBy(r => r.Span.Start)
            .Select(r => r.Symbol)
            .Concat(derivedPoints)
            .Distinct()
            .ToImmutableArray();
        // In this order, as the model's fields were: each may give messages.
        var threePhase = ThreePhaseResult();
        var thermal = ThermalResult();
        // Points are bound at other values for sweeps, toleranced values, a load cycle's let, tap-changer positions and 'find'.
        var rebound = sweeps.Count > 0 || evaluator.Tolerances.Count > 0 || thermal.Cycle?.Let is not null || !model.TapChangers.IsEmpty || model.Find is not null;
        return model with
        {
            Cores = cores.ToImmutable(),
            NoLoads = noLoads.ToImmutable(),
            Windings = windings.ToImmutable(),
            Taps = taps.ToImmutable(),
            Impedances = impedances.ToImmutable(),
            Joins = joins.ToImmutable(),
            Grounds = grounds.ToImmutable(),
            Groundings = groundings.ToImmutable(),
            Supplies = supplies.ToImmutable(),
            Loads = loads.ToImmutable(),
            Faults = faults.ToImmutable(),
            BusFaults = busFaults.ToImmutable(),
            FaultStudy = faultStudy,
            Sweeps = sweeps.ToImmutable(),
            Expects = expects.ToImmutable(),
            Points = points,
            Tolerances = [.. evaluator.Tolerances],
            Lets = lets.ToImmutableDictionary(),
            FailOn = failOn.ToImmutableDictionary(),
            Acknowledged = acknowledged.ToImmutableDictionary(),
            ThreePhase = threePhase,
            Thermal = thermal,
            Diagnostics = [.. tree.Diagnostics, .. diagnostics],
            // Three-phase statements make their phase elements from what other lines declared: bound in full.
            // Kept only where there are points to bind.
            Reach = rebound && phaseCores.Count == 0 && threePhaseWindings.Count == 0 && phaseSupplies.Count == 0 && phaseLoads.Count == 0 ? reach : null,
            ZigzagImpedances = [.. zigzagImpedances],
        };
    }

    private void Declare(StatementSyntax statement)
    {
        var owner = Owner(statement);
        var defined = new List<string>();
        foreach (var name in statement.AllNames)
        {
            if (!name.Role.Defines) continue;
            var symbol = new Symbol(name.Text, name.Role.Kinds[0], name.Name.Span, statement.Span, owner);
            if (symbols.TryDefine(symbol, out var existing))
            {
                defined.Add(name.Text);
                continue;
            }
            diagnostics.ReportDuplicateName(name.Name, existing.Span, existing.Describe());
            rejected.Add(statement);
        }
        // A statement rejected for a name it redefines adds no element: the names it did define
        // are broken, and the words it writes are those of a line with an error.
        if (rejected.Contains(statement))
        {
            brokenNames.UnionWith(defined);
            foreach (var name in statement.AllNames) brokenWords.Add(name.Text);
        }
        DeclarePhases(statement);
        DeclareGrounding(statement);
        DeclarePair(statement);
    }

    /// <summary>The winding the points a statement defines are on.</summary>
    private static string? Owner(StatementSyntax statement) => statement.Kind switch
    {
        StatementKind.Winding => statement.Head.Name(0)?.Text,
        StatementKind.Tap or StatementKind.Brush => statement.Clause("on")?.Name(0)?.Text,
        StatementKind.Pair => statement.Head.Name(0)?.Text,
        _ => null,
    };

    /// <summary>Statements that define a name already taken; they are reported once and add no element.</summary>
    private readonly HashSet<StatementSyntax> rejected = [];

    /// <summary>
    /// A statement with an error declares its names and adds no element. A name a broken line
    /// defines is declared where it is free (a name it takes from a whole line is left to that
    /// line), and what it is then used as is not held against it: its kind may be the mistake.
    /// </summary>
    private void DeclarePartial(StatementSyntax statement)
    {
        foreach (var name in statement.AllNames.Where(n => n.Role.Defines))
        {
            var symbol = new Symbol(name.Text, name.Role.Kinds[0], name.Name.Span, statement.Span, Owner(statement));
            // A name taken already is used here, not defined: a rename changes it with the others.
            if (symbols.TryDefine(symbol, out var existing)) brokenNames.Add(symbol.Name);
            else symbols.Reference(name.Name.Span, existing);
        }
        foreach (var missing in statement.Head.Elements.Concat(statement.Clauses.SelectMany(c => c.Elements)).OfType<MissingSyntax>())
            if (missing.Role is { Defines: true } role) missingKinds.UnionWith(role.Kinds);
    }

    /// <summary>Kinds of name a broken line was to define and does not: an unknown name of such a kind may be the one it lacks.</summary>
    private readonly HashSet<SymbolKind> missingKinds = [];

    /// <summary>
    /// The names a statement with an error uses are uses all the same (navigation finds them, a
    /// rename changes them), and a free node it names is defined there; nothing is checked of them.
    /// </summary>
    private void ReferenceUses(StatementSyntax statement)
    {
        foreach (var name in statement.AllNames.Where(n => !n.Role.Defines))
        {
            var symbol = symbols.Find(name.Text);
            if (symbol is null && name.Role.Kinds.Contains(SymbolKind.Node))
            {
                symbol = new Symbol(name.Text, SymbolKind.Node, name.Name.Span, default);
                symbols.TryDefine(symbol, out _);
            }
            if (symbol is null)
            {
                laterUses.Add(name);
                continue;
            }
            symbols.Reference(name.Name.Span, symbol);
            brokenUses.Add(symbol);
        }
    }

    /// <summary>
    /// Uses on a broken line of a name nothing had defined when they were read: a free node that a
    /// later statement makes is still used there, so a rename changes it too (the fuzzer found a
    /// rename of a node that left a broken 'sweep' line naming it behind). Referenced after the
    /// diagnostics, which they do not change.
    /// </summary>
    private readonly List<NameSyntax> laterUses = [];

    /// <summary>
    /// A name on a line with an error that no part of its statement holds (tokens passed over after
    /// the error) is still a use: of the name that exists, or of a free node there.
    /// </summary>
    private void ReferenceStrayNames(LineSyntax line)
    {
        // A line of no known statement is left as it is: its words may be anything.
        if ((line.Statement ?? line.Partial) is not { } said) return;
        var held = said.AllNames.Select(n => n.Name.Span.Start).Append(said.Keyword.Span.Start).ToHashSet();
        Token? before = null;
        foreach (var t in line.Tokens.Where(t => !t.IsTrivia))
        {
            // A word after a number is its unit, not a name.
            var unit = before is { Kind: TokenKind.Number or TokenKind.Imaginary };
            before = t;
            // A word spelt as an imaginary number (j0) is a value here, as it makes the next word its unit:
            // taken as a name, a rename to a plain word made that unit a name too (fuzz seed 6025273).
            if (unit || t.Kind != TokenKind.Word || !ValueParser.IsName(t) || held.Contains(t.Span.Start)) continue;
            if (symbols.Find(t.Text) is not { } symbol)
            {
                // Most names a line writes are points; one named nowhere else is a free node there.
                symbol = new Symbol(t.Text, SymbolKind.Node, t.Span, default);
                symbols.TryDefine(symbol, out _);
            }
            symbols.Reference(t.Span, symbol);
            brokenUses.Add(symbol);
        }
    }

    /// <summary>Symbols a statement with an error uses: a lonely node or a wrong kind among them follows from that error.</summary>
    private readonly HashSet<Symbol> brokenUses = [];

    /// <summary>A broken line lacks the name of a connection point: a node used once may be the one it lacks.</summary>
    private bool MissingPoints => missingKinds.Overlaps([SymbolKind.Terminal, SymbolKind.Tap, SymbolKind.Brush]);

    /// <summary>
    /// Names whose element is absent because of an error: declared by a broken line, or defined by
    /// a statement that used such a name (it could not be bound whole). What a use of them would
    /// check (kind, core, phases) cannot be said, so a use resolves to nothing and reports nothing.
    /// </summary>
    private readonly HashSet<string> brokenNames = new(StringComparer.Ordinal);

    private bool IsBroken(Symbol symbol) =>
        brokenNames.Contains(symbol.Name) || (symbol.Derived && symbol.Owner is { } owner && brokenNames.Contains(owner));

    /// <summary>Set when the statement being bound used a broken name: what it defines is broken too.</summary>
    private bool tainted;

    private void BindWhole(StatementSyntax statement)
    {
        tainted = false;
        Bind(statement);
        if (!tainted) return;
        foreach (var name in statement.AllNames)
            if (name.Role.Defines) brokenNames.Add(name.Text);
    }

    /// <summary>Every word on a line with an error: a name among them may be one that line meant to define or use.</summary>
    private readonly HashSet<string> brokenWords = new(StringComparer.Ordinal);

    /// <summary>
    /// An unknown name, a lonely node or a name of the wrong kind that a line with an error also
    /// writes follows from that error: it is not reported (the file has its error, so it is not solved).
    /// </summary>
    private bool FollowsFromBrokenLine(Token name)
    {
        if (brokenWords.Contains(name.Text)) return true;
        if (name.Text.LastIndexOf('_') is not (> 0 and var i) || !brokenWords.Contains(name.Text[..i])) return false;
        // A phase (LV_a) of a name the broken line writes: a rename of that name carries it.
        if (symbols.Find(name.Text) is null) symbols.PhaseUse(name.Span, name.Text[..i]);
        return true;
    }

    /// <summary>
    /// A statement that redefines a name (a supply, load or fault: nothing else hangs on its name)
    /// is still bound for the errors of its values, and what it would add is dropped: one mistake
    /// must not hide another on the same line.
    /// </summary>
    private void BindDiscarded(StatementSyntax statement)
    {
        var (s, l, f) = (supplies.Count, loads.Count, faults.Count);
        Bind(statement);
        while (supplies.Count > s) supplies.RemoveAt(supplies.Count - 1);
        while (loads.Count > l) loads.RemoveAt(loads.Count - 1);
        while (faults.Count > f) faults.RemoveAt(faults.Count - 1);
    }

    // ---- names ----

    /// <summary>
    /// A name that must be one of some kinds. A connection point that is nowhere defined is a free
    /// node, defined where first used; a name of another kind is an error at the name.
    /// </summary>
    private Symbol? Resolve(NameSyntax? name, string expected, params SymbolKind[] kinds)
    {
        if (name is null) return null;
        var acceptsPoint = kinds.Contains(SymbolKind.Node);
        var symbol = symbols.Find(name.Text);
        if (symbol is null)
        {
            if (!acceptsPoint)
            {
                if (FollowsFromBrokenLine(name.Name) || kinds.Any(missingKinds.Contains)) return null;
                diagnostics.ReportUnknownName(name.Name, KindWord(kinds[0]), Spelling.Nearest(name.Text, symbols.NamesOf(kinds)));
                return null;
            }
            symbol = new Symbol(name.Text, SymbolKind.Node, name.Name.Span, default);
            symbols.TryDefine(symbol, out _);
        }
        else if (IsBroken(symbol))
        {
            // Its element is absent because of an error: nothing can be said of this use.
            symbols.Reference(name.Name.Span, symbol);
            tainted = true;
            return null;
        }
        else if (!(kinds.Contains(symbol.Kind) || (acceptsPoint && symbol.IsConnectionPoint)))
        {
            if (!brokenUses.Contains(symbol) && !FollowsFromBrokenLine(name.Name) && !kinds.Any(missingKinds.Contains)) diagnostics.ReportWrongKind(name.Name, symbol.Describe(), expected);
            // Still a use of the name: navigation finds it, and a rename changes it with the others.
            symbols.Reference(name.Name.Span, symbol);
            return null;
        }
        symbols.Reference(name.Name.Span, symbol);
        return symbol;
    }

    private NodeRef? Node(NameSyntax? name, StatementSyntax statement)
    {
        var symbol = Resolve(name, "a terminal or node", SymbolKind.Terminal, SymbolKind.Node);
        if (symbol is null || IsThreePhaseTap(symbol, name!)) return null;
        if (!nodeUses.TryGetValue(symbol, out var uses)) nodeUses[symbol] = uses = [];
        uses.Add(statement.Span.Start);
        return new NodeRef(symbol.Name, name!.Name.Span);
    }

    /// <summary>
    /// A point that an expect names: it observes the network and adds nothing to it, so a name that
    /// no element touches is an error, not a new node at 0 V. (A fault is an element: a fault on a
    /// node nothing else touches is a lonely node.)
    /// </summary>
    private Symbol? Observed(NameSyntax? name)
    {
        var symbol = Resolve(name, "a terminal or node", SymbolKind.Terminal, SymbolKind.Node);
        if (symbol is not null) observed.Add((symbol, name!));
        return symbol;
    }

    private readonly List<(Symbol Symbol, NameSyntax Name)> observed = [];

    private static string KindWord(SymbolKind kind) => kind switch
    {
        SymbolKind.Let => "name",
        SymbolKind.Core => "core",
        SymbolKind.Winding => "winding",
        SymbolKind.Supply => "supply",
        SymbolKind.Load => "load",
        _ => "name",
    };

    /// <summary>
    /// A free node (a name no winding, tap or brush defines) must join two elements: one touched by a
    /// single load, supply, join, ground or fault is a slip of the pen, and one only an expect names
    /// does not exist. Both are errors, with the nearest real point as a suggestion. A winding
    /// end left open stays legal: it is a terminal, not a free node.
    /// </summary>
    private void CheckLonelyNodes()
    {
        // A point a statement makes (a three-phase supply's star point `grid_n`) is touched by its maker.
        bool Made(Symbol s) => s.Kind != SymbolKind.Node || s.Derived;
        bool Real(Symbol s) => s.IsConnectionPoint && (Made(s) || nodeUses.GetValueOrDefault(s)?.Count > 1);
        var real = symbols.Symbols.Where(Real).Select(s => s.Name).ToList();
        // Each suggestion compares with every point: the first slips get one, up to about 100,000
        // comparisons in all, so a file of many thousand points stays linear in its length.
        var suggestions = 100_000 / Math.Max(100, real.Count);
        string? Nearest(string name) => suggestions-- > 0 ? Spelling.Nearest(name, real) : null;
        foreach (var (symbol, uses) in nodeUses)
        {
            if (Made(symbol) || uses.Count > 1 || brokenUses.Contains(symbol) || MissingPoints) continue;
            diagnostics.ReportLonelyNode(symbol.Span, symbol.Name, Nearest(symbol.Name));
        }
        foreach (var (symbol, name) in observed)
            if (!Made(symbol) && !nodeUses.ContainsKey(symbol) && !brokenUses.Contains(symbol) && !MissingPoints)
                diagnostics.ReportUnknownName(name.Name, "terminal or node", Nearest(symbol.Name));
    }

    // ---- values ----

    private bool IsLet(string name) => symbols.Find(name)?.Kind == SymbolKind.Let;

    /// <summary>A name in a value: a let, evaluated in source order among the lets.</summary>
    private Quantity? ResolveValueName(Token token)
    {
        var symbol = symbols.Find(token.Text);
        if (symbol is null)
        {
            if (FollowsFromBrokenLine(token) || missingKinds.Contains(SymbolKind.Let)) return null;
            diagnostics.ReportUnknownName(token, "name", Spelling.Nearest(token.Text, symbols.NamesOf(SymbolKind.Let)));
            return null;
        }
        if (IsBroken(symbol))
        {
            symbols.Reference(token.Span, symbol);
            tainted = true;
            return null;
        }
        if (symbol.Kind != SymbolKind.Let)
        {
            if (!brokenUses.Contains(symbol) && !FollowsFromBrokenLine(token)) diagnostics.ReportWrongKind(token, symbol.Describe(), "a let value");
            symbols.Reference(token.Span, symbol);
            return null;
        }
        symbols.Reference(token.Span, symbol);
        reach?.Reads(token.Text);
        if (overrides.Values.TryGetValue(token.Text, out var replaced)) return replaced;
        if (lets.TryGetValue(token.Text, out var value)) return value;
        // A let that failed was reported at its own line; one not bound yet comes later in the file.
        if (!boundLets.Contains(token.Text)) diagnostics.ReportLetUsedEarly(token, symbol.Span);
        return null;
    }

    private readonly HashSet<string> boundLets = [];

    private Quantity? Value(ValueSyntax? value, string description) => value is null ? null : evaluator.Evaluate(value, description);

    /// <summary>
    /// A real value of the given dimension, or null after a diagnostic. With <paramref name="ratio"/>
    /// it is a ratio written in % or pu (a loading, an efficiency): a bare number there is an error.
    /// </summary>
    private double? Real(ValueSyntax? value, Dimension dimension, string description, bool positive = false, bool ratio = false)
    {
        if (Value(value, description) is not { } q) return null;
        if (q.IsBare && (ratio || !dimension.IsNone))
        {
            // A ratio of 1 or less was likely meant as a fraction: 0.99 pu keeps that meaning.
            MissingUnit(value!, description, !ratio ? [dimension.SiUnit()] : Math.Abs(q.Real) <= 1 ? ["pu", "%"] : ["%"]);
            return null;
        }
        if (!q.Dimension.Fits(dimension))
        {
            diagnostics.ReportWrongDimension(value!.Span, dimension.Describe(), q.Dimension);
            return null;
        }
        if (!q.IsReal)
        {
            diagnostics.ReportWrongDimension(value!.Span, $"a real {dimension.Describe()[(dimension.Describe().IndexOf(' ') + 1)..]}", q.Dimension);
            return null;
        }
        if (positive && q.Real <= 0)
        {
            diagnostics.ReportOutOfBounds(value!.Span, description, "above zero");
            return null;
        }
        return q.Real;
    }

    private System.Numerics.Complex? Complex(ValueSyntax? value, Dimension dimension, string description)
    {
        if (Value(value, description) is not { } q) return null;
        if (q.IsBare && !dimension.IsNone)
        {
            MissingUnit(value!, description, dimension.SiUnit());
            return null;
        }
        if (!q.Dimension.Fits(dimension))
        {
            diagnostics.ReportWrongDimension(value!.Span, dimension.Describe(), q.Dimension);
            return null;
        }
        return q.Value;
    }

    /// <summary>
    /// A bare number where a quantity is meant: the error, and where the number is written as a
    /// literal a fix that adds the first of <paramref name="units"/>.
    /// </summary>
    private void MissingUnit(ValueSyntax value, string what, params string[] units)
    {
        var literal = value.Expression is NumberSyntax { Unit: null } or UnarySyntax { Operand: NumberSyntax { Unit: null } };
        var written = tree.Text[value.Expression.Span];
        diagnostics.ReportMissingUnit(value.Expression.Span, what, written, units, literal);
    }

    /// <summary>The unit word a value is written with (<c>%</c> in <c>100 %</c>), or null.</summary>
    private static string? UnitWord(ValueSyntax? value) => value?.Expression switch
    {
        NumberSyntax { Unit: { } unit } => unit.Text,
        UnarySyntax { Operand: NumberSyntax { Unit: { } unit } } => unit.Text,
        _ => null,
    };

    private void BindLet(StatementSyntax statement)
    {
        var name = statement.Head.Name(0)!;
        if (overrides.Values.TryGetValue(name.Text, out var replaced)) lets[name.Text] = replaced;
        else if (Value(statement.Head.Value(), $"let {name.Text}") is { } value) lets[name.Text] = value;
        boundLets.Add(name.Text);
    }
}
