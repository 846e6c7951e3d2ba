using WindingNotes.Text;
using WindingNotes.Syntax;

namespace WindingNotes.Model;

// Messages of the binding stage about three-phase statements.
public static partial class ModelMessages
{
    extension(DiagnosticBag bag)
    {
        public Diagnostic ReportPhaseNameTaken(Token owner, string name, TextSpan existing) =>
            bag.Error("duplicate-name", owner.Span, $"'{owner.Text}' names its phase elements '{name}' and so on, but '{name}' is already defined")
                is var d ? bag.Amend(d, x => x with { Hints = [new DiagnosticHint($"'{name}' is defined here", existing, null)] }) : d;

        public Diagnostic ReportBankZeroSequence(TextSpan span) =>
            bag.Error("out-of-bounds", span, "a bank's three cores share no flux: its zero-sequence magnetising impedance is each core's own, from its 'no-load' test");

        public Diagnostic ReportNeedsConnection(Token winding, string core) =>
            bag.Error("missing-clause", winding.Span, $"'{core}' is a three-phase core: give '{winding.Text}' a connection ('wye', 'delta', 'zigzag', 'series' or 'ends'), or put it on one limb ('{core}_a')");

        public Diagnostic ReportConnectionOnSinglePhase(Token keyword, string core) =>
            bag.Error("wrong-kind", keyword.Span, $"'{keyword.Text}' connects three phase windings; '{core}' is a single-phase core (give it a 'construction')");

        public Diagnostic ReportPhaseImpedance(TextSpan span) =>
            bag.Error("wrong-kind", span, "an impedance between three-phase windings holds on each limb: name two three-phase windings of one unit (a zigzag twice for its two halves), or give it per phase winding (HV_a LV_a)");

        public Diagnostic ReportZigzagHalvesMissing(TextSpan span, string zigzag) =>
            bag.Error("missing-clause", span, $"an impedance with zigzag '{zigzag}' needs the impedance between its two halves ('impedance {zigzag} {zigzag}')");

        public Diagnostic ReportZigzagImpedanceBelowHalves(TextSpan span, string zigzag, string? least) =>
            bag.Error("out-of-bounds", span, $"the short-circuit impedance with zigzag '{zigzag}' must be at least what the leakage between its halves gives{(least is null ? "" : $" ({least})")}: below it the other winding's leakage to a half would be less than half of theirs");

        public Diagnostic ReportZigzagImpedanceUnfitted(TextSpan span, string why) =>
            bag.Error("out-of-bounds", span, $"the short-circuit impedance with a zigzag cannot be met: {why}");

        public Diagnostic ReportVectorGroupPair(TextSpan span) =>
            bag.Error("wrong-kind", span, "'vector-group' goes with 'is' and a connection symbol, and 'is' with 'vector-group'");

        public Diagnostic ReportNotThreePhase(Token name, string core) =>
            bag.Error("wrong-kind", name.Span, $"'{core}' is a single-phase core; a vector group belongs to a three-phase core");

        public Diagnostic ReportNamePhase(Token name, string element) =>
            bag.Error("wrong-kind", name.Span, $"'{element}' is three-phase here: name one of its phases ('{element}_a', '{element}_b' or '{element}_c')");

        public Diagnostic ReportNoZeroSequence(TextSpan span, string core) =>
            bag.Warning("zero-sequence-unknown", span, $"three-limb core '{core}' has no 'zero-sequence' magnetising impedance: its limbs are taken as uncoupled, as in a bank, which overstates the zero-sequence magnetising impedance");

        public Diagnostic ReportNoClockNumber(TextSpan span, string problem) => bag.Warning("no-clock-number", span, problem);

        public Diagnostic ReportZigzagUnmagnetised(TextSpan span, string winding, string core, bool alone) =>
            bag.Error("no-magnetising-branch", span, $"zigzag '{winding}' is {(alone ? "alone on" : "with no delta and no neutral terminal beside it on")} '{core}', which has no magnetising branch: nothing fixes the flux common to its limbs, so the network has no unique solution; give '{core}' its open-circuit test ('no-load {core} current … loss … at {winding} …')");

        public Diagnostic ReportSequenceWinding(Token name, string problem) =>
            bag.Error("wrong-kind", name.Span, $"'{name.Text}' {problem}");
    }
}

// Messages of the binding stage about 'unit-pair'.
public static partial class ModelMessages
{
    extension(DiagnosticBag bag)
    {
        public Diagnostic ReportNameUnit(Token name, string winding, string[] units) =>
            bag.Error("wrong-kind", name.Span, $"'{winding}' stands for both units of a pair here: name one of them ('{winding}_{units[0]}' or '{winding}_{units[1]}')");

        public Diagnostic ReportPairOutput(Token keyword, bool scott) =>
            bag.Error("wrong-kind", keyword.Span, scott
                ? $"a Scott-T's outputs are its main's and its teaser's secondaries: 'main-output X1 X2 teaser-output Y1 Y2', not '{keyword.Text}'"
                : "'main-output' and 'teaser-output' are a Scott-T's outputs: an open delta's secondaries are 'delta-output X1 X2 X3' (in open delta too), 'series Y1 Y3' (in series with the outer lines, boosting) or 'series-bucking Y1 Y3' (bucking)");
    }
}
