using System.Collections.Immutable;
using System.Numerics;
using WindingNotes.Kernel;
using WindingNotes.Model;
using WindingNotes.Text;

namespace WindingNotes.Solve;

/// <summary>
/// One winding's duty in a bus fault: its largest section current, the multiple of its rated
/// current, the peak it must withstand (the IEC 60076-5 asymmetry factor k·√2 of the loop), its
/// average temperature at the end of the fault where the conductor is known (IEC 60076-5) against
/// the limit for its material, and the IEEE through-fault category of its unit with the time that
/// category allows at this multiple.
/// </summary>
public sealed record WindingDuty(WindingNet Winding, string Section, double Current, double? Multiple, double AsymmetryFactor, double Peak)
{
    /// <summary>K; +∞ where the current density is so high that the formula has no finite end.</summary>
    public double? Temperature { get; init; }

    public double? TemperatureLimit { get; init; }

    public ConductorMaterial? Material { get; init; }

    /// <summary>A/m².</summary>
    public double? CurrentDensity { get; init; }

    /// <summary>I, II, III or IV, by the unit's kVA and phases; null without a rating.</summary>
    public string? Category { get; init; }

    /// <summary>The seconds the category allows at this multiple (infrequent faults).</summary>
    public double? AllowedSeconds { get; init; }

    /// <summary>The largest multiple of rated current a category I unit is built for.</summary>
    public double? MaxMultiple { get; init; }

    /// <summary>
    /// The seconds the category's frequent-fault curve allows at this multiple (IEEE C57.109): category I's
    /// one curve, categories II and III their own, category IV its one curve; null where the largest fault is unknown.
    /// </summary>
    public double? FrequentSeconds { get; init; }

    /// <summary>The largest through-fault multiple the frequent-fault curve of category II or III is drawn from.</summary>
    public double? LargestMultiple { get; init; }

    /// <summary>Past the frequent-fault curve but within the infrequent one (which says more where both are passed).</summary>
    public bool FrequentExceeded(double duration) => FrequentSeconds is { } s && duration > s * (1 + 1e-9) && !CategoryExceeded(duration);

    /// <summary>The peak the winding withstands as its line gives it ('peak-withstand'), A.</summary>
    public double? PeakWithstand { get; init; }

    /// <summary>The peak over the peak withstand; null where the winding gives none.</summary>
    public double? PeakDuty => PeakWithstand is { } w ? Peak / w : null;

    public bool PeakExceeded => PeakDuty is { } d && d > 1 + 1e-9;

    public bool ThermalExceeded => Temperature is { } t && TemperatureLimit is { } l && t > l;

    public bool CategoryExceeded(double duration) =>
        (AllowedSeconds is { } s && duration > s * (1 + 1e-9)) || (MaxMultiple is { } m && Multiple is { } x && x > m * (1 + 1e-9));
}

/// <summary>A bus fault studied once: at its maximum (cmax) or minimum (cmin) currents, or as loaded.</summary>
public sealed record ShortCircuitResult(BusFaultModel Fault, FaultStudyModel Study, bool Minimum)
{
    /// <summary>Minimum currents with the conductors at the end temperature: that temperature, K.</summary>
    public double? EndTemperature { get; init; }

    /// <summary>The impedance lines corrected by K_T (IEC 60909-0 network transformers), by their windings, with K_T.</summary>
    public ImmutableArray<(string Line, double Factor)> TransformerCorrections { get; init; } = [];

    /// <summary>Minimum currents: the supplies taken at their minimum fault level.</summary>
    public ImmutableArray<string> WeakestSources { get; init; } = [];

    /// <summary>κ by the ratio R/X at the fault (IEC 60909-0 method B) before any factor 1.15; equal to κ with 'at-fault'.</summary>
    public double KappaAtFault { get; init; }

    /// <summary>A meshed network whose every branch has R/X below 0.3: κ takes no factor 1.15.</summary>
    public bool KappaExempt { get; init; }

    /// <summary>Method C: the loop's impedance at the equivalent frequency, ohm, and that frequency, Hz.</summary>
    public Complex? EquivalentImpedance { get; init; }

    public double EquivalentFrequency { get; init; }

    /// <summary>Method C: R/X = (Rc/Xc)·(fc/f).</summary>
    public double? EquivalentRX { get; init; }

    /// <summary>The voltage factor c of the equivalent source; 1 as loaded.</summary>
    public double VoltageFactor { get; init; } = 1;

    /// <summary>The nominal line-to-line voltage at the bus, V, and where it comes from.</summary>
    public double Nominal { get; init; }

    public string NominalFrom { get; init; } = "";

    /// <summary>Currents from each line into the fault (a, b, c as the bus-fault line names them) and the current into earth.</summary>
    public ImmutableArray<Complex> LineCurrents { get; init; } = [];

    public Complex EarthCurrent { get; init; }

    /// <summary>Line-to-earth voltages at the bus during the fault and before it.</summary>
    public ImmutableArray<Complex> LineVoltages { get; init; } = [];

    public ImmutableArray<Complex> PreFault { get; init; } = [];

    public Sequence Currents { get; init; } = new(0, 0, 0);

    public Sequence Voltages { get; init; } = new(0, 0, 0);

    /// <summary>I″k: the largest current in a faulted line, rms.</summary>
    public double Initial { get; init; }

    /// <summary>The positive-sequence short-circuit impedance at the bus, ohm, whose R/X sets κ.</summary>
    public Complex Z1 { get; init; }

    public double Kappa { get; init; }

    public double Peak { get; init; }

    /// <summary>The peak by the IEC 60076-5 factor k·√2 of the same R/X, for comparison.</summary>
    public double Peak60076 { get; init; }

    public double ThermalFactorM { get; init; }

    public double Thermal { get; init; }

