using System.Collections.Immutable;
using WindingNotes.Syntax;
using WindingNotes.Text;

namespace WindingNotes.Model;

/// <summary>A defined name. Terminals know the winding they end; free nodes are defined where first used.</summary>
public sealed record Symbol(string Name, SymbolKind Kind, TextSpan Span, TextSpan StatementSpan, string? Owner = null)
{
    /// <summary>A phase element a three-phase statement names (HV_a from HV): it does not occur in the text, so it cannot be renamed.</summary>
    public bool Derived { get; init; }

    public string Describe() => Kind switch
    {
        SymbolKind.Let => "a let value",
        SymbolKind.Core => "a core",
        SymbolKind.Winding => "a winding",
        SymbolKind.Terminal => $"a terminal of {Owner}",
        SymbolKind.Tap => "a tap",
        SymbolKind.Brush => "a brush",
        SymbolKind.Node => "a node",
        SymbolKind.Supply => "a supply",
        SymbolKind.Load => "a load",
        SymbolKind.Fault => "a fault",
        SymbolKind.TapChanger => "a tap changer",
        _ => "a name",
    };

    /// <summary>Terminals, taps, brushes and free nodes are all points a wire can go to.</summary>
    public bool IsConnectionPoint => Kind is SymbolKind.Terminal or SymbolKind.Tap or SymbolKind.Brush or SymbolKind.Node;
}

/// <summary>One occurrence of a name in the document.</summary>
public sealed record SymbolReference(TextSpan Span, Symbol Symbol, bool IsDefinition);

/// <summary>Every name and every place it occurs: hover, definition, references and rename read this.</summary>
public sealed class SymbolTable
{
    private readonly Dictionary<string, Symbol> byName;
    private readonly List<SymbolReference> references = [];

    /// <summary>False for a table that shares another's names to bind statements again: their occurrences are the other's already.</summary>
    private readonly bool records = true;

    public SymbolTable() => byName = new(StringComparer.Ordinal);

    private SymbolTable(Dictionary<string, Symbol> byName) => (this.byName, records) = (byName, false);

    /// <summary>A table with these names that records no occurrence (<see cref="Binder.Rebind"/>).</summary>
    internal SymbolTable Sharing() => new(byName);

    public IEnumerable<Symbol> Symbols => byName.Values;

    public IReadOnlyList<SymbolReference> References => references;

    public Symbol? Find(string name) => byName.GetValueOrDefault(name);

    internal bool TryDefine(Symbol symbol, out Symbol existing)
    {
        if (byName.TryGetValue(symbol.Name, out existing!)) return false;
        byName[symbol.Name] = symbol;
        references.Add(new SymbolReference(symbol.Span, symbol, true));
        existing = symbol;
        return true;
    }

    /// <summary>A name a statement gives without writing it (a phase element): defined, not an occurrence in the text.</summary>
    internal bool TryDefineDerived(Symbol symbol, out Symbol existing)
    {
        if (byName.TryGetValue(symbol.Name, out existing!)) return false;
        byName[symbol.Name] = symbol with { Derived = true };
        existing = byName[symbol.Name];
        return true;
    }

    internal void Reference(TextSpan span, Symbol symbol)
    {
        if (records && span != symbol.Span) references.Add(new SymbolReference(span, symbol, false));
    }

    private readonly HashSet<(TextSpan Span, string Owner)> phaseUses = [];

    /// <summary>A use written OWNER_x of a phase of a name that a line with an error writes: nothing defines it, and a rename of OWNER carries it.</summary>
    internal void PhaseUse(TextSpan span, string owner) => phaseUses.Add((span, owner));

    public IEnumerable<TextSpan> PhaseUsesOf(string owner) => phaseUses.Where(u => u.Owner == owner).Select(u => u.Span);

    public SymbolReference? At(int offset) => references.FirstOrDefault(r => r.Span.Touches(offset));

    public IEnumerable<SymbolReference> ReferencesTo(Symbol symbol) =>
        references.Where(r => r.Symbol == symbol).OrderBy(r => r.Span.Start);

    public IEnumerable<string> NamesOf(params SymbolKind[] kinds) =>
        byName.Values.Where(s => kinds.Contains(s.Kind)).Select(s => s.Name);
}
