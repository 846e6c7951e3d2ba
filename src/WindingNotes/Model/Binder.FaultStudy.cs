using System.Collections.Immutable;
using WindingNotes.Syntax;

namespace WindingNotes.Model;

// The 'fault-study' and 'bus-fault' lines, and which fault case an 'expect' is evaluated in.
internal sealed partial class BindRun
{
    private readonly ImmutableArray<BusFaultModel>.Builder busFaults = ImmutableArray.CreateBuilder<BusFaultModel>();
    private HashSet<string>? declaredBusFaultNames;

    /// <summary>The names the file's 'bus-fault' lines define, wherever an expect stands.</summary>
    private HashSet<string> declaredBusFaults => declaredBusFaultNames ??=
        [.. tree.Statements.Where(x => x.Kind == StatementKind.BusFault).Select(x => x.Head.Name(0)?.Text).OfType<string>()];
    private FaultStudyModel faultStudy = FaultStudyModel.Default;

    private void BindFaultStudy(StatementSyntax s)
    {
        var method = s.Head.Word(_ => true)?.Text == "as-loaded" ? FaultMethod.AsLoaded : FaultMethod.EquivalentSource;
        var currents = s.Clause("currents")?.Word(_ => true)?.Text ?? "maximum";
        var study = FaultStudyModel.Default with
        {
            Method = method,
            Maximum = currents != "minimum",
            Minimum = currents != "maximum",
            Line = s.Span,
            Meshed = s.Clause("peak-method")?.Word(_ => true)?.Text == "meshed",
            EquivalentFrequency = s.Clause("peak-method")?.Word(_ => true)?.Text == "equivalent-frequency",
            TransformerCorrection = s.Clause("transformer-correction") is not null,
        };
        if (s.Value("voltage-tolerance") is { } tolSyntax && Real(tolSyntax, Dimension.None, "the voltage tolerance", ratio: true) is { } tol)
        {
            // IEC 60909-0 Table 1 (from memory) gives c for low-voltage systems of +6 % and of +10 %.
            if (Math.Abs(tol - 0.06) > 1e-9 && Math.Abs(tol - 0.10) > 1e-9)
            {
                diagnostics.ReportOutOfBounds(tolSyntax.Span, "the voltage tolerance", "6 % or 10 %");
                return;
            }
            study = study with { LowVoltageTolerance = tol };
        }
        if (s.Value("duration") is { } d)
        {
            if (Real(d, Dimension.TimeDim, "the fault duration", positive: true) is not { } seconds) return;
            study = study with { Duration = seconds };
        }
        if (s.Value("initial-temperature") is { } t)
        {
            if (Real(t, Dimension.TemperatureDim, "the initial temperature", positive: true) is not { } kelvin) return;
            study = study with { InitialTemperature = kelvin };
        }
        if (s.Value("end-temperature") is { } end)
        {
            if (Real(end, Dimension.TemperatureDim, "the end temperature", positive: true) is not { } kelvin) return;
            study = study with { EndTemperature = kelvin };
        }
        if (method == FaultMethod.AsLoaded && s.Clause("voltage-tolerance") is { } c)
            diagnostics.ReportOutOfBounds(c.Span, "the voltage tolerance", "given with the equivalent source only: the network as loaded has no voltage factor");
        else if (method == FaultMethod.AsLoaded && s.Clause("transformer-correction") is { } k)
            diagnostics.ReportOutOfBounds(k.Span, "the transformer correction", "given with the equivalent source only: the network as loaded is as written");
        else if (s.Clause("end-temperature") is { } e && !study.Minimum)
            diagnostics.ReportOutOfBounds(e.Span, "the end temperature", "given with minimum currents only ('currents minimum' or 'maximum-and-minimum')");
        faultStudy = study;
    }