    /// <summary>Each neutral-grounding impedance's current, voltage and I²t in the fault (GroundingDuty.cs).</summary>
    public ImmutableArray<GroundingDuty> Groundings { get; init; } = [];

    /// <summary>The DC component's time constant X/(ωR), s; +∞ for a loop without resistance.</summary>
    public double DcTimeConstant { get; init; }

    /// <summary>Faults to earth only: the highest sound line's voltage to earth over its voltage before the fault (IEC 60071-1).</summary>
    public double? EarthFaultFactor { get; init; }

    public ImmutableArray<WindingDuty> Duties { get; init; } = [];

    public string Extreme => Study.Method == FaultMethod.AsLoaded ? "as loaded" : Minimum ? "minimum" : "maximum";

    public double RX => Z1.Imaginary > 0 ? Z1.Real / Z1.Imaginary : double.PositiveInfinity;

    /// <summary>Whether a winding's duty passes a limit judged: its peak withstand, its temperature, or its category's infrequent- or frequent-fault time.</summary>
    public bool Exceeds(WindingDuty d) => d.PeakExceeded || d.ThermalExceeded || d.CategoryExceeded(Study.Duration) || d.FrequentExceeded(Study.Duration);

    /// <summary>
    /// The same fault's study with the same values, its lists compared by their elements (a record
    /// compares them by reference). Every property is named here: ResultEqualityTests keeps the list whole.
    /// </summary>
    public bool Equals(ShortCircuitResult? other) => other is not null && (ReferenceEquals(this, other) ||
        Fault == other.Fault && Study == other.Study && Minimum == other.Minimum && EndTemperature == other.EndTemperature
        && KappaAtFault.Equals(other.KappaAtFault) && KappaExempt == other.KappaExempt && EquivalentImpedance.Equals(other.EquivalentImpedance)
        && EquivalentFrequency.Equals(other.EquivalentFrequency) && EquivalentRX.Equals(other.EquivalentRX) && VoltageFactor.Equals(other.VoltageFactor)
        && Nominal.Equals(other.Nominal) && NominalFrom == other.NominalFrom && EarthCurrent.Equals(other.EarthCurrent)
        && Currents == other.Currents && Voltages == other.Voltages && Initial.Equals(other.Initial) && Z1.Equals(other.Z1)
        && Kappa.Equals(other.Kappa) && Peak.Equals(other.Peak) && Peak60076.Equals(other.Peak60076) && ThermalFactorM.Equals(other.ThermalFactorM)
        && Thermal.Equals(other.Thermal) && DcTimeConstant.Equals(other.DcTimeConstant) && EarthFaultFactor.Equals(other.EarthFaultFactor)
        && Sequences.Equal(TransformerCorrections, other.TransformerCorrections) && Sequences.Equal(WeakestSources, other.WeakestSources)
        && Sequences.Equal(LineCurrents, other.LineCurrents) && Sequences.Equal(LineVoltages, other.LineVoltages) && Sequences.Equal(PreFault, other.PreFault)
        && Sequences.Equal(Groundings, other.Groundings) && Sequences.Equal(Duties, other.Duties));

    public override int GetHashCode() => HashCode.Combine(Fault, Minimum, Initial);
}

/// <summary>
/// Bus faults solved in the phase domain by the same solver. Each fault branch is a source of no
/// EMF with the branch's impedance, added to a copy of the network, so the unbalanced fault needs
/// no sequence networks: the sequence components are taken from the phase results afterwards.
/// With the equivalent voltage source (IEC 60909-0) loads are left out and every supply's EMF is
/// scaled so that the bus stands at c·Un/√3 before the fault (for a network without loads the same
/// currents as the standard's single source at the fault, as the circuit is linear); shunt branches
/// of the transformers stay as the file gives them (the zero-sequence path of a three-limb core is
/// one). As loaded, the supplies are as written and constant-power and constant-current loads
/// become the impedance that draws their pre-fault power at their pre-fault voltage (common practice).
/// </summary>
public static class FaultStudy
{
    public static ImmutableArray<CaseResult> Run(Network network, Solution normal, DiagnosticBag diagnostics, CancellationToken cancel)
    {
        var model = network.Model;
        if (model.BusFaults.IsEmpty) return [];
        var study = model.FaultStudy;
        var cases = ImmutableArray.CreateBuilder<CaseResult>();
        Solution? noLoad = null;
        Network? hotNetwork = null;
        // K_T on the network transformers (equivalent source only): the study's networks are built from the corrected model.
        var corrections = study.TransformerCorrection && study.Method == FaultMethod.EquivalentSource ? Corrections(model) : [];
        var corrected = corrections.IsEmpty ? model : Corrected(model, corrections);
        var strongNetwork = corrections.IsEmpty ? network : NetworkBuilder.Build(corrected);
        foreach (var fault in model.BusFaults)
        {
            cancel.ThrowIfCancellationRequested();
            var bus = fault.Lines.Select(l => network.Node(l.Name)).ToArray();
            var earth = network.EarthNode;
            // Lines joined together or to earth are no bus to fault: say so rather than short a node to itself.
            if (bus.Any(n => n < 0 || n == earth) || bus.Distinct().Count() < 3)
            {
                diagnostics.ReportBusFaultLines(fault);
                continue;
            }
            if (fault.ToEarth && earth < 0)
            {
                diagnostics.ReportBusFaultNoEarth(fault);
                continue;
            }
            Solution pre;
            if (study.Method == FaultMethod.AsLoaded) pre = normal;
            else pre = noLoad ??= NetworkSolver.Solve(network, CaseSpec.NoLoad, cancel);
            if (!pre.Solved || !pre.HasVectors) continue;
            var vpre = bus.Select(n => pre.Voltage(n) - pre.Voltage(earth)).ToArray();
            var seq = Sequence.Of(vpre[0], vpre[1], vpre[2]);
            var phaseVolts = Math.Max(seq.Positive.Magnitude, seq.Negative.Magnitude);
            if (phaseVolts <= 0)
            {
                diagnostics.ReportBusFaultDead(fault);
                continue;
            }
            var (nominal, from) = Nominal(network, fault, bus, phaseVolts);
            foreach (var minimum in Extremes(study))
            {
                var c = study.Method == FaultMethod.AsLoaded ? 1 : VoltageFactor(nominal, minimum, study.LowVoltageTolerance);
                var scale = study.Method == FaultMethod.AsLoaded ? 1 : c * nominal / Math.Sqrt(3) / phaseVolts;
                // Minimum currents on the network at its weakest (IEC 60909-0, from memory): each supply at its
                // 'minimum-fault-level', and the conductors hot: resistances given with a temperature (stated at
                // one, or from a conductor at 20 °C) corrected to the end temperature.
                var weakest = minimum && (study.EndTemperature is not null || model.Supplies.Any(s => s.MinimumImpedance is not null));
                var hot = weakest ? hotNetwork ??= NetworkBuilder.Build(Weakest(corrected)) : strongNetwork;
                var result = Solve(hot, pre, fault, bus, earth, minimum, c, scale, diagnostics, cancel);
                if (result is null) continue;
                var sc = result.ShortCircuit! with
                {
                    Nominal = nominal, NominalFrom = from, PreFault = [.. vpre.Select(v => v * scale)],
                    TransformerCorrections = [.. corrections.GroupBy(k => k.Line).Select(g => (g.Key, g.First().Factor))],
                    EndTemperature = weakest ? study.EndTemperature : null,
                    WeakestSources = !weakest ? [] : [.. model.Supplies.Where(s => s.MinimumImpedance is not null).Select(s => model.ThreePhase.Supplies.FirstOrDefault(t => Phases.All(t.Name).Contains(s.Name))?.Name ?? s.Name).Distinct()],
                };
                if (study.EquivalentFrequency) sc = Equivalent(hot, sc, fault, bus, earth, minimum, c, scale, cancel);
                sc = Finish(network, sc, result, model.Frequency, vpre, scale);
                // The case keeps the network as written (its fault branches and hot resistances are the solver's business),
                // so what reads it beside the normal case (the phasor diagram's voltage levels) finds the same nodes.
                cases.Add(result with { ShortCircuit = sc, Solution = result.Solution.Compact() with { Network = network } });
            }
        }
        var studied = Frequent(network, cases.ToImmutable());
        foreach (var c in studied) ReportDuty(c.ShortCircuit!, diagnostics);
        return studied;
    }

