using System.CommandLine;
using WindingNotes.Report;
using WindingNotes.Workspace;

namespace WindingNotes.Cli;

/// <summary><c>windingnotes check FILE...</c>: every diagnostic and failed check, and a status for CI.</summary>
internal static class CheckCommand
{
    public static Command Create(ConsoleIo io)
    {
        var files = new Argument<string[]>("files") { Description = "calculation files ('-' reads standard input)", Arity = ArgumentArity.OneOrMore };
        var strict = new Option<bool>("--strict") { Description = "fail on warnings too (a winding over its rating, a core over its flux limit)" };
        var command = new Command("check", "Evaluate files; print diagnostics and failed checks; exit 1 on any error, failed check or check not evaluated (with --strict, on any warning too).") { files, strict };
        command.SetAction(parsed => Run(io, parsed.GetValue(files)!, parsed.GetValue(strict)));
        return command;
    }

    /// <summary>Acknowledged cautions are not printed: the file says they were read; reports keep them.</summary>
    private static int Run(ConsoleIo io, string[] files, bool strict)
    {
        int errors = 0, warnings = 0, checks = 0, passed = 0, notEvaluated = 0;
        var unreadable = false;
        foreach (var path in files)
        {
            var text = io.Read(path);
            if (text is null)
            {
                unreadable = true;
                continue;
            }
            var evaluation = ProgressDisplay.Evaluate(io, text, ConsoleIo.DisplayName(path));
            foreach (var d in evaluation.Diagnostics.Where(d => !d.Acknowledged)) io.Output.WriteLine(DiagnosticLines.Format(evaluation, d));
            foreach (var c in evaluation.Checks.Where(c => !c.Evaluated)) io.Output.WriteLine(DiagnosticLines.NotEvaluated(evaluation, c));
            errors += evaluation.Diagnostics.Count(d => d.IsError);
            warnings += evaluation.Diagnostics.Count(d => d.Severity == Text.Severity.Warning);
            checks += evaluation.Checks.Length;
            passed += evaluation.Checks.Count(c => c.Passed);
            notEvaluated += evaluation.Checks.Count(c => !c.Evaluated);
        }
        io.Output.WriteLine($"{files.Length} file{(files.Length == 1 ? "" : "s")}: {errors} error{(errors == 1 ? "" : "s")}, {warnings} warning{(warnings == 1 ? "" : "s")}, {TextReport.CheckCount(passed, checks, notEvaluated)}");
        return unreadable ? Cli.Usage : errors > 0 || passed < checks || (strict && warnings > 0) ? Cli.Failed : Cli.Ok;
    }
}
