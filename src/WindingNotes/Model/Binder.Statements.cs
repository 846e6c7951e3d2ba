using System.Collections.Immutable;
using WindingNotes.Syntax;
using WindingNotes.Text;

namespace WindingNotes.Model;

// One method a statement: each reads its clauses and adds what it means to the model.
internal sealed partial class BindRun
{
    private readonly Dictionary<StatementKind, TextSpan> singletons = [];

    private void Bind(StatementSyntax s)
    {
        switch (s.Kind)
        {
            case StatementKind.Frequency:
                if (Once(s) && Real(s.Head.Value(), Dimension.Frequency, "the frequency", positive: true) is { } f)
                    model = model with { Frequency = f };
                break;
            case StatementKind.Temperature:
                if (Once(s) && Real(s.Head.Value(), Dimension.TemperatureDim, "the temperature", positive: true) is { } t)
                    model = model with { Temperature = t };
                break;
            case StatementKind.Core: BindCore(s); break;
            case StatementKind.Winding: BindWinding(s); break;
            case StatementKind.Tap or StatementKind.Brush: BindTap(s); break;
            case StatementKind.Impedance: BindImpedance(s); break;
            case StatementKind.NoLoad: BindNoLoad(s); break;
            case StatementKind.Join:
                var joined = s.Head.Names.Select(n => Node(n, s)).OfType<NodeRef>().ToImmutableArray();
                joins.Add(joined);
                break;
            case StatementKind.Ground: BindGround(s); break;
            case StatementKind.Supply: BindSupply(s); break;
            case StatementKind.Load: BindLoad(s); break;
            case StatementKind.Fault: BindFault(s); break;
            case StatementKind.Sweep: BindSweep(s); break;
            case StatementKind.Expect: BindExpect(s); break;
            case StatementKind.FailOn: Policy(s, failOn); break;
            case StatementKind.Acknowledge: Policy(s, acknowledged); break;
            case StatementKind.ThreePhaseSupply: BindThreePhaseSupply(s); break;
            case StatementKind.ThreePhaseLoad: BindThreePhaseLoad(s); break;
            case StatementKind.Thermal: BindThermal(s); break;
            case StatementKind.LoadCycle: BindLoadCycle(s); break;
            case StatementKind.CyclePoint: BindCyclePoint(s); break;
            case StatementKind.Capability: BindCapability(s); break;
            case StatementKind.TapChanger: BindTapChanger(s); break;
            case StatementKind.Find: BindFind(s); break;
            case StatementKind.FaultStudy: if (Once(s)) BindFaultStudy(s); break;
            case StatementKind.BusFault: BindBusFault(s); break;
            case StatementKind.Pair: BindPair(s); break;
        }
    }

    private readonly Dictionary<string, TextSpan> failOn = [], acknowledged = [];

    /// <summary>A 'fail-on' or 'acknowledge' line: the code it names, once.</summary>
    private void Policy(StatementSyntax s, Dictionary<string, TextSpan> codes)
    {
        if (s.Head.Word(_ => true) is not { } code) return;
        if (codes.TryGetValue(code.Text, out var first)) diagnostics.ReportDuplicateStatement(s.Keyword, first);
        else codes[code.Text] = s.Span;
    }

    private bool Once(StatementSyntax s)
    {
        if (singletons.TryGetValue(s.Kind, out var first))
        {
            diagnostics.ReportDuplicateStatement(s.Keyword, first);
            return false;
        }
        singletons[s.Kind] = s.Keyword.Span;
        return true;
    }

    private static string Label(StatementSyntax s) => $"{s.Keyword.Text} {s.Head.Name(0)?.Text}".TrimEnd();

    private void BindCore(StatementSyntax s)
    {
        var name = s.Head.Name(0)!;
        var core = new CoreModel(name.Text, name.Name.Span, s.Span)
        {
            Rating = Real(s.Value("rating"), Dimension.ApparentPower, $"the rating of {name.Text}", positive: true),
            Area = Real(s.Value("area"), Dimension.Area, $"the area of {name.Text}", positive: true),
            FluxLimit = Real(s.Value("flux-limit"), Dimension.FluxDensity, $"the flux limit of {name.Text}", positive: true),
            Frequency = Real(s.Value("frequency"), Dimension.Frequency, $"the rated frequency of {name.Text}", positive: true),
        };
        if (!BindThreePhaseCore(s, core)) cores.Add(core);
    }

