using System.Text.RegularExpressions;
using WindingNotes.Syntax;
using WindingNotes.Tests.Support;
using Xunit;

namespace WindingNotes.Tests.Editors;

/// <summary>The ready set-ups in editors/ name the same keywords, file type and server command as the rest.</summary>
public class EditorSetupTests
{
    private static string Read(params string[] path) => File.ReadAllText(Path.Combine([Snapshot.RepositoryRoot, "editors", .. path]));

    private static string[] EmacsList(string text, string name)
    {
        var list = Regex.Match(text, $@"\(defconst {name}\s+'\(([^)]*)\)");
        Assert.True(list.Success, $"windingnotes-mode.el has no list {name}");
        return Regex.Matches(list.Groups[1].Value, "\"([^\"]+)\"").Select(m => m.Groups[1].Value).ToArray();
    }

    [Fact]
    public void The_Emacs_mode_lists_exactly_the_grammar_keywords()
    {
        var mode = Read("emacs", "windingnotes-mode.el");
        Assert.Equal(Grammar.Statements.Select(s => s.Keyword), EmacsList(mode, "windingnotes-statement-keywords"));
        var all = new[] { "statement", "clause", "option", "value" }.SelectMany(kind => EmacsList(mode, $"windingnotes-{kind}-keywords")).ToList();
        Assert.Equal(all.Count, all.Distinct().Count());
        Assert.Equal(Grammar.Keywords.Order(), all.Order());
    }

    [Fact]
    public void The_Emacs_and_Helix_set_ups_start_windingnotes_lsp_for_wn_files()
    {
        var mode = Read("emacs", "windingnotes-mode.el");
        Assert.Contains("'(\"windingnotes\" \"lsp\")", mode);
        Assert.Contains("(\"\\\\.wn\\\\'\" . windingnotes-mode)", mode);
        var helix = Read("helix", "languages.toml");
        Assert.Matches(@"(?m)^file-types = \[""wn""\]$", helix);
        Assert.Matches(@"(?m)^\[language-server\.windingnotes\]\ncommand = ""windingnotes""\nargs = \[""lsp""\]$", helix);
    }
}
