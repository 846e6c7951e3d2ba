using System.Globalization;
using System.Numerics;
using Xunit;

namespace WindingNotes.Tests.Support;

/// <summary>
/// The short-circuit test as a test report makes it, on the solved model: a supply across one
/// winding (or part), the other shorted by a join, every other winding open. The impedance seen by
/// the supply is referred to the excited side.
/// </summary>
public static class ShortCircuit
{
    public static Complex Impedance(string data, (string From, string To) excited, (string From, string To) shorted, double volts = 1000)
    {
        var v = volts.ToString("R", CultureInfo.InvariantCulture);
        var e = Wn.Solved(data + $"\nsupply sc_test {excited.From} {excited.To} {v} V\nground {excited.To}\njoin {shorted.From} {shorted.To}\n");
        var i = e.Normal!.Supply("sc_test").Current;
        Assert.True(i.Magnitude > 0, "the test draws current");
        return volts / i;
    }

    /// <summary>Asserts two complex values agree to a relative tolerance of the larger magnitude.</summary>
    public static void Near(Complex expected, Complex actual, double relative, string what)
    {
        var error = (actual - expected).Magnitude / Math.Max(expected.Magnitude, 1e-300);
        Assert.True(error <= relative, $"{what}: expected {expected}, got {actual} (off by {error:E2})");
    }
}