    /// <summary>
    /// The frequent-fault limits of IEEE C57.109 (from memory): the largest through-fault multiple of a
    /// category II winding is 1/Zt, its unit's own impedance (<see cref="ImpedanceMultiple"/>); of a
    /// category III winding 1/(Zt + Zs), the system's impedance included, which is the largest multiple
    /// the file's maximum-current studies drive through it (no larger than 1/Zt): a file that faults no
    /// terminal of the unit understates it, which shortens the time allowed (it errs safe). Category IV
    /// takes its largest multiple as category III does, and its one curve for all faults.
    /// </summary>
    private static ImmutableArray<CaseResult> Frequent(Network network, ImmutableArray<CaseResult> cases)
    {
        var studied = new Dictionary<string, double>();
        foreach (var d in cases.Where(c => !c.ShortCircuit!.Minimum).SelectMany(c => c.ShortCircuit!.Duties))
            if (d.Multiple is { } m) studied[d.Winding.Name] = Math.Max(m, studied.GetValueOrDefault(d.Winding.Name));
        return [.. cases.Select(c => c with
        {
            ShortCircuit = c.ShortCircuit! with
            {
                Duties = [.. c.ShortCircuit.Duties.Select(d =>
                {
                    if (d.Category is not { } category || d.Multiple is not { } m) return d;
                    if (category == "I" || m < CurvesFrom) return d with { FrequentSeconds = d.AllowedSeconds };
                    var own = ImpedanceMultiple(network, d.Winding);
                    double? largest = category switch
                    {
                        "II" => own,
                        _ => studied.TryGetValue(d.Winding.Name, out var s) ? own is { } o ? Math.Min(s, o) : s : own,
                    };
                    if (largest is not { } l) return d;
                    var frequent = FrequentSeconds(category, m, l);
                    // Category IV has one curve for frequent and infrequent faults alike (as category I).
                    return d with { LargestMultiple = l, FrequentSeconds = frequent, AllowedSeconds = category == "IV" ? frequent : d.AllowedSeconds };
                })],
            },
        })];
    }

    /// <summary>
    /// The frequent-fault curve of categories II, III and IV (IEEE C57.109, from memory): I²t = K with K set by
    /// the largest through-fault multiple at 2 s, from 70 % (II) or 50 % (III and IV) of that multiple up; below it
    /// the thermal curve I²t = 1250 (multiples of rated current, seconds), which also bounds it where the
    /// largest multiple passes 25. At or above the largest multiple (a voltage factor c above 1 can reach
    /// past it) the curve's end, 2 s.
    /// </summary>
    public static double FrequentSeconds(string category, double multiple, double largest)
    {
        var from = category == "II" ? 0.7 : 0.5;
        var thermal = 1250 / (multiple * multiple);
        if (multiple >= largest) return Math.Min(2, thermal);
        return multiple >= from * largest ? Math.Min(2 * largest * largest / (multiple * multiple), thermal) : thermal;
    }