    private void BindWinding(StatementSyntax s)
    {
        var name = s.Head.Name(0)!;
        var core = Resolve(s.Clause("on")?.Name(0), "a core", SymbolKind.Core);
        var ends = s.Clause("from");
        var turns = Turns(s.Value("turns"), $"the turns of {name.Text}");
        var rated = Real(s.Value("rated"), Dimension.Voltage, $"the rated voltage of {name.Text}", positive: true);
        if (s.Clause("turns") is null && s.Clause("rated") is null) diagnostics.ReportNoTurnsOrVoltage(name.Name);
        var resistance = s.Clause("resistance");
        var winding = new WindingModel(name.Text, name.Name.Span, s.Span, core?.Name ?? "",
            EndRef(ends?.Name(0)), EndRef(ends?.Name(1)))
        {
            Turns = turns,
            Rated = rated,
            Rating = Real(s.Value("rating"), Dimension.ApparentPower, $"the rating of {name.Text}", positive: true),
            RatedCurrent = Real(s.Value("rated-current"), Dimension.CurrentDim, $"the rated current of {name.Text}", positive: true),
            Resistance = NonNegative(resistance?.Value(0), Dimension.Impedance, $"the resistance of {name.Text}"),
            ResistanceTemperature = Real(resistance?.Value(1), Dimension.TemperatureDim, "the measuring temperature", positive: true),
            Conductor = Conductor(s.Clause("conductor"), name.Text),
            PeakWithstand = Real(s.Value("peak-withstand"), Dimension.CurrentDim, $"the peak withstand of {name.Text}", positive: true),
        };
        if (core is not null && BindThreePhaseWinding(s, winding, core)) return;
        if (core is null || ends is null || winding.From.Name.Length == 0 || winding.To.Name.Length == 0) return;
        windings.Add(winding);
    }

    private static NodeRef EndRef(NameSyntax? name) => name is null ? new NodeRef("", default) : new NodeRef(name.Text, name.Name.Span);

    private double? Turns(ValueSyntax? value, string description)
    {
        if (Value(value, description) is not { } q) return null;
        if (!q.Dimension.IsNone || q.IsPercent || !q.IsReal || q.Real <= 0)
        {
            diagnostics.ReportOutOfBounds(value!.Span, description, "a positive number of turns");
            return null;
        }
        return q.Real;
    }

    private double? NonNegative(ValueSyntax? value, Dimension dimension, string description)
    {
        var x = Real(value, dimension, description);
        if (x < 0)
        {
            diagnostics.ReportOutOfBounds(value!.Span, description, "zero or more");
            return null;
        }
        return x;
    }

    private ConductorModel? Conductor(ClauseSyntax? clause, string winding)
    {
        if (clause is null) return null;
        var material = clause.Word(w => w is "copper" or "aluminium")?.Text == "aluminium" ? ConductorMaterial.Aluminium : ConductorMaterial.Copper;
        var isGauge = clause.Word(w => w == "AWG") is not null;
        double? area;
        if (isGauge)
        {
            // Sizes above 0 AWG are written 00, 000, 0000 (gauges −1, −2, −3).
            var written = clause.Value(0) is { } size ? tree.Text[size.Span] : "";
            var gauge = written.Length > 1 && written.All(c => c == '0') ? 1 - written.Length : Real(clause.Value(0), Dimension.None, $"the wire gauge of {winding}");
            area = gauge is { } n ? Conductors.AwgArea(n) : null;
            if (gauge is { } g && (g < -3 || g > 56))
            {
                diagnostics.ReportOutOfBounds(clause.Value(0)!.Span, "an AWG size", "between 0000 and 56");
                area = null;
            }
        }
        else area = Real(clause.Value(0), Dimension.Area, $"the conductor size of {winding}", positive: true);
        var length = Real(clause.Value(1), Dimension.LengthDim, $"the conductor length of {winding}", positive: true);
        if (area is null || length is null) return null;
        var perTurn = clause.Word(w => w == "mean-turn") is not null;
        return new ConductorModel(material, area.Value, length.Value, perTurn, clause.Span);
    }

