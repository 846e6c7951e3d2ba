using System.Collections.Immutable;

namespace WindingNotes.Text;

/// <summary>
/// Value equality of the lists a record holds. A record's own equality compares an
/// <see cref="ImmutableArray{T}"/> or an array by reference, so two results of the same values
/// compared equal only when they shared a list: records that mean value equality compare their
/// lists here.
/// </summary>
internal static class Sequences
{
    public static bool Equal<T>(ImmutableArray<T> a, ImmutableArray<T> b) =>
        a.IsDefault || b.IsDefault ? a.IsDefault == b.IsDefault : a.AsSpan().SequenceEqual(b.AsSpan(), EqualityComparer<T>.Default);

    public static bool Equal<T>(T[]? a, T[]? b) =>
        a is null || b is null ? a is null == b is null : a.AsSpan().SequenceEqual(b, EqualityComparer<T>.Default);

    public static bool Equal<T>(IReadOnlySet<T>? a, IReadOnlySet<T>? b) =>
        a is null || b is null ? a is null == b is null : a.Count == b.Count && a.SetEquals(b);

    /// <summary>A hash of a list's length and first element: cheap, and equal for equal lists.</summary>
    public static int Hash<T>(ImmutableArray<T> a) =>
        a.IsDefaultOrEmpty ? 0 : HashCode.Combine(a.Length, a[0]);
}
