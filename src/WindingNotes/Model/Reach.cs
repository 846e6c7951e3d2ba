using WindingNotes.Syntax;

namespace WindingNotes.Model;

/// <summary>
/// What each let, toleranced value and tap position reaches in a model as bound: the statements
/// whose values read it (through the lets that read it too), and the records each statement made.
/// A sweep point or tolerance sample that changes only such values binds those statements again
/// (<see cref="Binder.Rebind"/>) instead of the whole document. Recorded while the document as
/// written is bound; statements of a kind that is not bound again this way, or that gave a
/// message, stop it, and the point is bound in full.
/// </summary>
internal sealed class Reach
{
    /// <summary>One statement as bound: what it names (a let's or a tap's name), and the records it added to its list of the model.</summary>
    internal sealed record Made(StatementSyntax Statement, string? Name, int Start, int Count, bool Again);

    private readonly List<Made> made = [];
    private readonly Dictionary<string, List<int>> readers = new(StringComparer.Ordinal);
    private readonly Dictionary<string, int> named = new(StringComparer.Ordinal);
    private readonly Dictionary<int, int> sites = [];
    private int current = -1;

    /// <summary>The statements a point binds again: those whose records replace the model's. Lets and loads only, or more.</summary>
    internal sealed record Reached(IReadOnlyList<Made> Statements, bool LoadsOnly);

    /// <summary>Statement kinds bound again alone: each adds records to one list of the model and reads nothing another statement of the point changes.</summary>
    private static bool Rebound(StatementKind kind) => kind is StatementKind.Let or StatementKind.Load or StatementKind.Supply
        or StatementKind.Winding or StatementKind.Tap or StatementKind.Brush or StatementKind.Impedance or StatementKind.Fault;

    public void Begin(StatementSyntax statement) => current = made.Count;

    /// <summary>The statement being bound reads let <paramref name="name"/>.</summary>
    public void Reads(string name)
    {
        if (current < 0) return;
        if (!readers.TryGetValue(name, out var list)) readers[name] = list = [];
        if (list.Count == 0 || list[^1] != current) list.Add(current);
    }

    /// <summary>The statement being bound has a toleranced value starting at <paramref name="offset"/>.</summary>
    public void Site(int offset)
    {
        if (current >= 0) sites[offset] = current;
    }

    public void End(StatementSyntax statement, string? name, int start, int count, bool clean)
    {
        if (name is not null) named[name] = made.Count;
        made.Add(new Made(statement, name, start, count, clean && Rebound(statement.Kind)));
        current = -1;
    }

    /// <summary>The statements the overrides reach, in source order; null where one of them cannot be bound again alone.</summary>
    public Reached? Of(BindOverrides overrides)
    {
        var pending = new Stack<int>();
        foreach (var name in overrides.Values.Keys)
        {
            if (!named.TryGetValue(name, out var i)) return null;
            pending.Push(i);
        }
        foreach (var offset in overrides.Deviations.Keys)
        {
            if (!sites.TryGetValue(offset, out var i)) return null;
            pending.Push(i);
        }
        var seen = new SortedSet<int>();
        var loadsOnly = true;
        while (pending.TryPop(out var i))
        {
            if (!seen.Add(i)) continue;
            var m = made[i];
            if (!m.Again) return null;
            if (m.Statement.Kind == StatementKind.Let)
            {
                if (readers.TryGetValue(m.Name!, out var list))
                    foreach (var r in list) pending.Push(r);
            }
            else if (m.Statement.Kind != StatementKind.Load) loadsOnly = false;
        }
        return new Reached([.. seen.Select(i => made[i])], loadsOnly);
    }
}
