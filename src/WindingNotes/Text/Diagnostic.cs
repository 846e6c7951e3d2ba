using System.Collections.Immutable;

namespace WindingNotes.Text;

public enum Severity { Error, Warning, Information, Hint }

/// <summary>
/// Something said about the document at a range: a stable kebab-case code, a lower-case message
/// without a final period, and hints that may carry a replacement (the quick fixes use those).
/// </summary>
public sealed record Diagnostic(Severity Severity, string Code, string Message, TextSpan Span)
{
    public ImmutableArray<DiagnosticHint> Hints { get; init; } = [];

    /// <summary>Other places that take part (the second of two duplicates, the loop of a singular network).</summary>
    public ImmutableArray<RelatedSpan> Related { get; init; } = [];

    /// <summary>A caution the file acknowledges: check no longer prints it, reports keep it.</summary>
    public bool Acknowledged { get; init; }

    public bool IsError => Severity == Severity.Error;
}

/// <summary>A hint beside a diagnostic; with a replacement it is a fix that rewrites the span.</summary>
public sealed record DiagnosticHint(string Message, TextSpan Span, string? Replacement = null);

public sealed record RelatedSpan(string Message, TextSpan Span);