    /// <summary>
    /// The largest multiple of rated current a winding carries in a fault at its unit's terminals on an
    /// infinite bus, 1/Zt: of the impedance lines that name the whole winding, the one of least impedance.
    /// A line gives Z in ohms referred to its first winding (per unit times V1²/S); referred to this
    /// winding by the rated voltages, I = Vw/|Zw| = V1²/(|Z|·Vw). Null without such a line or the ratings.
    /// </summary>
    public static double? ImpedanceMultiple(Network network, WindingNet w)
    {
        if (w.RatedVoltage is not { } vw || w.RatedCurrent is not { } ir || ir <= 0) return null;
        double? best = null;
        foreach (var line in network.Model.Impedances.Where(z => (z.First.Winding == w.Name && z.First.From is null) || (z.Second.Winding == w.Name && z.Second.From is null)))
        {
            if (network.Windings.FirstOrDefault(x => x.Name == line.First.Winding) is not { RatedVoltage: { } v1 } first) continue;
            var ohms = line.Value.Magnitude;
            if (line.PerUnit)
            {
                if ((line.Base ?? network.Cores[first.Core].Source.Rating) is not { } s || s <= 0) continue;
                ohms *= v1 * v1 / s;
            }
            if (ohms <= 0) continue;
            var m = v1 * v1 / (ohms * vw) / ir;
            best = Math.Max(best ?? 0, m);
        }
        return best;
    }

    /// <summary>
    /// Method C of IEC 60909-0 (from memory): the loop's impedance Zc = Rc + jXc at the equivalent
    /// frequency fc (20 Hz for a 50 Hz system, 24 Hz for 60 Hz, that is 0.4·f), by the same solver on
    /// the network built at fc (reactances follow the frequency, resistances stay); R/X = (Rc/Xc)·(fc/f).
    /// </summary>
    private static ShortCircuitResult Equivalent(Network network, ShortCircuitResult sc, BusFaultModel fault, int[] bus, int earth, bool minimum, double c, double scale,
        CancellationToken cancel)
    {
        var model = network.Model;
        var fc = model.Frequency * 0.4;
        var atFc = NetworkBuilder.Build(model with { RatedFrequency = model.RatedFrequency, Frequency = fc });
        var pre = NetworkSolver.Solve(atFc, CaseSpec.NoLoad, cancel);
        if (!pre.Solved || !pre.HasVectors) return sc;
        // Its messages are the main solve's over again: kept apart.
        var quiet = new DiagnosticBag();
        var bolted = Solve(atFc, pre, fault with { Kind = BusFaultKind.ThreePhase, Impedance = 0 }, bus, earth, minimum, c, scale, quiet, cancel);
        if (bolted?.ShortCircuit is not { } b || b.Z1.Imaginary <= 0) return sc;
        return sc with { EquivalentImpedance = b.Z1, EquivalentFrequency = fc, EquivalentRX = b.Z1.Real / b.Z1.Imaginary * (fc / model.Frequency) };
    }

    /// <summary>
    /// Whether every branch has R/X below 0.3, so a meshed network's κ needs no factor 1.15 (IEC 60909-0,
    /// from memory). The branches: each supply's internal impedance; each 'impedance' line, by its own
    /// R/X where neither winding states a resistance or conductor (else the branch's ratio is the
    /// windings' resistance against the line's reactance, which is not read here: not exempt, which errs
    /// high); as loaded, each load by its pre-fault P/Q.
    /// </summary>
    public static bool MeshedExempt(Network network)
    {
        const double limit = 0.3;
        var model = network.Model;
        // A neutral or neutral-grounding impedance carries no positive-sequence current, which is what κ is of.
        foreach (var s in network.Supplies.Where(s => s.Source.IsSource))
            if (s.Impedance != Complex.Zero && !(s.Impedance.Imaginary > 0 && s.Impedance.Real / s.Impedance.Imaginary < limit)) return false;
        bool States(string winding) => model.Windings.FirstOrDefault(w => w.Name == winding) is { } w && (w.Resistance is not null || w.Conductor is not null);
        foreach (var z in model.Impedances)
        {
            if (States(z.First.Winding) || States(z.Second.Winding)) return false;
            double? rx = z.Value.Imaginary != 0 ? z.Value.Real / z.Value.Imaginary : z.XR is { } xr && xr > 0 ? 1 / xr : null;
            if (rx is not { } r || r < 0 || r >= limit) return false;
        }
        if (model.FaultStudy.Method == FaultMethod.AsLoaded)
            foreach (var l in network.Loads)
                if (!(l.Source.S0.Imaginary > 0 && l.Source.S0.Real / l.Source.S0.Imaginary < limit)) return false;
        return true;
    }

    /// <summary>
    /// K_T = 0.95·cmax/(1 + 0.6·xT) of IEC 60909-0 (from memory) for each impedance line between two whole
    /// windings: every unit here joins two networks (no generator's unit transformer is modelled), so each
    /// is a network transformer, and a three-winding unit's pairs each take their own (K_TAB, K_TAC, K_TBC).
    /// xT is the line's reactance per unit on its own base (per unit as given, or ohms over V1²/S); a bare
    /// magnitude counts whole as reactance. cmax is that of the lower of the two windings' nominal
    /// line-to-line voltages. The factor scales the line as given (R and X); resistances stated on the
    /// windings are not scaled. Lines without a base (ohms on a core with no rating) are left as written.
    /// </summary>
    public static ImmutableArray<(ImpedanceModel Impedance, string Line, double Factor)> Corrections(Model.Model model)
    {
        var result = ImmutableArray.CreateBuilder<(ImpedanceModel, string, double)>();
        foreach (var z in model.Impedances.Where(z => z.First.From is null && z.Second.From is null))
        {
            var first = model.Windings.FirstOrDefault(w => w.Name == z.First.Winding);
            var second = model.Windings.FirstOrDefault(w => w.Name == z.Second.Winding);
            if (first?.Rated is not { } v1 || second?.Rated is not { } v2) continue;
            var magnitude = z.Value.Magnitude;
            var x = z.Value.Imaginary != 0 ? z.Value.Imaginary : z.XR is { } xr ? magnitude * xr / Math.Sqrt(1 + xr * xr) : magnitude;
            if (!z.PerUnit)
            {
                if ((z.Base ?? model.Cores.FirstOrDefault(k => k.Name == first.Core)?.Rating) is not { } s || s <= 0) continue;
                x /= v1 * v1 / s;
            }
            var nominal = Math.Min(LineVoltage(model, first.Name, v1), LineVoltage(model, second.Name, v2));
            var factor = 0.95 * VoltageFactor(nominal, minimum: false, model.FaultStudy.LowVoltageTolerance) / (1 + 0.6 * x);
            result.Add((z, $"{Unphased(model, z.First.Winding)} {Unphased(model, z.Second.Winding)}", factor));
        }
        return result.ToImmutable();
    }