    private void BindBusFault(StatementSyntax s)
    {
        var name = s.Head.Name(0)!;
        var lines = new[] { 1, 2, 3 }.Select(i => Node(s.Head.Name(i), s)).ToList();
        var kind = s.Head.Word(_ => true)?.Text switch
        {
            "three-phase" => BusFaultKind.ThreePhase,
            "line-to-ground" => BusFaultKind.LineToGround,
            "line-to-line" => BusFaultKind.LineToLine,
            _ => BusFaultKind.DoubleLineToGround,
        };
        var z = s.Clause("impedance") is { } imp ? Complex(imp.Value(), Dimension.Impedance, $"the impedance of {name.Text}") : 0;
        var ze = s.Clause("earth-impedance") is { } e ? Complex(e.Value(), Dimension.Impedance, $"the earth impedance of {name.Text}") : 0;
        var nominal = s.Value("nominal") is { } n ? Real(n, Dimension.Voltage, $"the nominal voltage of {name.Text}", positive: true) : null;
        if (lines.Any(l => l is null) || z is null || ze is null || (s.Value("nominal") is not null && nominal is null)) return;
        if (lines.Select(l => l!.Name).Distinct().Count() < 3)
        {
            diagnostics.ReportOutOfBounds(s.Head.Span, "the lines of a bus fault", "three different terminals");
            return;
        }
        if (z.Value.Real < 0 || ze.Value.Real < 0)
        {
            diagnostics.ReportOutOfBounds((z.Value.Real < 0 ? s.Clause("impedance")! : s.Clause("earth-impedance")!).Span, "a fault impedance", "a resistance of zero or more");
            return;
        }
        busFaults.Add(new BusFaultModel(name.Text, name.Name.Span, s.Span, [.. lines!], kind, z.Value, ze.Value) { Nominal = nominal });
    }

    private static bool IsFaultMeasure(MeasureKind m) => m is MeasureKind.FaultCurrent or MeasureKind.PeakCurrent or MeasureKind.ThermalCurrent or MeasureKind.EarthFaultFactor or MeasureKind.PeakDuty;

    /// <summary>
    /// The fault case an expect is evaluated in: the fault a fault measure names, or the one its 'in'
    /// clause names; (null, false) for the normal case. Null after a diagnostic.
    /// </summary>
    private (string? Fault, bool Minimum)? FaultCase(StatementSyntax s, ClauseSyntax measure, MeasureKind kind)
    {
        var clause = IsFaultMeasure(kind) ? measure : s.Clause("in");
        if (clause is null) return (null, false);
        // 'peak-duty' names its winding first, then the fault.
        var faultName = clause.Name(kind == MeasureKind.PeakDuty && clause == measure ? 1 : 0);
        if (Resolve(faultName, "a fault", SymbolKind.Fault) is not { } fault) return null;
        var minimum = clause.Word(w => w == "minimum") is not null;
        var isBusFault = declaredBusFaults.Contains(fault.Name);
        if (IsFaultMeasure(kind) && !isBusFault)
        {
            diagnostics.ReportOutOfBounds(faultName!.Span, $"the fault of '{measure.Keyword!.Text}'", "a bus fault ('bus-fault'); a two-node fault has its current in its own case");
            return null;
        }
        if (clause.Word(w => w is "minimum" or "maximum") is { } word && !isBusFault)
        {
            diagnostics.ReportOutOfBounds(word.Span, "the study of a two-node fault", "as written: maximum and minimum are studies of a bus fault");
            return null;
        }
        return (fault.Name, minimum);
    }

    /// <summary>
    /// The winding of a 'peak-duty' check: a winding, or a three-phase winding (its phases' largest),
    /// whose line states its 'peak-withstand'. Null after a diagnostic.
    /// </summary>
    private NodeRef? PeakDutyWinding(NameSyntax? name)
    {
        if (Resolve(name, "a winding", SymbolKind.Winding) is not { } winding) return null;
        var line = tree.Statements.FirstOrDefault(x => x.Kind == StatementKind.Winding && x.Head.Name(0)?.Text == winding.Name);
        if (line is not null && line.Clause("peak-withstand") is null)
        {
            diagnostics.ReportOutOfBounds(name!.Name.Span, "the winding of 'peak-duty'", $"one whose line gives its 'peak-withstand': '{winding.Name}' gives none");
            return null;
        }
        return new NodeRef(winding.Name, name!.Name.Span);
    }
}
