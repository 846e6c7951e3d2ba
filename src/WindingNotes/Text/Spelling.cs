namespace WindingNotes.Text;

/// <summary>Finds the known word a mistyped one most likely meant, for "did you mean" hints.</summary>
public static class Spelling
{
    public static string? Nearest(string word, IEnumerable<string> candidates)
    {
        string? best = null;
        var bestDistance = int.MaxValue;
        var limit = Math.Max(1, word.Length / 3);
        foreach (var candidate in candidates)
        {
            if (candidate == word) continue;
            var distance = Distance(word, candidate);
            if (string.Equals(word, candidate, StringComparison.OrdinalIgnoreCase)) distance = 0;
            if (distance <= limit && distance < bestDistance)
            {
                best = candidate;
                bestDistance = distance;
            }
        }
        return best;
    }

    /// <summary>Optimal string alignment distance: insertions, deletions, substitutions and swaps of neighbours.</summary>
    public static int Distance(string a, string b)
    {
        var d = new int[a.Length + 1, b.Length + 1];
        for (var i = 0; i <= a.Length; i++) d[i, 0] = i;
        for (var j = 0; j <= b.Length; j++) d[0, j] = j;
        for (var i = 1; i <= a.Length; i++)
        {
            for (var j = 1; j <= b.Length; j++)
            {
                var cost = a[i - 1] == b[j - 1] ? 0 : 1;
                d[i, j] = Math.Min(Math.Min(d[i - 1, j] + 1, d[i, j - 1] + 1), d[i - 1, j - 1] + cost);
                if (i > 1 && j > 1 && a[i - 1] == b[j - 2] && a[i - 2] == b[j - 1])
                    d[i, j] = Math.Min(d[i, j], d[i - 2, j - 2] + 1);
            }
        }
        return d[a.Length, b.Length];
    }
}
