// Two types in the library's namespaces, the first referring to the second: the cycle the reflection test must find.
namespace WindingNotes.Text
{
    internal sealed class LayeringProbe { public WindingNotes.Model.LayeringProbe? Later { get; init; } }
}

namespace WindingNotes.Model
{
    internal sealed class LayeringProbe;
}
