namespace CdsNatremia.Cli.Load;

/// <summary>Latency percentiles in milliseconds (nearest-rank method over successful and failed requests alike).</summary>
internal sealed record LatencySummary(double P50, double P90, double P99, double Max, double Mean)
{
    /// <summary>Summarises a list of latencies; all zero when empty.</summary>
    public static LatencySummary Of(IReadOnlyList<double> milliseconds)
    {
        ArgumentNullException.ThrowIfNull(milliseconds);
        if (milliseconds.Count == 0)
        {
            return new LatencySummary(0, 0, 0, 0, 0);
        }

        var sorted = milliseconds.Order().ToArray();
        return new LatencySummary(Rank(sorted, 50), Rank(sorted, 90), Rank(sorted, 99), sorted[^1], Math.Round(sorted.Average(), 3));
    }

    /// <summary>Nearest-rank percentile: the value at rank ceil(p/100 × n) (a standard definition of a sample percentile).</summary>
    public static double Rank(double[] sorted, double percent)
    {
        ArgumentNullException.ThrowIfNull(sorted);
        var rank = (int)Math.Ceiling(percent / 100 * sorted.Length);
        return sorted[Math.Clamp(rank, 1, sorted.Length) - 1];
    }
}