    private void BindTap(StatementSyntax s)
    {
        var name = s.Head.Name(0)!;
        var isBrush = s.Kind == StatementKind.Brush;
        var winding = Resolve(s.Clause("on")?.Name(0), "a winding", SymbolKind.Winding);
        var at = s.Value("at");
        // A tap written without its position has none at any sweep point either.
        Quantity? Position() => at is not null && overrides.Values.TryGetValue(name.Text, out var moved) ? moved : Value(at, $"the position of {name.Text}");
        TapRange? Range() =>
            s.Clause("range") is { } r && Value(r.Value(0), "the start of the range") is { } a && Value(r.Value(1), "the end of the range") is { } b
            && TapPosition(a, r.Value(0)!, name.Text) is { } from && TapPosition(b, r.Value(1)!, name.Text) is { } to
                ? new TapRange(from.Position, from.Unit, to.Position, to.Unit, r.Span) : null;
        if (winding is not null && IsPairWhole(winding, s.Clause("on")!.Name(0))) return;
        if (winding is not null && BindThreePhaseTap(s, winding, name, isBrush, () => Position() is { } p ? TapPosition(p, at!, name.Text) : null, Range)) return;
        var position = Position();
        if (winding is null || position is null || TapPosition(position.Value, at!, name.Text) is not { } place) return;
        var range = Range();
        taps.Add(new TapModel(name.Text, name.Name.Span, s.Span, winding.Name, place.Position, place.Unit, isBrush)
        {
            Range = range,
            CurrentLimit = Real(s.Value("current-limit"), Dimension.CurrentDim, $"the current limit of {name.Text}", positive: true),
            PositionSpan = at!.Span,
        });
    }

    /// <summary>A position in turns (or a bare number), in % of the winding, or in volts.</summary>
    private (double Position, TapUnit Unit)? TapPosition(Quantity q, ValueSyntax value, string tap)
    {
        if (q.IsBare)
        {
            MissingUnit(value, $"the position of {tap}", "turns", "%");
            return null;
        }
        if (Place(q) is { } place) return place;
        diagnostics.ReportWrongDimension(value.Span, $"turns, % or a voltage for the position of {tap}", q.Dimension);
        return null;
    }

    /// <summary>A position in turns, in % of the winding, or in volts; null for any other kind (the binder rejects a bare number first).</summary>
    internal static (double Position, TapUnit Unit)? Place(Quantity q) =>
        q.IsPercent && q.Dimension.IsNone ? (q.Real, TapUnit.Fraction)
        : q.Dimension.IsNone ? (q.Real, TapUnit.Turns)
        : q.Dimension == Dimension.Voltage ? (q.Real, TapUnit.Volts)
        : null;

    private void BindImpedance(StatementSyntax s)
    {
        var parts = s.Head.Names.Select(WindingPartOf).ToList();
        var valueSyntax = s.Head.Value();
        var value = Value(valueSyntax, $"the impedance {string.Join(" ", s.Head.Names.Select(n => n.Text))}");
        var xr = Real(s.Value("xr"), Dimension.None, "the X/R ratio", positive: true);
        var basePower = Real(s.Value("base"), Dimension.ApparentPower, "the base of the impedance", positive: true);
        if (parts.Count < 2 || parts[0] is null || parts[1] is null || value is not { } z) return;
        bool perUnit;
        if (z.Dimension == Dimension.Impedance) perUnit = false;
        else if (z.Dimension.IsNone && z.IsPercent) perUnit = true;
        else
        {
            diagnostics.ReportWrongDimension(valueSyntax!.Span, "an impedance in %, pu or ohm", z.Dimension);
            return;
        }
        if (!z.IsReal && xr is not null)
        {
            diagnostics.ReportOutOfBounds(s.Clause("xr")!.Span, "'xr'", "left out when the impedance is complex");
            return;
        }
        if (basePower is not null && !perUnit)
        {
            diagnostics.ReportOutOfBounds(s.Clause("base")!.Span, "'base'", "left out when the impedance is in ohms");
            return;
        }
        AddImpedance(new ImpedanceModel(parts[0]!, parts[1]!, z.Value, perUnit, xr, s.Span, valueSyntax!.Span) { Base = basePower });
    }