    private static Model.Model Corrected(Model.Model model, ImmutableArray<(ImpedanceModel Impedance, string Line, double Factor)> corrections) => model with
    {
        Impedances = [.. model.Impedances.Select(z => corrections.FirstOrDefault(k => ReferenceEquals(k.Impedance, z)) is { Impedance: not null } k ? z with { Value = z.Value * k.Factor } : z)],
    };

    /// <summary>A winding's nominal line-to-line voltage: a wye, zigzag or series phase's rated voltage times √3.</summary>
    private static double LineVoltage(Model.Model model, string winding, double rated) =>
        model.ThreePhase.Windings.FirstOrDefault(t => t.PhaseWindings.Contains(winding)) is { } t && t.Connection != PhaseConnection.Delta && t.Connection != PhaseConnection.Ends
            ? rated * Math.Sqrt(3) : rated;

    private static string Unphased(Model.Model model, string winding) =>
        model.ThreePhase.Windings.FirstOrDefault(t => t.PhaseWindings.Contains(winding))?.Name ?? winding;

    /// <summary>The model at its weakest: supplies at their minimum fault level, the temperature at the end of the fault.</summary>
    private static Model.Model Weakest(Model.Model model) => model with
    {
        Supplies = [.. model.Supplies.Select(s => s.MinimumImpedance is { } z ? s with { Impedance = z, FaultCurrent = null, FaultPower = null } : s)],
        Temperature = model.FaultStudy.EndTemperature ?? model.Temperature,
    };

    private static IEnumerable<bool> Extremes(FaultStudyModel study)
    {
        if (study.Method == FaultMethod.AsLoaded || study.Maximum) yield return false;
        if (study.Method == FaultMethod.EquivalentSource && study.Minimum) yield return true;
    }

    /// <summary>
    /// The voltage factor c of IEC 60909-0:2016 Table 1 (from memory): up to 1 kV cmax 1.05 and
    /// cmin 0.95 for systems of +6 % tolerance, 1.10 and 0.90 for +10 %; above 1 kV cmax 1.10, cmin 1.00.
    /// </summary>
    public static double VoltageFactor(double nominal, bool minimum, double lowVoltageTolerance)
    {
        if (nominal > 1000) return minimum ? 1.00 : 1.10;
        var six = lowVoltageTolerance < 0.08;
        return minimum ? (six ? 0.95 : 0.90) : (six ? 1.05 : 1.10);
    }

    /// <summary>κ = 1.02 + 0.98·e^(−3R/X) (IEC 60909-0, formula from memory): 2 for a loop without resistance.</summary>
    public static double Kappa(double rx) => double.IsPositiveInfinity(rx) ? 1.02 : 1.02 + 0.98 * Math.Exp(-3 * Math.Max(rx, 0));

    /// <summary>
    /// κ of a meshed network by method B of IEC 60909-0 (from memory): 1.15 times κ of the ratio R/X
    /// at the fault, at most 1.8 in low-voltage networks (up to 1 kV) and 2.0 above.
    /// </summary>
    public static double MeshedKappa(double kappaAtFault, double nominal) => Math.Min(1.15 * kappaAtFault, nominal > 1000 ? 2.0 : 1.8);

    /// <summary>
    /// m of the thermal equivalent current Ith = I″k·√(m + n) (IEC 60909-0, from memory):
    /// m = (e^(4·f·Tk·ln(κ − 1)) − 1)/(2·f·Tk·ln(κ − 1)); n = 1 far from generators.
    /// </summary>
    public static double ThermalM(double kappa, double frequency, double duration)
    {
        if (kappa <= 1.0 + 1e-12) return 0;
        var ln = Math.Log(kappa - 1);
        var ft = frequency * duration;
        return (Math.Exp(4 * ft * ln) - 1) / (2 * ft * ln);
    }

    /// <summary>
    /// The asymmetry factor k·√2 of IEC 60076-5 for the windings' dynamic duty: the formula of
    /// <see cref="Faults.PeakFactor"/> up to X/R 14, 2.55 above (the standard's table, from memory).
    /// </summary>
    public static double AsymmetryFactor(double xr) => xr > 14 ? 2.55 : Faults.PeakFactor(xr);

    /// <summary>
    /// Average winding temperature (K) after a short circuit of <paramref name="seconds"/> at current
    /// density J from θ0 (IEC 60076-5, from memory): copper θ1 = θ0 + 2(θ0 + 235)/(106000/(J²t) − 1),
    /// aluminium θ1 = θ0 + 2(θ0 + 225)/(45700/(J²t) − 1), J in A/mm², θ in °C. +∞ where J²t reaches the constant.
    /// </summary>
    public static double WindingTemperature(ConductorMaterial material, double density, double seconds, double initial)
    {
        var j = density / 1e6;
        var theta0 = initial - 273.15;
        var (k, constant) = material == ConductorMaterial.Copper ? (235.0, 106000.0) : (225.0, 45700.0);
        var ratio = constant / (j * j * seconds) - 1;
        if (!(ratio > 0)) return double.PositiveInfinity;
        return theta0 + 2 * (theta0 + k) / ratio + 273.15;
    }

