using System.Globalization;
using System.Text;

namespace WindingNotes.Report.Diagrams;

/// <summary>A rectangle in drawing units, for laying out labels without overlaps.</summary>
public readonly record struct Box(double X, double Y, double Width, double Height)
{
    public double Right => X + Width;

    public double Bottom => Y + Height;

    public bool Overlaps(Box other) =>
        X < other.Right && other.X < Right && Y < other.Bottom && other.Y < Bottom;

    public Box Inflate(double d) => new(X - d, Y - d, Width + 2 * d, Height + 2 * d);

    public static Box Around(IEnumerable<Box> boxes)
    {
        double x0 = double.MaxValue, y0 = double.MaxValue, x1 = double.MinValue, y1 = double.MinValue;
        foreach (var b in boxes)
        {
            (x0, y0, x1, y1) = (Math.Min(x0, b.X), Math.Min(y0, b.Y), Math.Max(x1, b.Right), Math.Max(y1, b.Bottom));
        }
        return x0 > x1 ? default : new Box(x0, y0, x1 - x0, y1 - y0);
    }
}

public enum Anchor { Start, Middle, End }

/// <summary>
/// Writes SVG by hand: numbers culture-free with at most two decimals, text escaped, elements in
/// the order drawn, so the same drawing gives the same bytes. Every text it writes is kept as a box
/// (from an estimate of its width), so layouts can be checked for overlapping labels.
/// </summary>
public sealed class Svg
{
    public const string Font = "DejaVu Sans, Verdana, Arial, sans-serif";

    /// <summary>Average advance of a character in the font above, as a fraction of its size; generous, so estimates err wide.</summary>
    public const double CharWidth = 0.62;

    private readonly StringBuilder body = new();
    private readonly List<Box> texts = [];

    /// <summary>The boxes of every text and of the symbols that must stay clear of text.</summary>
    public IReadOnlyList<Box> TextBoxes => texts;

    /// <summary>Keeps a symbol's box among the text boxes, so a check for overlaps sees it too.</summary>
    public void Occupy(Box box) => texts.Add(box);

    public static double TextWidth(string text, double size) => text.Length * size * CharWidth;

    public static Box TextBox(string text, double x, double y, double size, Anchor anchor = Anchor.Start)
    {
        var w = TextWidth(text, size);
        var left = anchor switch { Anchor.Middle => x - w / 2, Anchor.End => x - w, _ => x };
        // y is the baseline: the box runs from the ascent above it to the descent below.
        return new Box(left, y - 0.8 * size, w, size);
    }

    public static string N(double v) => Math.Round(v, 2).ToString("0.##", CultureInfo.InvariantCulture);

    private static string Escape(string text) => text.Replace("&", "&amp;").Replace("<", "&lt;").Replace(">", "&gt;").Replace("\"", "&quot;");

    public void Raw(string element) => body.Append(element).Append('\n');

    public void Line(double x1, double y1, double x2, double y2, string style = "wire") =>
        Raw($"<line class=\"{style}\" x1=\"{N(x1)}\" y1=\"{N(y1)}\" x2=\"{N(x2)}\" y2=\"{N(y2)}\"/>");

    public void Polyline(IEnumerable<(double X, double Y)> points, string style = "wire") =>
        Raw($"<polyline class=\"{style}\" points=\"{string.Join(" ", points.Select(p => $"{N(p.X)},{N(p.Y)}"))}\"/>");

    public void Path(string d, string style) => Raw($"<path class=\"{style}\" d=\"{d}\"/>");

    public void Circle(double cx, double cy, double r, string style) =>
        Raw($"<circle class=\"{style}\" cx=\"{N(cx)}\" cy=\"{N(cy)}\" r=\"{N(r)}\"/>");

    public void Rect(double x, double y, double w, double h, string style) =>
        Raw($"<rect class=\"{style}\" x=\"{N(x)}\" y=\"{N(y)}\" width=\"{N(w)}\" height=\"{N(h)}\"/>");

    public Box Text(string text, double x, double y, string style, double size, Anchor anchor = Anchor.Start)
    {
        var a = anchor switch { Anchor.Middle => " text-anchor=\"middle\"", Anchor.End => " text-anchor=\"end\"", _ => "" };
        Raw($"<text class=\"{style}\" x=\"{N(x)}\" y=\"{N(y)}\"{a}>{Escape(text)}</text>");
        var box = TextBox(text, x, y, size, anchor);
        texts.Add(box);
        return box;
    }

    public void Title(string text) => Raw($"<title>{Escape(text)}</title>");

    /// <summary>The document: a white page, the style sheet, then everything drawn.</summary>
    public string Document(double width, double height, string css)
    {
        var o = new StringBuilder();
        o.Append("<?xml version=\"1.0\" encoding=\"UTF-8\"?>\n");
        o.Append($"<svg xmlns=\"http://www.w3.org/2000/svg\" width=\"{N(width)}\" height=\"{N(height)}\" viewBox=\"0 0 {N(width)} {N(height)}\" font-family=\"{Font}\">\n");
        o.Append("<style>\n").Append(css).Append("</style>\n");
        o.Append($"<rect x=\"0\" y=\"0\" width=\"{N(width)}\" height=\"{N(height)}\" fill=\"#ffffff\"/>\n");
        o.Append(body);
        o.Append("</svg>\n");
        return o.ToString();
    }

    /// <summary>
    /// Notes at the foot of a drawing, wrapped to its width, the closing note on results and
    /// judgement last; the baseline after the last line.
    /// </summary>
    public double Notes(double x, double y, double width, params string[] notes)
    {
        foreach (var line in notes.Append(Cautions.Judgement).SelectMany(n => Wrap(n, width, 9)))
        {
            Text(line, x, y, "note", 9);
            y += 13;
        }
        return y - 13;
    }

    /// <summary>Splits a sentence into lines of at most about <paramref name="width"/> units at the given size.</summary>
    public static IEnumerable<string> Wrap(string text, double width, double size)
    {
        var max = Math.Max(20, (int)(width / (size * CharWidth)));
        var line = new StringBuilder();
        foreach (var word in text.Split(' '))
        {
            if (line.Length > 0 && line.Length + 1 + word.Length > max)
            {
                yield return line.ToString();
                line.Clear();
            }
            if (line.Length > 0) line.Append(' ');
            line.Append(word);
        }
        if (line.Length > 0) yield return line.ToString();
    }
}