    private WindingPart? WindingPartOf(NameSyntax name)
    {
        var winding = Resolve(name, "a winding", SymbolKind.Winding);
        if (winding is null || IsPairWhole(winding, name)) return null;
        if (name.SectionFrom is null || name.SectionTo is null) return new WindingPart(winding.Name, null, null, name.Span);
        foreach (var end in new[] { name.SectionFrom, name.SectionTo })
        {
            var point = symbols.Find(end.Text);
            if (point is null || !point.IsConnectionPoint || (point.Owner != winding.Name && !IsPairPoint(point, winding)))
            {
                var candidates = symbols.Symbols.Where(p => p.IsConnectionPoint && p.Owner == winding.Name).Select(p => p.Name);
                if (!FollowsFromBrokenLine(end))
                    diagnostics.ReportUnknownName(end, $"point of winding {winding.Name}", Spelling.Nearest(end.Text, candidates));
                return null;
            }
            symbols.Reference(end.Span, point);
        }
        return new WindingPart(winding.Name, name.SectionFrom.Text, name.SectionTo.Text, name.Span);
    }

    private void BindNoLoad(StatementSyntax s)
    {
        var core = Resolve(s.Head.Name(0), "a core", SymbolKind.Core);
        var currentSyntax = s.Value("current");
        var current = Value(currentSyntax, "the no-load current");
        var loss = NonNegative(s.Value("loss"), Dimension.ActivePower, "the no-load loss");
        var at = s.Clause("at");
        var winding = Resolve(at?.Name(0), "a winding", SymbolKind.Winding);
        var voltage = Real(at?.Value(), Dimension.Voltage, "the test voltage", positive: true);
        if ((core is not null && IsPairWhole(core, s.Head.Name(0))) || (winding is not null && IsPairWhole(winding, at!.Name(0)))) return;
        if (core is null || current is not { } i || loss is null || winding is null || voltage is null) return;
        var fraction = i.IsPercent && i.Dimension.IsNone;
        if (!fraction && !i.Dimension.Fits(Dimension.CurrentDim))
        {
            diagnostics.ReportWrongDimension(currentSyntax!.Span, "a current or a percentage of rated current", i.Dimension);
            return;
        }
        AddNoLoad(new NoLoadModel(core.Name, s.Span, i.Real, fraction, loss.Value, new NodeRef(winding.Name, at!.Name(0)!.Span), voltage.Value));
    }

    private void BindSupply(StatementSyntax s)
    {
        var name = s.Head.Name(0)!;
        var plus = Node(s.Head.Name(1), s);
        var minus = Node(s.Head.Name(2), s);
        var voltage = Complex(s.Head.Value(), Dimension.Voltage, $"the voltage of {name.Text}");
        var impedance = Complex(s.Value("impedance"), Dimension.Impedance, $"the impedance of {name.Text}");
        var levelSyntax = s.Value("fault-level");
        var level = Value(levelSyntax, $"the fault level of {name.Text}");
        double? faultCurrent = null, faultPower = null;
        if (level is { } l)
        {
            if (l.Dimension.Fits(Dimension.CurrentDim) && l.IsReal && l.Real > 0) faultCurrent = l.Real;
            else if (l.Dimension.Fits(Dimension.ApparentPower) && l.IsReal && l.Real > 0) faultPower = l.Real;
            else diagnostics.ReportWrongDimension(levelSyntax!.Span, "a positive current or apparent power", l.Dimension);
        }
        if (impedance is not null && level is not null)
            diagnostics.ReportExclusiveClauses(s.Clause("fault-level")!.Keyword!, s.Clause("impedance")!.Keyword!);
        if (plus is null || minus is null || voltage is null) return;
        var xr = Real(s.Value("xr"), Dimension.None, "the X/R ratio", positive: true);
        var volts = voltage.Value.Magnitude;
        var strongest = impedance?.Magnitude ?? (faultCurrent is { } i ? volts / i : faultPower is { } p ? volts * volts / p : 0);
        supplies.Add(new SupplyModel(name.Text, name.Name.Span, s.Span, plus, minus, voltage.Value)
        {
            Impedance = impedance,
            FaultCurrent = faultCurrent,
            FaultPower = faultPower,
            XR = xr,
            MinimumImpedance = MinimumImpedance(s, name.Text, volts, single: true, xr, strongest),
        });
    }

