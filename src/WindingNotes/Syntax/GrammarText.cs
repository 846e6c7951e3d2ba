using System.Text;

namespace WindingNotes.Syntax;

/// <summary>
/// The EBNF of the notation, written from the <see cref="Grammar"/> table. grammar/windingnotes.ebnf
/// is this text; a test keeps the two equal and parses every statement's example.
/// </summary>
public static class GrammarText
{
    private const string Lexical = """
        (* WindingNotes notation, v1. ISO 14977 EBNF. Generated from the parser's grammar table:
           edit src/WindingNotes/Syntax/Grammar.cs, then run the tests with UPDATE_EXPECTED=1. *)

        (* ---- lexical rules ---- *)
        file          = { line } ;
        line          = [ statement ] [ comment ] newline ;        (* one statement per logical line *)
        continuation  = "\" { " " | tab } newline ;                 (* joins the next physical line; counts as a space *)
        comment       = "#" { any character except newline } ;
        name          = ( letter | "_" ) { letter | digit | "_" } ;  (* case-sensitive; not a keyword *)
        number        = digits [ "." digits ] [ ( "e" | "E" ) [ "+" | "-" ] digit { digit } ] | "." digits ;
        digits        = digit { digit | "_" } ;
        imaginary     = "j" ( digits [ "." digits ] | "." digits ) ;
        unit          = unit word ;              (* after a number: V kV A W VA var ohm Ω Hz T m mm2 mm² kcmil degC °C K % pu deg ° rad turns ... *)
        plus minus    = "+-" | "±" ;

        (* ---- values ---- *)
        value         = expression [ "angle" expression ] [ plus minus expression ] ;
        expression    = term { ( "+" | "-" ) term } ;
        term          = factor { ( "*" | "/" ) factor } ;
        factor        = { "-" | "+" } primary ;
        primary       = number [ unit ] | imaginary [ unit ] | name | "sqrt" "(" expression ")" | "(" expression ")" ;
                        (* "3 + j4 ohm": a bare number plus an imaginary takes the imaginary's unit *)
        section       = name ":" name "-" name ;  (* the part of a winding between two of its points *)

        (* ---- statements ---- *)
        """;

    public static string Ebnf()
    {
        var o = new StringBuilder(Lexical.Replace("\r\n", "\n")).Append('\n');
        o.Append("statement = ").Append(string.Join("\n    | ", Grammar.Statements.Select(s => Rule(s.Keyword)))).Append(" ;\n");
        foreach (var s in Grammar.Statements)
        {
            o.Append('\n').Append("(* ").Append(s.Summary).Append(". Example: ").Append(s.Example).Append(" *)\n");
            var head = string.Join(" ", new[] { Quote(s.Keyword) }.Concat(s.Head.Select(Part)));
            if (s.Clauses.Length == 0)
            {
                o.Append(Rule(s.Keyword)).Append(" = ").Append(head).Append(" ;\n");
                continue;
            }
            o.Append(Rule(s.Keyword)).Append(" = ").Append(head).Append(" { ").Append(Rule(s.Keyword)).Append("-clause } ;\n");
            o.Append(Rule(s.Keyword)).Append("-clause = ")
                .Append(string.Join("\n    | ", s.Clauses.Select(c => string.Join(" ", new[] { Quote(c.Keyword) }.Concat(c.Parts.Select(Part))))))
                .Append(" ;\n");
            var rules = new List<string>();
            var required = s.Clauses.Where(c => c.Required).Select(c => $"'{c.Keyword}'").ToList();
            if (required.Count > 0) rules.Add($"needs {string.Join(" and ", required)}");
            foreach (var group in s.Clauses.Where(c => c.Group is not null).GroupBy(c => c.Group!))
                rules.Add($"{((s.RequiredGroups ?? []).Contains(group.Key) ? "exactly" : "at most")} one of {string.Join(", ", group.Select(c => $"'{c.Keyword}'"))}");
            rules.Add("each clause at most once, in any order");
            o.Append("(* ").Append(string.Join("; ", rules)).Append(" *)\n");
        }
        return o.ToString();
    }

    private static string Rule(string keyword) => keyword.Replace("-", "") + "-statement";

    private static string Quote(string word) => $"\"{word}\"";

    private static string Part(Part part) => part switch
    {
        NamePart n => n.Role.AllowsSection ? "( name | section )" : "name",
        NameListPart => "name { name }",
        ValuePart => "value",
        WordPart w => Quote(w.Word),
        ChoicePart c => "( " + string.Join(" | ", c.Words.Select(Quote)) + " )",
        OptionalPart o => "[ " + string.Join(" ", o.Parts.Select(Part)) + " ]",
        _ => "?",
    };
}
