using System.CommandLine;
using System.CommandLine.Parsing;
using System.Globalization;
using WindingNotes.Report;
using WindingNotes.Workspace;

namespace WindingNotes.Cli;

/// <summary>
/// <c>windingnotes diff OLD NEW</c> and <c>windingnotes diff --rev REV FILE...</c>: which results a change
/// moved, and by how much. Exit 1 when an expectation that passed now fails.
/// </summary>
internal static class DiffCommand
{
    public static Command Create(ConsoleIo io)
    {
        var files = new Argument<string[]>("files") { Description = "OLD NEW, or with --rev the files to compare with their version at REV", Arity = ArgumentArity.OneOrMore };
        var revision = new Option<string?>("--rev", "-r") { Description = "compare each file with its version at this git revision" };
        var threshold = new Option<double>("--threshold", "-t")
        {
            Description = "show results that moved by more than this percentage of their value ('0.1 %', '0.1%' or '0.1')",
            HelpName = "percent",
            // Held in percent, as typed, so the help shows the default as the README gives it.
            DefaultValueFactory = _ => ResultDiff.DefaultThreshold * 100,
            CustomParser = ParseThreshold,
        };
        var format = new Option<string>("--format", "-f") { Description = "text or md (Markdown)", DefaultValueFactory = _ => "text" };
        format.AcceptOnlyFromAmong("text", "md");
        var command = new Command("diff", "Compare the results of two versions of a calculation: expectations that changed state first, then every result that moved.") { files, revision, threshold, format };
        command.Validators.Add(result =>
        {
            var count = result.GetValue(files)?.Length ?? 0;
            if (result.GetValue(revision) is null && count != 2) result.AddError("diff needs two files, OLD and NEW, or --rev REV and a file");
        });
        command.SetAction(parsed => Run(io, parsed.GetValue(files)!, parsed.GetValue(revision), parsed.GetValue(threshold) / 100, parsed.GetValue(format)!));
        return command;
    }

    /// <summary>
    /// Joins a lone "%" to the number before it, so <c>--threshold 0.1 %</c> reads as written (an
    /// option takes one token, and the "%" would otherwise be taken for a file).
    /// </summary>
    public static string[] JoinPercent(string[] args)
    {
        var joined = new List<string>(args.Length);
        foreach (var a in args)
        {
            if (a == "%" && joined.Count > 1 && joined[^2] is "--threshold" or "-t") joined[^1] += " %";
            else joined.Add(a);
        }
        return [.. joined];
    }

    /// <summary>Accepts "0.1", "0.1%" and "0.1 %"; a lone number is in percent, and so is the value returned.</summary>
    private static double ParseThreshold(ArgumentResult result)
    {
        var tokens = result.Tokens;
        var text = tokens[0].Value.Trim();
        if (text.EndsWith('%')) text = text[..^1].TrimEnd();
        if (!double.TryParse(text, NumberStyles.Float, CultureInfo.InvariantCulture, out var percent) || percent < 0 || !double.IsFinite(percent))
        {
            result.AddError($"--threshold wants a percentage such as '0.1 %', not '{tokens[0].Value}'");
            return ResultDiff.DefaultThreshold * 100;
        }
        return percent;
    }

    private static int Run(ConsoleIo io, string[] files, string? revision, double threshold, string format)
    {
        var pairs = revision is null
            ? [(Old: files[0], OldName: files[0], OldText: io.Read(files[0]), New: files[1])]
            : files.Select(f => (Old: f, OldName: $"{f} at {revision}", OldText: Git.Show(io, revision, f), New: f)).ToArray();
        var status = Cli.Ok;
        var first = true;
        foreach (var pair in pairs)
        {
            var newText = io.Read(pair.New);
            if (pair.OldText is null || newText is null)
            {
                status = Cli.Usage;
                continue;
            }
            HeapPages.Before(newText.Length > pair.OldText.Length ? newText : pair.OldText);
            var diff = ResultDiff.Compare(Evaluator.Evaluate(pair.OldText, pair.OldName), Evaluator.Evaluate(newText, pair.New), threshold);
            if (!first) io.Output.WriteLine();
            first = false;
            io.Output.Write(format == "md" ? DiffReport.Markdown(diff) : DiffReport.Text(diff));
            if (diff.Regressed && status == Cli.Ok) status = Cli.Failed;
        }
        return status;
    }
}