    /// <summary>
    /// The source impedance at 'minimum-fault-level' (a current or an apparent power; |Z| = V/I or V²/S
    /// for a single-phase supply of V, V/(√3·I) or V²/S by the line-to-line voltage V of a three-phase
    /// one), split by the supply's X/R (pure reactance without one, as for the fault level). It must
    /// give no more current than the fault level: |Z| at least <paramref name="strongest"/>, ohm.
    /// </summary>
    private System.Numerics.Complex? MinimumImpedance(StatementSyntax s, string name, double volts, bool single, double? xr, double strongest)
    {
        var syntax = s.Value("minimum-fault-level");
        if (Value(syntax, $"the minimum fault level of {name}") is not { } l) return null;
        double magnitude;
        if (l.Dimension.Fits(Dimension.CurrentDim) && l.IsReal && l.Real > 0) magnitude = single ? volts / l.Real : volts / (Math.Sqrt(3) * l.Real);
        else if (l.Dimension.Fits(Dimension.ApparentPower) && l.IsReal && l.Real > 0) magnitude = volts * volts / l.Real;
        else
        {
            diagnostics.ReportWrongDimension(syntax!.Span, "a positive current or apparent power", l.Dimension);
            return null;
        }
        if (magnitude < strongest * (1 - 1e-9))
        {
            diagnostics.ReportOutOfBounds(syntax!.Span, "the minimum fault level", "at most the fault level (the source at its weakest)");
            return null;
        }
        var unit = xr is { } ratio ? new System.Numerics.Complex(1, ratio) / Math.Sqrt(1 + ratio * ratio) : System.Numerics.Complex.ImaginaryOne;
        return magnitude * unit;
    }

    /// <summary>
    /// A load impedance below this is taken for a slip rather than a load (common practice, no
    /// source): a milliohm across a few hundred volts draws hundreds of kiloamperes.
    /// </summary>
    public const double NearShort = 1e-3;

    private void BindLoad(StatementSyntax s)
    {
        var name = s.Head.Name(0)!;
        var a = Node(s.Head.Name(1), s);
        var b = Node(s.Head.Name(2), s);
        if (Demands(s, name.Text, 1, a is not null && b is not null) is not { } l || a is null || b is null) return;
        loads.Add(new LoadModel(name.Text, name.Name.Span, s.Span, a, b, l[0].Behaviour, l[0].S0, l[0].V0));
    }

    /// <summary>
    /// The demand of each of a load's phases as S0 at V0 with its behaviour: one value (a power
    /// shared out among the phases, an impedance or current for each) or one value a phase.
    /// Null after a diagnostic; the load model is read only where the load's nodes are bound.
    /// </summary>
    private (LoadBehaviour Behaviour, System.Numerics.Complex S0, double V0)[]? Demands(StatementSyntax s, string name, int phases, bool nodesBound)
    {
        var pfClause = s.Clause("pf");
        // "pf 0.8 lag" reads 'lag' as a unit: say which word was meant instead.
        if (pfClause?.Value()?.Expression is NumberSyntax { Unit: { } sense } && Units.Find(sense.Text) is null && Sense(sense.Text) is { } meant)
        {
            diagnostics.ReportPowerFactorSense(sense, meant);
            return null;
        }
        var pf = Real(pfClause?.Value(), Dimension.None, "the power factor");
        if (pf is { } p && (p <= 0 || p > 1))
        {
            diagnostics.ReportPowerFactor(pfClause!.Value()!.Span);
            return null;
        }
        var leading = pfClause?.Word(w => w == "leading") is not null;
        var angle = Math.Acos(pf ?? 1) * (leading ? -1 : 1);
        var what = $"the demand of {name}";
        var demand = s.Clauses.FirstOrDefault(c => c.Form?.Group == "demand");
        var values = demand?.Values.ToList() ?? [];
        var each = new List<(LoadBehaviour Behaviour, System.Numerics.Complex S0, double V0)>();
        foreach (var value in values)
        {
            if (Demand(demand!.Keyword!.Text, value, angle, pf is not null, what) is not { } d) return null;
            each.Add(d);
        }
        if (each.Count == 0 || !nodesBound) return null;
        // One power for all phases is the total; one impedance or current is each phase's.
        var share = demand!.Keyword!.Text is "power" or "apparent" ? 1.0 / phases : 1;
        var result = Enumerable.Range(0, phases).Select(k => each.Count == phases ? each[k] : each[0] with { S0 = each[0].S0 * share }).ToArray();
        if (s.Clause("model") is not { } modelClause) return result;
        var behaviour = modelClause.Word(w => w.StartsWith("constant-"))?.Text switch
        {
            "constant-impedance" => LoadBehaviour.ConstantImpedance,
            "constant-current" => LoadBehaviour.ConstantCurrent,
            _ => LoadBehaviour.ConstantPower,
        };
        var at = Real(modelClause.Value(), Dimension.Voltage, "the voltage of the load model", positive: true);
        for (var k = 0; k < phases; k++)
        {
            var l = result[k];
            if (behaviour == l.Behaviour) continue;
            if (at is not { } v)
            {
                if (modelClause.Value() is null) diagnostics.ReportOutOfBounds(modelClause.Span, "a change of load model", "given 'at' a voltage");
                return null;
            }
            // The demand at the stated voltage, then the new behaviour from there.
            var exponent = new LoadModel("", default, default, default!, default!, l.Behaviour, l.S0, l.V0).Exponent;
            var sAtV = exponent == 0 ? l.S0 : l.S0 * Math.Pow(v / l.V0, exponent);
            result[k] = (behaviour, sAtV, v);
        }
        return result;
    }

