using System.Globalization;
using System.Numerics;
using System.Text;
using CsCheck;
using WindingNotes.Tests.Support;
using Xunit;

namespace WindingNotes.Tests.Solve;

/// <summary>
/// For random three- and four-winding data sets (percent with or without X/R, on the core rating or
/// on a base of their own, ohms complex or with X/R; resistances stated on some windings; taps on
/// some; star branches of either sign), every pairwise short-circuit test of the solved model gives
/// back its input impedance to 1e-9 (R8: Brandwajn, Dommel and Dommel, 1982, from memory).
/// </summary>
public class LeakagePropertyTests
{
    private sealed record Winding(string Name, double Turns, double Rated, double? Resistance);

    private sealed record Line(int A, int B, string Text, Complex Ohms, bool GivesR);

    [Fact]
    public void Every_pairwise_short_circuit_test_gives_back_its_input()
    {
        Gen.Int[0, int.MaxValue].Sample(seed =>
        {
            var (text, windings, lines) = Write(seed);
            foreach (var line in lines)
            {
                var (a, b) = (windings[line.A], windings[line.B]);
                var ratio = a.Turns / b.Turns;
                var expected = line.Ohms;
                if (a.Resistance is { } ra && b.Resistance is { } rb)
                {
                    var r = ra + rb * ratio * ratio;
                    expected = line.GivesR ? new Complex(r, line.Ohms.Imaginary) : new Complex(r, Math.Sqrt(line.Ohms.Magnitude * line.Ohms.Magnitude - r * r));
                }
                else if (!line.GivesR)
                {
                    var r = (a.Resistance ?? 0) + (b.Resistance ?? 0) * ratio * ratio;
                    expected = new Complex(r, Math.Sqrt(line.Ohms.Magnitude * line.Ohms.Magnitude - r * r));
                }
                var z = ShortCircuit.Impedance(text, ($"{a.Name}1", $"{a.Name}2"), ($"{b.Name}1", $"{b.Name}2"), a.Rated);
                ShortCircuit.Near(expected, z, 1e-9, $"{line.Text} (seed {seed})\n{text}");
            }
        }, iter: 40);
    }

    private static (string Text, List<Winding> Windings, List<Line> Lines) Write(int seed)
    {
        var random = new Random(seed);
        string N(double x) => x.ToString("R", CultureInfo.InvariantCulture);
        double LogBetween(double a, double b) => a * Math.Pow(b / a, random.NextDouble());
        var rating = LogBetween(1e3, 1e8);
        var perTurn = LogBetween(0.5, 50);
        var o = new StringBuilder("frequency 50 Hz\n").Append($"core K rating {N(rating)} VA\n");
        var windings = new List<Winding>();
        var count = random.Next(3, 5);
        for (var i = 0; i < count; i++)
        {
            var name = ((char)('A' + i)).ToString();
            var turns = (double)random.Next(10, 2000);
            var rated = turns * perTurn;
            // Resistances well below the impedances: at most 0.5 % against at least 2 %.
            double? resistance = random.Next(2) == 0 ? LogBetween(1e-4, 5e-3) * rated * rated / rating : null;
            windings.Add(new Winding(name, turns, rated, resistance));
            o.Append($"winding {name} on K turns {N(turns)} rated {N(rated)} V from {name}1 to {name}2");
            if (resistance is { } r) o.Append($" resistance {N(r)} ohm");
            o.Append('\n');
            if (random.Next(3) == 0) o.Append($"tap {name}t on {name} at {random.Next(1, (int)turns)} turns\n");
        }
        var lines = new List<Line>();
        for (var i = 0; i < count; i++)
            for (var k = i + 1; k < count; k++)
            {
                if (random.Next(6) == 0) continue;
                var (a, b) = random.Next(2) == 0 ? (i, k) : (k, i);
                var zBase = windings[a].Rated * windings[a].Rated / rating;
                var pu = LogBetween(0.02, 0.3);
                var xr = LogBetween(0.5, 40);
                var angle = Math.Atan(xr);
                string value;
                Complex ohms;
                var givesR = true;
                switch (random.Next(5))
                {
                    case 0:
                        value = $"{N(pu * 100)} % xr {N(xr)}";
                        ohms = Complex.FromPolarCoordinates(pu * zBase, angle);
                        break;
                    case 1:
                        value = $"{N(pu * 100)} %";
                        ohms = new Complex(0, pu * zBase);
                        givesR = false;
                        break;
                    case 2:
                        var basePower = LogBetween(rating / 10, rating * 10);
                        value = $"{N(pu * 100)} % xr {N(xr)} base {N(basePower)} VA";
                        ohms = Complex.FromPolarCoordinates(pu * windings[a].Rated * windings[a].Rated / basePower, angle);
                        break;
                    case 3:
                        ohms = Complex.FromPolarCoordinates(pu * zBase, angle);
                        value = $"{N(ohms.Real)} + j{N(ohms.Imaginary)} ohm";
                        break;
                    default:
                        value = $"{N(pu * zBase)} ohm xr {N(xr)}";
                        ohms = Complex.FromPolarCoordinates(pu * zBase, angle);
                        break;
                }
                var text = $"impedance {windings[a].Name} {windings[b].Name} {value}";
                o.Append(text).Append('\n');
                lines.Add(new Line(a, b, text, ohms, givesR));
            }
        return (o.ToString(), windings, lines);
    }
}
