using System.Numerics;
using WindingNotes.Kernel;
using WindingNotes.Solve;
using Xunit;

namespace WindingNotes.Tests.Solve;

public class SystemMatrixTests
{
    [Fact]
    public void Entries_stay_in_column_order_and_keep_their_places_when_cleared()
    {
        var random = new Random(3);
        var a = new SystemMatrix(12);
        var dense = new Complex[12, 12];
        for (var k = 0; k < 200; k++)
        {
            var (i, j) = (random.Next(12), random.Next(12));
            var v = new Complex(random.NextDouble() - 0.5, random.NextDouble());
            if (k % 2 == 0) a[i, j] += v;
            else a.Add(i, j, v);
            dense[i, j] += v;
        }
        for (var i = 0; i < 12; i++)
        {
            for (var j = 0; j < 12; j++) Assert.Equal(dense[i, j], a[i, j]);
            Assert.Equal(a.Columns(i).ToArray().Order(), a.Columns(i).ToArray());
        }
        var copy = a.Clone();
        var entries = a.Entries;
        a.Clear();
        Assert.Equal(entries, a.Entries);
        Assert.All(Enumerable.Range(0, 12), i => Assert.All(a.Values(i).ToArray(), v => Assert.Equal(Complex.Zero, v)));
        Assert.Equal(dense[5, 7], copy[5, 7]);
    }
}