    /// <summary>One demand value as S0 drawn at V0 with its behaviour.</summary>
    private (LoadBehaviour Behaviour, System.Numerics.Complex S0, double V0)? Demand(string keyword, ValueSyntax value, double angle, bool hasPf, string what)
    {
        switch (keyword)
        {
            case "power" when Real(value, Dimension.ActivePower, what) is { } watts:
                return (LoadBehaviour.ConstantPower, new System.Numerics.Complex(watts, watts * Math.Tan(angle)), double.NaN);
            case "apparent" when Real(value, Dimension.ApparentPower, what) is { } va:
                return (LoadBehaviour.ConstantPower, System.Numerics.Complex.FromPolarCoordinates(va, angle), double.NaN);
            case "current" when Real(value, Dimension.CurrentDim, what) is { } amperes:
                return (LoadBehaviour.ConstantCurrent, System.Numerics.Complex.FromPolarCoordinates(amperes, angle), 1);
            case "impedance" when Complex(value, Dimension.Impedance, what) is { } z:
                if (z == System.Numerics.Complex.Zero)
                {
                    diagnostics.ReportOutOfBounds(value.Span, "a load's impedance", "above zero; a short circuit is a 'join' or a 'fault'");
                    return null;
                }
                if (z.Real < 0)
                {
                    diagnostics.ReportOutOfBounds(value.Span, "the resistance of a load", "zero or above: a negative one would deliver power; a source is a 'supply'");
                    return null;
                }
                if (z.Magnitude < NearShort) diagnostics.ReportNearShort(value.Span, z.Magnitude);
                if (hasPf && z.Imaginary == 0) z = System.Numerics.Complex.FromPolarCoordinates(z.Real, angle);
                // S drawn at 1 V by a constant impedance: |V|² conj(Y).
                return (LoadBehaviour.ConstantImpedance, System.Numerics.Complex.Conjugate(1 / z), 1);
            default:
                return null;
        }
    }

    /// <summary>'lagging' or 'leading' for a word that begins one of them or is one mistyped.</summary>
    private static string? Sense(string word)
    {
        string[] senses = ["lagging", "leading"];
        return word.Length >= 3 && senses.FirstOrDefault(w => w.StartsWith(word, StringComparison.OrdinalIgnoreCase)) is { } prefix
            ? prefix
            : Spelling.Nearest(word, senses);
    }

    private void BindFault(StatementSyntax s)
    {
        var name = s.Head.Name(0)!;
        var a = Node(s.Head.Name(1), s);
        var b = Node(s.Head.Name(2), s);
        var z = s.Clause("impedance") is { } imp ? Complex(imp.Value(), Dimension.Impedance, $"the impedance of {name.Text}") : 0;
        if (a is null || b is null || z is null) return;
        faults.Add(new FaultModel(name.Text, name.Name.Span, s.Span, a, b, z.Value));
    }