    /// <summary>The highest average winding temperature after a short circuit: 250 °C copper, 200 °C aluminium (IEC 60076-5, oil-immersed, from memory).</summary>
    public static double TemperatureLimit(ConductorMaterial material) => (material == ConductorMaterial.Copper ? 250 : 200) + 273.15;

    /// <summary>
    /// IEEE C57.12.00 through-fault category by kVA (from memory): single-phase I 5–500, II 501–1667,
    /// III 1668–10 000, IV above; three-phase I 15–500, II 501–5000, III 5001–30 000, IV above.
    /// </summary>
    public static string Category(double kva, bool threePhase) =>
        threePhase
            ? kva <= 500 ? "I" : kva <= 5000 ? "II" : kva <= 30000 ? "III" : "IV"
            : kva <= 500 ? "I" : kva <= 1667 ? "II" : kva <= 10000 ? "III" : "IV";

    /// <summary>
    /// The time a category allows at a multiple M of rated current for an infrequent fault (from
    /// memory): categories I to III t = 1250/M² s (I²t = 1250 in multiples of rated current, IEEE
    /// C57.12.00 and the thermal curve of C57.109, which is the infrequent-fault curve of II and III);
    /// category IV 2 s at the current the impedances allow, until its one curve (the frequent-fault curve,
    /// <see cref="FrequentSeconds"/>) replaces it once the largest through-fault multiple is known.
    /// </summary>
    public static double? AllowedSeconds(string category, double multiple) =>
        multiple < CurvesFrom ? null : category != "IV" ? 1250 / (multiple * multiple) : 2;

    /// <summary>
    /// The multiple of rated current the through-fault curves of IEEE C57.109 start at, for every
    /// category (from memory: the curves are drawn from 2 times rated current up). Below it they say
    /// nothing: a winding that carries less has no time allowed, and its duty is not judged on them.
    /// </summary>
    public const double CurvesFrom = 2;

    /// <summary>The largest symmetrical multiple a category I unit is built for, by kVA (IEEE C57.12.00, from memory): 40, 35 or 25.</summary>
    public static double CategoryOneMultiple(double kva, bool threePhase) =>
        threePhase ? kva <= 75 ? 40 : kva <= 300 ? 35 : 25
                   : kva <= 25 ? 40 : kva <= 110 ? 35 : 25;

    /// <summary>
    /// Un: as the file states it, else the three-phase supply or winding whose line terminals are the
    /// bus (a wye or zigzag winding's phase voltage times √3), else the voltage there before the fault.
    /// </summary>
    private static (double, string) Nominal(Network network, BusFaultModel fault, int[] bus, double phaseVolts)
    {
        if (fault.Nominal is { } n) return (n, "as stated");
        var model = network.Model;
        var set = bus.ToHashSet();
        bool IsBus(ImmutableArray<NodeRef> lines) => lines.Length == 3 && lines.Select(l => network.Node(l.Name)).ToHashSet().SetEquals(set);
        if (model.ThreePhase.Supplies.FirstOrDefault(s => IsBus(s.LineTerminals)) is { } supply) return (supply.LineVoltage, $"supply '{supply.Name}'");
        foreach (var w in model.ThreePhase.Windings.Where(w => IsBus(w.LineTerminals)))
        {
            var phase = model.Windings.FirstOrDefault(x => x.Name == w.PhaseWindings[0])?.Rated;
            if (phase is null || w.Connection is PhaseConnection.Series or PhaseConnection.Ends) continue;
            return (w.Connection == PhaseConnection.Delta ? phase.Value : phase.Value * Math.Sqrt(3), $"winding '{w.Name}'");
        }
        return (phaseVolts * Math.Sqrt(3), "the voltage before the fault");
    }

