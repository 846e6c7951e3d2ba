using System.Reflection;
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
    private static readonly string[] Order = ["Text", "Syntax", "Model", "Kernel", "Solve", "Workspace", "Report", "Editing"];

    [GeneratedRegex(@"\bWindingNotes\.(Text|Syntax|Model|Kernel|Solve|Workspace|Report|Editing)\b")]
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

    /// <summary>
    /// The same order over the compiled library: no type refers, in what it declares (base type,
    /// interfaces, fields, properties, method signatures, generic arguments), to a type of a later
    /// namespace. The folder test above reads text and cannot see a stage that adds members to an
    /// earlier stage's class; this one sees the compiled types.
    /// </summary>
    [Fact]
    public void Each_namespace_refers_only_to_the_namespaces_before_it()
    {
        var problems = Violations(typeof(WindingNotes.Workspace.Evaluator).Assembly.GetTypes());
        Assert.True(problems.Count == 0, string.Join("\n", problems));
    }

    [Fact]
    public void A_type_that_refers_to_a_later_namespace_is_found()
    {
        var problems = Violations([typeof(WindingNotes.Text.LayeringProbe), typeof(WindingNotes.Model.LayeringProbe)]);
        Assert.Equal(["WindingNotes.Text.LayeringProbe (Text) refers to WindingNotes.Model.LayeringProbe (Model), a later layer"], problems);
    }

    private static List<string> Violations(IEnumerable<Type> types)
    {
        var problems = new List<string>();
        foreach (var type in types)
        {
            if (Layer(type) is not { } layer) continue;
            foreach (var used in Referenced(type).Distinct())
                if (Layer(used) is { } later && later > layer)
                    problems.Add($"{type.FullName} ({Order[layer]}) refers to {used.FullName} ({Order[later]}), a later layer");
        }
        return [.. problems.Distinct()];
    }

    /// <summary>The layer of a type by its namespace: WindingNotes.Model.Binder is in Model.</summary>
    private static int? Layer(Type type)
    {
        var parts = (type.Namespace ?? "").Split('.');
        return parts.Length >= 2 && parts[0] == "WindingNotes" && Array.IndexOf(Order, parts[1]) is var i and >= 0 ? i : null;
    }

    private static IEnumerable<Type> Referenced(Type type)
    {
        const BindingFlags all = BindingFlags.Public | BindingFlags.NonPublic | BindingFlags.Instance | BindingFlags.Static | BindingFlags.DeclaredOnly;
        var direct = new List<Type?> { type.BaseType };
        direct.AddRange(type.GetInterfaces());
        direct.AddRange(type.GetFields(all).Select(f => f.FieldType));
        direct.AddRange(type.GetProperties(all).Select(p => p.PropertyType));
        foreach (var m in type.GetMethods(all))
        {
            direct.Add(m.ReturnType);
            direct.AddRange(m.GetParameters().Select(p => p.ParameterType));
        }
        foreach (var c in type.GetConstructors(all)) direct.AddRange(c.GetParameters().Select(p => p.ParameterType));
        return direct.OfType<Type>().SelectMany(Parts);
    }

    /// <summary>A type and what it is made of: the element of an array or reference, the arguments of a generic.</summary>
    private static IEnumerable<Type> Parts(Type type)
    {
        if (type.HasElementType) return Parts(type.GetElementType()!);
        if (!type.IsGenericType) return [type];
        return type.GetGenericArguments().SelectMany(Parts).Prepend(type.GetGenericTypeDefinition());
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