    private void BindSweep(StatementSyntax s)
    {
        var target = Resolve(s.Head.Name(0), "a let or brush", SymbolKind.Let, SymbolKind.Brush);
        var range = s.Clause("from");
        var from = Value(range?.Value(0), "the start of the sweep");
        var to = Value(range?.Value(1), "the end of the sweep");
        var step = Value(s.Value("step"), "the step of the sweep");
        var points = Real(s.Value("points"), Dimension.None, "the number of points", positive: true);
        if (points is { } count && count != Math.Floor(count))
        {
            diagnostics.ReportOutOfBounds(s.Value("points")!.Span, "the number of points", "a whole number");
            return;
        }
        if (target is null || from is null || to is null || (step is null && points is null)) return;
        if (!SweepUnits(target, (range!.Value(0)!, from.Value, "the lower bound"), (range.Value(1)!, to.Value, "the upper bound"), (s.Value("step"), step, "the step"))) return;
        sweeps.Add(new SweepModel(target, s.Span, from.Value, to.Value, step, points is { } n ? (int)Math.Round(n) : null));
    }

    /// <summary>
    /// A brush, or a let that is a quantity, is swept over quantities: a bare bound or step there is
    /// an error whose fix takes the unit the other values are written in ("give the lower bound a
    /// unit: 0 %"). False when one was reported.
    /// </summary>
    private bool SweepUnits(Symbol target, params (ValueSyntax? Syntax, Quantity? Value, string What)[] values)
    {
        var nominal = target.Kind == SymbolKind.Let ? lets.GetValueOrDefault(target.Name) : (Quantity?)null;
        if (nominal is { } n && n.IsBare) return true;
        var unit = values.Select(v => UnitWord(v.Syntax)).FirstOrDefault(u => u is not null)
            ?? (nominal is { } q ? (q.IsPercent ? "%" : q.Dimension.SiUnit()) : "%");
        var fine = true;
        foreach (var (syntax, value, what) in values)
        {
            if (syntax is null || value is not { } v || !v.IsBare) continue;
            MissingUnit(syntax, what, unit);
            fine = false;
        }
        return fine;
    }

