using System.Globalization;
using WindingNotes.Text;

namespace WindingNotes.Syntax;

/// <summary>
/// Splits a document into tokens, trivia included, so the tokens print back to the exact text.
/// Never fails: a character it cannot place becomes a <see cref="TokenKind.Bad"/> token.
/// </summary>
public static class Lexer
{
    public static List<Token> Lex(string text)
    {
        var tokens = new List<Token>(text.Length / 3);
        var reader = new Reader(text);
        while (reader.Next() is { } token) tokens.Add(token);
        return tokens;
    }

    /// <summary>
    /// The tokens one at a time, so the parser keeps a line's tokens, not the document's: a list of
    /// every token of a large document is an array in the large-object heap, allocated afresh and
    /// cleared on every parse.
    /// </summary>
    internal struct Reader(string text)
    {
        // Short texts (spaces, keywords, units, names) repeat: each is held once, which halves what the tokens of an open document keep.
        private readonly Dictionary<string, string>.AlternateLookup<ReadOnlySpan<char>> pool = new Dictionary<string, string>(256, StringComparer.Ordinal).GetAlternateLookup<ReadOnlySpan<char>>();
        private int i;

        /// <summary>The next token, or null at the end of the text.</summary>
        public Token? Next()
        {
            if (i >= text.Length) return null;
            var start = i;
            var c = text[i];
            TokenKind kind;
            if (c is '\r' or '\n')
            {
                i += c == '\r' && i + 1 < text.Length && text[i + 1] == '\n' ? 2 : 1;
                kind = TokenKind.Newline;
            }
            else if (char.IsWhiteSpace(c))
            {
                while (i < text.Length && char.IsWhiteSpace(text[i]) && text[i] is not ('\r' or '\n')) i++;
                kind = TokenKind.Whitespace;
            }
            else if (c == '#')
            {
                while (i < text.Length && text[i] is not ('\r' or '\n')) i++;
                kind = TokenKind.Comment;
            }
            else if (c == '\\' && IsContinuation(text, i, out var end))
            {
                i = end;
                kind = TokenKind.Continuation;
            }
            else if (char.IsAsciiDigit(c) || (c == '.' && i + 1 < text.Length && char.IsAsciiDigit(text[i + 1])))
            {
                i = ScanNumber(text, i);
                kind = TokenKind.Number;
            }
            else if (c == 'j' && i + 1 < text.Length && (char.IsAsciiDigit(text[i + 1]) || text[i + 1] == '.'))
            {
                i = ScanNumber(text, i + 1);
                kind = TokenKind.Imaginary;
            }
            else if (IsWordStart(c))
            {
                i = ScanWord(text, i);
                kind = TokenKind.Word;
            }
            else if (c == '±' || (c == '+' && i + 1 < text.Length && text[i + 1] == '-'))
            {
                i += c == '±' ? 1 : 2;
                kind = TokenKind.PlusMinus;
            }
            else if (c is '+' or '-' or '*' or '/' or '(' or ')' or '=' or ':' or ',')
            {
                i++;
                kind = TokenKind.Symbol;
            }
            else
            {
                i += char.IsSurrogatePair(text, i) ? 2 : 1;
                kind = TokenKind.Bad;
            }
            // A run longer than a token holds goes on as the next token (of the same kind, but for a number or word cut in two).
            if (i - start > Token.MaxLength) i = start + Token.MaxLength;
            return new Token(kind, TextSpan.FromBounds(start, i), Shared(pool, text.AsSpan(start, i - start)));
        }
    }

    private static string Shared(Dictionary<string, string>.AlternateLookup<ReadOnlySpan<char>> pool, ReadOnlySpan<char> text)
    {
        if (text.Length > 24) return text.ToString();
        if (!pool.TryGetValue(text, out var shared)) pool[text] = shared = text.ToString();
        return shared;
    }

    private static bool IsWordStart(char c) => char.IsLetter(c) || c is '_' or '%' or 'Ω' or '°' or 'µ';

    private static bool IsWordPart(char c) => char.IsLetterOrDigit(c) || c is '_' or 'Ω' or '°' or 'µ' or '²' or '³';

    private static int ScanWord(string text, int i)
    {
        if (text[i] == '%') return i + 1;
        var start = i;
        while (i < text.Length && IsWordPart(text[i])) i++;
        // A hyphenated keyword such as flux-limit or caution-no-isolation is one word; elsewhere '-' is an operator.
        for (var j = i; j + 1 < text.Length && text[j] == '-' && char.IsLetter(text[j + 1]);)
        {
            var end = j + 1;
            while (end < text.Length && IsWordPart(text[end])) end++;
            var word = text[start..end];
            if (Grammar.HyphenatedKeywords.Contains(word)) i = end;
            else if (!Grammar.HyphenatedPrefixes.Contains(word)) break;
            j = end;
        }
        return i;
    }

    private static int ScanNumber(string text, int i)
    {
        var start = i;
        while (i < text.Length && (char.IsAsciiDigit(text[i]) || text[i] == '_')) i++;
        if (i < text.Length && text[i] == '.')
        {
            i++;
            while (i < text.Length && (char.IsAsciiDigit(text[i]) || text[i] == '_')) i++;
        }
        if (i < text.Length && text[i] is 'e' or 'E')
        {
            var j = i + 1;
            if (j < text.Length && text[j] is '+' or '-') j++;
            if (j < text.Length && char.IsAsciiDigit(text[j]))
            {
                i = j;
                while (i < text.Length && char.IsAsciiDigit(text[i])) i++;
            }
        }
        return i;
    }

    /// <summary>The value of a number's digits as scanned (underscores between digits ignored); NaN where they do not read.</summary>
    internal static double ReadNumber(ReadOnlySpan<char> digits)
    {
        if (digits.Contains('_')) digits = digits.ToString().Replace("_", "");
        return double.TryParse(digits, NumberStyles.Float, CultureInfo.InvariantCulture, out var value) ? value : double.NaN;
    }

    /// <summary>A backslash continues the line when only spaces stand between it and the line break.</summary>
    private static bool IsContinuation(string text, int i, out int end)
    {
        end = i + 1;
        while (end < text.Length && text[end] is ' ' or '\t') end++;
        if (end >= text.Length) return true;
        if (text[end] == '\r') end += end + 1 < text.Length && text[end + 1] == '\n' ? 2 : 1;
        else if (text[end] == '\n') end++;
        else return false;
        return true;
    }
}