    private static CaseResult? Solve(Network network, Solution pre, BusFaultModel fault, int[] bus, int earth, bool minimum, double c, double scale,
        DiagnosticBag diagnostics, CancellationToken cancel)
    {
        var study = network.Model.FaultStudy;
        var asLoaded = study.Method == FaultMethod.AsLoaded;
        var supplies = network.Supplies.Select(s => s with { Voltage = s.Voltage * scale }).ToList();
        var count = supplies.Count;
        var loads = asLoaded ? network.Loads.Select(l => AsImpedance(l, pre)).ToImmutableArray() : network.Loads;
        var name = $"bus-fault {fault.Name} {(asLoaded ? "as-loaded" : minimum ? "minimum" : "maximum")}";
        // The first branch is the case's fault, so the solver solves only the independent part the
        // bus is in (a file of many units stays linear); the others are sources of no EMF beside it.
        Solution SolveWith(IReadOnlyList<(int P, int Q, Complex Z)> branches)
        {
            var first = branches[0];
            var f = new FaultModel(fault.Name, fault.NameSpan, fault.Line, new NodeRef(network.Nodes[first.P].Points[0], fault.NameSpan),
                new NodeRef(network.Nodes[first.Q].Points[0], fault.NameSpan), first.Z);
            var faulted = network with
            {
                Supplies = [.. supplies, .. branches.Skip(1).Select((b, i) => new SupplyNet(count + i, Branch(fault, i + 1), b.P, b.Q, 0, b.Z))],
                Loads = loads,
            };
            return NetworkSolver.Solve(faulted, new CaseSpec(name, WithoutLoads: !asLoaded, Fault: f), cancel);
        }
        var solution = SolveWith([.. Branches(fault, bus, earth)]);
        diagnostics.AddRange(solution.Diagnostics.Where(d => d.Code != "load-without-voltage"));
        if (!solution.Solved) return null;

        // The positive-sequence impedance at the bus, from a bolted three-phase fault on the same network (Thévenin).
        var bolted = fault.Kind == BusFaultKind.ThreePhase && fault.Impedance == Complex.Zero ? solution
            : SolveWith([.. Branches(fault with { Kind = BusFaultKind.ThreePhase, Impedance = 0 }, bus, earth)]);
        if (!bolted.Solved) return null;
        var vpre = Sequence.Of(pre.Voltage(bus[0]) - pre.Voltage(earth), pre.Voltage(bus[1]) - pre.Voltage(earth), pre.Voltage(bus[2]) - pre.Voltage(earth));
        var boltedLines = LineCurrents(bolted, count, bus, earth).Lines;
        var i1 = Sequence.Of(boltedLines[0], boltedLines[1], boltedLines[2]);
        var (v1, i1p) = vpre.Positive.Magnitude >= vpre.Negative.Magnitude ? (vpre.Positive, i1.Positive) : (vpre.Negative, i1.Negative);
        var z1 = i1p == Complex.Zero ? Complex.Zero : v1 * scale / i1p;

        // The case is a bus fault's, not a two-node fault's: the study's own results say what it is.
        var spec = solution.Case with { Fault = null };
        var result = Results.Compute(solution, null) with { Case = spec };
        var (lines, earthCurrent) = LineCurrents(solution, count, bus, earth);
        var during = bus.Select(n => solution.Voltage(n) - solution.Voltage(earth)).ToArray();
        var sc = new ShortCircuitResult(fault, study, minimum && !asLoaded)
        {
            VoltageFactor = c,
            LineCurrents = [.. lines],
            EarthCurrent = earthCurrent,
            LineVoltages = [.. during],
            Currents = Cleaned(Sequence.Of(lines[0], lines[1], lines[2]), lines),
            Voltages = Cleaned(Sequence.Of(during[0], during[1], during[2]), [.. bus.Select(n => pre.Voltage(n) * scale)]),
            Z1 = z1,
        };
        return result with { Supplies = [.. result.Supplies.Where(s => s.Supply.Index < count)], ShortCircuit = sc, Solution = solution with { Case = spec } };
    }

    /// <summary>Components left by rounding (a picoampere of negative sequence in a balanced fault) are zero.</summary>
    private static Sequence Cleaned(Sequence s, Complex[] phases)
    {
        var scale = phases.Max(p => p.Magnitude);
        return new(Numbers.Clean(s.Zero, scale), Numbers.Clean(s.Positive, scale), Numbers.Clean(s.Negative, scale));
    }

    /// <summary>A fault branch as a source of no EMF, named for the solver's messages.</summary>
    private static SupplyModel Branch(BusFaultModel f, int i) => new($"{f.Name} branch {i + 1}", f.NameSpan, f.Line, f.Lines[0], f.Lines[0], 0);

    /// <summary>
    /// The fault's branches as (from, to, impedance). Three-phase: the star of Zf a line is a delta of
    /// 3·Zf (star–delta, exact), so no star point is needed. Double-line-to-ground: the star of Zf, Zf
    /// and Ze (to earth) is likewise a delta; where Ze or Zf is zero the star collapses to fewer branches.
    /// </summary>
    private static IEnumerable<(int P, int Q, Complex Z)> Branches(BusFaultModel f, int[] bus, int earth)
    {
        var (zf, ze) = (f.Impedance, f.EarthImpedance);
        switch (f.Kind)
        {
            case BusFaultKind.ThreePhase:
                if (zf == Complex.Zero) return [(bus[0], bus[1], 0), (bus[1], bus[2], 0)];
                return [(bus[0], bus[1], 3 * zf), (bus[1], bus[2], 3 * zf), (bus[2], bus[0], 3 * zf)];
            case BusFaultKind.LineToGround:
                return [(bus[0], earth, zf + ze)];
            case BusFaultKind.LineToLine:
                return [(bus[1], bus[2], zf)];
            default:
                if (ze == Complex.Zero) return [(bus[1], earth, zf), (bus[2], earth, zf)];
                if (zf == Complex.Zero) return [(bus[1], bus[2], 0), (bus[1], earth, 2 * ze), (bus[2], earth, 2 * ze)];
                var sum = zf * zf + 2 * zf * ze;
                return [(bus[1], bus[2], sum / ze), (bus[1], earth, sum / zf), (bus[2], earth, sum / zf)];
        }
    }

    /// <summary>
    /// The current from each line into the fault, and into earth, from the branch sources (index ≥
    /// <paramref name="first"/>): a source's current leaves its positive node into the network, so the
    /// current through the branch from P to Q is minus it.
    /// </summary>
    private static (Complex[] Lines, Complex Earth) LineCurrents(Solution s, int first, int[] bus, int earth)
    {
        var lines = new Complex[3];
        var toEarth = Complex.Zero;
        var f = s.Case.Fault!;
        // The case's fault carries its current from its first node to its second.
        var branches = s.Network.Supplies.Skip(first).Select(b => (P: b.NodeP, Q: b.NodeQ, I: -s.SupplyCurrents[b.Index]))
            .Prepend((P: s.Network.Node(f.A.Name), Q: s.Network.Node(f.B.Name), I: s.FaultCurrent));
        foreach (var (p0, q0, i) in branches)
        {
            var b = (NodeP: p0, NodeQ: q0);
            for (var p = 0; p < 3; p++)
            {
                if (b.NodeP == bus[p]) lines[p] += i;
                if (b.NodeQ == bus[p]) lines[p] -= i;
            }
            if (b.NodeQ == earth) toEarth += i;
        }
        return (lines, toEarth);
    }

