using WindingNotes.Syntax;
using WindingNotes.Text;
using WindingNotes.Workspace;

namespace WindingNotes.Editing;

public enum OutlineKind { Core, Winding, Tap, Brush, Supply, Load, Fault, Sweep, Let }

/// <summary>One entry of the outline: its statement's range, its name's range, its children.</summary>
public sealed record OutlineSymbol(string Name, OutlineKind Kind, string Detail, TextRange Range, TextRange SelectionRange, IReadOnlyList<OutlineSymbol> Children);

/// <summary>
/// The outline: cores with their windings and the windings' taps and brushes, then supplies, loads,
/// the cases (faults and sweeps) and the lets, in source order. Read from the syntax, so a file that
/// does not bind still has an outline; the detail is the line's result where there is one.
/// </summary>
public static class DocumentSymbols
{
    public static IReadOnlyList<OutlineSymbol> For(Evaluation evaluation)
    {
        var labels = InlayHints.Labels(evaluation);
        var statements = evaluation.Syntax.Statements.Where(s => s.Head.Name(0) is not null || s.Kind == StatementKind.Sweep).ToList();
        OutlineSymbol Entry(StatementSyntax s, OutlineKind kind, IReadOnlyList<OutlineSymbol>? children = null)
        {
            var name = s.Head.Name(0)!;
            var detail = labels(s) ?? s.Form.Summary;
            return new OutlineSymbol(name.Text, kind, detail, evaluation.Text.GetRange(s.Span), evaluation.Text.GetRange(name.Name.Span), children ?? []);
        }
        string? On(StatementSyntax s) => s.Clause("on")?.Name(0)?.Text;

        var taps = statements.Where(s => s.Kind is StatementKind.Tap or StatementKind.Brush).ToLookup(On);
        var windings = statements.Where(s => s.Kind == StatementKind.Winding).ToLookup(On);
        // A name's children go to its first statement; a second definition of it (an error) has none,
        // so a file that repeats its names still has an outline the size of the file.
        var owners = new HashSet<(StatementKind, string)>();
        bool Owns(StatementSyntax s) => owners.Add((s.Kind, s.Head.Name(0)!.Text));
        OutlineSymbol Winding(StatementSyntax w) =>
            Entry(w, OutlineKind.Winding, Owns(w) ? taps[w.Head.Name(0)!.Text].Select(t => Entry(t, t.Kind == StatementKind.Tap ? OutlineKind.Tap : OutlineKind.Brush)).ToList() : []);

        var cores = statements.Where(s => s.Kind == StatementKind.Core).Select(c => c.Head.Name(0)!.Text).ToHashSet();
        var result = new List<OutlineSymbol>();
        foreach (var s in statements)
        {
            var entry = s.Kind switch
            {
                StatementKind.Core => Entry(s, OutlineKind.Core, Owns(s) ? windings[s.Head.Name(0)!.Text].Select(Winding).ToList() : []),
                StatementKind.Winding when !cores.Contains(On(s) ?? "") => Winding(s),
                StatementKind.Supply => Entry(s, OutlineKind.Supply),
                StatementKind.Load => Entry(s, OutlineKind.Load),
                StatementKind.Fault => Entry(s, OutlineKind.Fault),
                StatementKind.Sweep => Entry(s, OutlineKind.Sweep),
                StatementKind.Let => Entry(s, OutlineKind.Let),
                _ => null,
            };
            if (entry is not null) result.Add(entry);
        }
        return result;
    }
}
