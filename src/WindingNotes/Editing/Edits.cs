using WindingNotes.Text;

namespace WindingNotes.Editing;

/// <summary>Replace the text of a range (an empty range inserts). Ranges are zero-based lines and UTF-16 characters.</summary>
public sealed record TextEdit(TextRange Range, string NewText);

/// <summary>Edits to one document, as a rename or a quick fix returns them.</summary>
public sealed record DocumentEdit(string Uri, IReadOnlyList<TextEdit> Edits);