    /// <summary>A constant-power or constant-current load as the impedance drawing its pre-fault power at its pre-fault voltage (common practice).</summary>
    internal static LoadNet AsImpedance(LoadNet l, Solution pre)
    {
        if (l.Source.Exponent == 2) return l;
        var v = pre.LoadVoltage(l);
        var s = v * Complex.Conjugate(pre.LoadCurrents[l.Index]);
        return v.Magnitude > 0 ? l with { Source = l.Source with { Behaviour = LoadBehaviour.ConstantImpedance, S0 = s, V0 = v.Magnitude } } : l;
    }

    private static ShortCircuitResult Finish(Network network, ShortCircuitResult sc, CaseResult result, double frequency, Complex[] vpre, double scale)
    {
        var model = network.Model;
        var faulted = sc.Fault.Kind switch
        {
            BusFaultKind.LineToGround => new[] { 0 },
            BusFaultKind.ThreePhase => [0, 1, 2],
            _ => [1, 2],
        };
        var initial = faulted.Max(p => sc.LineCurrents[p].Magnitude);
        var rx = sc.RX;
        var xr = rx > 0 ? 1 / rx : double.PositiveInfinity;
        var atFault = Kappa(rx);
        var exempt = sc.Study.Meshed && MeshedExempt(network);
        var kappa = sc.EquivalentRX is { } rxc ? Kappa(rxc) : sc.Study.Meshed && !exempt ? MeshedKappa(atFault, sc.Nominal) : atFault;
        var m = ThermalM(kappa, frequency, sc.Study.Duration);
        double? earthFactor = null;
        if (sc.Fault.ToEarth)
        {
            var sound = sc.Fault.Kind == BusFaultKind.LineToGround ? new[] { 1, 2 } : [0];
            earthFactor = sound.Max(p => (vpre[p] * scale).Magnitude > 0 ? sc.LineVoltages[p].Magnitude / (vpre[p] * scale).Magnitude : 0);
        }
        var asym = AsymmetryFactor(xr);
        var duties = ImmutableArray.CreateBuilder<WindingDuty>();
        foreach (var group in result.Sections.GroupBy(s => s.Winding.Index))
        {
            var worst = group.MaxBy(s => s.Current.Magnitude)!;
            var w = worst.Winding;
            var i = worst.Current.Magnitude;
            var duty = new WindingDuty(w, worst.Section.Name, i, w.RatedCurrent is { } r && r > 0 ? i / r : null, asym, asym * i)
            {
                PeakWithstand = w.Source.PeakWithstand,
            };
            if (w.Source.Conductor is { } conductor)
            {
                var density = i / conductor.Area;
                duty = duty with
                {
                    Material = conductor.Material,
                    CurrentDensity = density,
                    Temperature = WindingTemperature(conductor.Material, density, sc.Study.Duration, sc.Study.InitialTemperature),
                    TemperatureLimit = TemperatureLimit(conductor.Material),
                };
            }
            if (UnitRating(network, w) is var (kva, threePhase) && duty.Multiple is { } multiple)
            {
                var category = Category(kva, threePhase);
                duty = duty with
                {
                    Category = category,
                    AllowedSeconds = AllowedSeconds(category, multiple),
                    MaxMultiple = category == "I" ? CategoryOneMultiple(kva, threePhase) : null,
                };
            }
            duties.Add(duty);
        }
        return sc with
        {
            Initial = initial,
            Kappa = kappa,
            KappaAtFault = atFault,
            KappaExempt = exempt,
            Peak = kappa * Math.Sqrt(2) * initial,
            Peak60076 = asym * initial,
            ThermalFactorM = m,
            Thermal = initial * Math.Sqrt(m + 1),
            DcTimeConstant = rx > 0 && double.IsFinite(rx) ? 1 / (2 * Math.PI * frequency * rx) : double.PositiveInfinity,
            EarthFaultFactor = earthFactor,
            Duties = duties.ToImmutable(),
            Groundings = GroundingDuty.Of(model, result, sc.Study.Duration),
        };
    }

    /// <summary>The kVA of the unit a winding is on, and whether it is three-phase: a three-phase core's rating, else its core's.</summary>
    private static (double, bool)? UnitRating(Network network, WindingNet w)
    {
        var model = network.Model;
        if (model.ThreePhase.Windings.FirstOrDefault(t => t.PhaseWindings.Contains(w.Name)) is { } tw
            && model.ThreePhase.Cores.FirstOrDefault(k => k.Name == tw.Core)?.Rating is { } rating3)
            return (rating3 / 1000, true);
        return network.Cores[w.Core].Source.Rating is { } rating ? (rating / 1000, false) : null;
    }

    /// <summary>A warning at the winding's line where its duty passes a limit; and the caution on the fault's line.</summary>
    private static void ReportDuty(ShortCircuitResult sc, DiagnosticBag diagnostics)
    {
        // Windings of one unit carry the same multiple: of equals (to rounding), the first in the file.
        var rated = sc.Duties.Where(d => d.Multiple is not null).ToList();
        var top = rated.Count == 0 ? 0 : rated.Max(d => d.Multiple!.Value);
        var worst = rated.FirstOrDefault(d => d.Multiple!.Value >= top * (1 - 1e-9));
        // The caution once a fault: on its maximum study (or as loaded), the larger duty.
        if (!sc.Minimum || !sc.Study.Maximum) diagnostics.ReportBusFaultDuty(sc, worst);
        foreach (var d in sc.Duties)
        {
            if (d.PeakExceeded) diagnostics.ReportPeakAboveWithstand(sc, d);
            if (d.ThermalExceeded) diagnostics.ReportWindingHotAfterFault(sc, d);
            if (d.CategoryExceeded(sc.Study.Duration)) diagnostics.ReportThroughFaultCategory(sc, d);
            if (d.FrequentExceeded(sc.Study.Duration)) diagnostics.ReportFrequentFaultCurve(sc, d);
        }
        foreach (var g in sc.Groundings.Where(g => g.Exceeded)) diagnostics.ReportGroundingDuty(sc, g);
    }
}
