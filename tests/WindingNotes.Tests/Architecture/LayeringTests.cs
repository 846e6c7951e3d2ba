using System.Text.RegularExpressions;
using WindingNotes.Tests.Support;
using Xunit;

namespace WindingNotes.Tests.Architecture;

/// <summary>
/// The layers of DESIGN.md, enforced: a folder of the library uses only the folders left of it, the
/// library knows no protocol and no command line and does no IO, and only the front ends do.
/// </summary>
public partial class LayeringTests
{
    private static readonly string[] Order = ["Text", "Syntax", "Model", "Solve", "Workspace", "Report", "Editing"];

    [GeneratedRegex(@"\bWindingNotes\.(Text|Syntax|Model|Solve|Workspace|Report|Editing)\b")]
    private static partial Regex LayerReference();

    private static string Library => Path.Combine(Snapshot.RepositoryRoot, "src", "WindingNotes");

    [Fact]
    public void Each_folder_uses_only_the_folders_left_of_it()
    {
        foreach (var file in Directory.GetFiles(Library, "*.cs", SearchOption.AllDirectories).Where(f => !f.Contains($"{Path.DirectorySeparatorChar}obj{Path.DirectorySeparatorChar}")))
        {
            var folder = Path.GetRelativePath(Library, file).Split(Path.DirectorySeparatorChar)[0];
            var layer = Array.IndexOf(Order, folder);
            Assert.True(layer >= 0, $"{file} is outside the known layers");
            foreach (Match m in LayerReference().Matches(File.ReadAllText(file)))
            {
                var used = Array.IndexOf(Order, m.Groups[1].Value);
                Assert.True(used <= layer, $"{Path.GetRelativePath(Library, file)} ({folder}) uses {m.Value}, a later layer");
            }
        }
    }

    [Fact]
    public void The_library_knows_no_protocol_no_command_line_and_does_no_io()
    {
        var references = typeof(WindingNotes.Workspace.Evaluator).Assembly.GetReferencedAssemblies().Select(a => a.Name).ToList();
        Assert.DoesNotContain(references, r => r is "StreamJsonRpc" or "System.CommandLine");
        foreach (var file in Directory.GetFiles(Library, "*.cs", SearchOption.AllDirectories).Where(f => !f.Contains("obj")))
        {
            var text = File.ReadAllText(file);
            Assert.DoesNotMatch(@"\b(File|Directory|Console)\.", text);
        }
    }
}