    private void BindExpect(StatementSyntax s)
    {
        var measureClause = s.Clauses.FirstOrDefault(c => c.Form?.Group == "measure");
        var conditionClause = s.Clauses.FirstOrDefault(c => c.Form?.Group == "condition");
        if (measureClause is null || conditionClause is null) return;
        if (measureClause.Keyword!.Text == "position")
        {
            BindPositionExpect(s, measureClause, conditionClause);
            return;
        }
        if (conditionClause.Keyword!.Text == "clear-of-limits")
        {
            diagnostics.ReportPositionCondition(conditionClause.Span);
            return;
        }
        if (measureClause.Keyword!.Text is "hot-spot" or "top-oil" or "loss-of-life" or "equivalent-aging" or "capability")
        {
            BindThermalExpect(s, measureClause, conditionClause);
            return;
        }
        if (measureClause.Keyword!.Text is "positive-sequence" or "zero-sequence")
        {
            BindSequenceExpect(s, measureClause, conditionClause);
            return;
        }
        if (measureClause.Keyword!.Text == "vector-group" || conditionClause.Keyword!.Text == "is")
        {
            BindVectorGroupExpect(s, measureClause, conditionClause);
            return;
        }
        var measure = Enum.Parse<MeasureKind>(measureClause.Keyword!.Text.Replace("-", ""), ignoreCase: true);
        if (FaultCase(s, measureClause, measure) is not { } inCase) return;
        var (inFault, minimum) = inCase;
        var targets = ImmutableArray.CreateBuilder<NodeRef>();
        var phaseTargets = ImmutableArray<string>.Empty;
        var names = measureClause.Names.ToList();
        if (measure == MeasureKind.PeakDuty)
        {
            if (PeakDutyWinding(names.FirstOrDefault()) is not { } winding) return;
            targets.Add(new NodeRef(inFault!, names[1].Name.Span));
            targets.Add(winding);
            names.Clear();
        }
        for (var i = 0; i < names.Count; i++)
        {
            if (IsFaultMeasure(measure))
            {
                targets.Add(new NodeRef(inFault!, names[i].Name.Span));
                continue;
            }
            var isPoint = measure == MeasureKind.Voltage || i > 0;
            var symbol = isPoint ? Observed(names[i]) : Resolve(names[i], names[i].Role.Label, names[i].Role.Kinds);
            if (symbol is null) return;
            if (isPoint && !(i > 0 && !phaseTargets.IsEmpty) && IsThreePhaseTap(symbol, names[i])) return;
            if (!isPoint && (declaredThreePhase.Contains(symbol.Name) || IsPairWhole(symbol, null)))
            {
                // A current or loading check of a whole three-phase element checks each of its phases.
                if ((names.Count == 1 || ThreePhaseSection(symbol, names)) && PhasesChecked(symbol, measure) is { IsEmpty: false } phases) phaseTargets = phases;
                else
                {
                    if (!IsPairWhole(symbol, names[i])) diagnostics.ReportNamePhase(names[i].Name, symbol.Name);
                    return;
                }
            }
            targets.Add(new NodeRef(symbol.Name, names[i].Name.Span));
        }
        var (dimension, unit) = measure switch
        {
            MeasureKind.Voltage => (Dimension.Voltage, "V"),
            MeasureKind.Current => (Dimension.CurrentDim, "A"),
            MeasureKind.Flux => (Dimension.FluxDensity, "T"),
            MeasureKind.Power => (Dimension.ActivePower, "W"),
            MeasureKind.FaultCurrent or MeasureKind.PeakCurrent or MeasureKind.ThermalCurrent => (Dimension.CurrentDim, "A"),
            _ => (Dimension.None, "%"),
        };
        var what = $"a bound on {measureClause.Keyword.Text}";
        var ratio = unit == "%";
        if (ConditionRange(conditionClause, v => Real(v, dimension, what, ratio: ratio), dimension, percentOfNear: !dimension.IsNone, ratio ? ["%"] : ["%", unit]) is not (var low, var high, var target)) return;
        // A ratio bound written in per-unit ("below 1.6 pu") has its value shown in per-unit too.
        if (ratio && UnitWord(conditionClause.Value(0)) == "pu") unit = "pu";
        var text = tree.Text[s.Span];
        expects.Add(new ExpectModel(s.Span, text, measure, targets.ToImmutable(), Enum.Parse<ConditionKind>(conditionClause.Keyword.Text, true), low, high, unit)
        {
        Target = target,
        MeasureText = tree.Text[measureClause.Span],
        ConditionText = tree.Text[conditionClause.Span],
        InFault = inFault,
        Minimum = minimum,
        Phases = phaseTargets,
        });
    }

    /// <summary>
    /// What a check's condition allows: between two bounds, below or above one, or near a value within
    /// a tolerance, in the measure's unit or (where <paramref name="percentOfNear"/>) in % of the value.
    /// The bounds are read by <paramref name="bound"/>; null after a diagnostic.
    /// </summary>
    private (double Low, double High, double Target)? ConditionRange(ClauseSyntax condition, Func<ValueSyntax?, double?> bound, Dimension dimension, bool percentOfNear, string[] toleranceUnits)
    {
        switch (condition.Keyword!.Text)
        {
            case "between":
                if (bound(condition.Value(0)) is not { } lo || bound(condition.Value(1)) is not { } hi) return null;
                return (Math.Min(lo, hi), Math.Max(lo, hi), double.NaN);
            case "below":
                return bound(condition.Value(0)) is { } below ? (double.NegativeInfinity, below, double.NaN) : null;
            case "above":
                return bound(condition.Value(0)) is { } above ? (above, double.PositiveInfinity, double.NaN) : null;
            default:
                if (bound(condition.Value(0)) is not { } near) return null;
                var withinSyntax = condition.Value(1);
                if (Value(withinSyntax, "the tolerance of the check") is not { } within) return null;
                if (within.IsBare)
                {
                    MissingUnit(withinSyntax!, "the tolerance", toleranceUnits);
                    return null;
                }
                double band;
                if (within.IsPercent && percentOfNear) band = Math.Abs(near) * within.Real;
                else if (within.Dimension.Fits(dimension) && within.IsReal) band = Math.Abs(within.Real);
                else
                {
                    diagnostics.ReportToleranceDimension(withinSyntax!.Span, dimension, within.Dimension);
                    return null;
                }
                return (near - band, near + band, near);
        }
    }
}
