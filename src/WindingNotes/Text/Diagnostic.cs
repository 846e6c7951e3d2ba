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

    /// <summary>
    /// The case the diagnostic belongs to ("fault F1", "sweep BR=25 %"), where it is not the file as
    /// written; the solver sets it, and the study compares messages without it.
    /// </summary>
    public string? Case { get; init; }

    /// <summary>The message as every output shows it: <c>in case 'fault F1': </c> before it where it belongs to a case.</summary>
    public string Shown => Case is null ? Message : $"in case '{DiagnosticBag.Printable(Case)}': {Message}";

    public bool IsError => Severity == Severity.Error;
}

/// <summary>A hint beside a diagnostic; with a replacement it is a fix that rewrites the span.</summary>
public sealed record DiagnosticHint(string Message, TextSpan Span, string? Replacement = null);

public sealed record RelatedSpan(string Message, TextSpan Span);
