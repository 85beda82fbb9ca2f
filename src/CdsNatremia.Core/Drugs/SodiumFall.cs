using CdsNatremia.Core.Facts;

namespace CdsNatremia.Core.Drugs;

/// <summary>
/// The fall that led to the current low sodium, as the drug-timing reasoning uses it.
/// <para>
/// Definition. Let L be the latest usable sodium, and L be low (below the lower limit of normal). The current low stretch
/// is every result after the last normal one; its nadir N is the lowest of them (the earliest, on a tie). Walking back
/// from N, <see cref="Before"/> is the newest earlier result that was either normal (at or above the lower limit) or
/// higher than N by at least the meaningful drop (<see cref="DrugCauseOptions.MeaningfulDropMmolPerL"/>, default
/// 4 mmol/L). <see cref="FirstLow"/> is the first result after <see cref="Before"/>: from it to N the sodium was already
/// within the meaningful drop of its lowest level. <b>The fall</b> is the interval after <see cref="Before"/> up to and
/// including <see cref="FirstLow"/>. Measuring from the nadir, not from L, keeps a recovering sodium (119 then 131) from
/// hiding the fall a drug started before. When no earlier result qualifies, <see cref="Before"/> is null,
/// <see cref="FirstLow"/> is the oldest result, and when the fall began is unknown.
/// </para>
/// Example: 138 (10 Feb), 124 (10 Mar) gives Before = 138, FirstLow = 124. 133, 132, 127 gives Before = 132 (132 ≥ 127 + 4),
/// FirstLow = 127. 131, 129 gives no Before (129 + 4 = 133 &gt; 131 and 131 is low), FirstLow = 131. 134, 119, 131 gives
/// Before = 134, FirstLow = 119 (the nadir), although the latest value is 131.
/// </summary>
/// <param name="Before">The last result before the fall, or null when none is on record.</param>
/// <param name="FirstLow">The first result at about the current low level.</param>
/// <param name="Latest">The latest result.</param>
public sealed record SodiumFall(LabResult? Before, LabResult FirstLow, LabResult Latest)
{
    /// <summary>Finds the fall in a series (oldest first); null when the series is empty or its latest value is not low.</summary>
    /// <param name="seriesOldestFirst">Usable sodium results, oldest first.</param>
    /// <param name="normalFrom">Lower limit of normal, mmol/L.</param>
    /// <param name="meaningfulDrop">Smallest drop that counts as a fall, mmol/L.</param>
    public static SodiumFall? Find(IReadOnlyList<LabResult> seriesOldestFirst, double normalFrom, double meaningfulDrop)
    {
        Guard.NotNull(seriesOldestFirst, nameof(seriesOldestFirst));
        if (seriesOldestFirst.Count == 0)
        {
            return null;
        }

        var latest = seriesOldestFirst[^1];
        if (latest.Value >= normalFrom)
        {
            return null;
        }

        // The nadir of the current low stretch (after the last normal result), earliest on a tie.
        var nadirIndex = seriesOldestFirst.Count - 1;
        for (var i = seriesOldestFirst.Count - 2; i >= 0 && seriesOldestFirst[i].Value < normalFrom; i--)
        {
            if (seriesOldestFirst[i].Value <= seriesOldestFirst[nadirIndex].Value)
            {
                nadirIndex = i;
            }
        }

        var nadir = seriesOldestFirst[nadirIndex];
        for (var i = nadirIndex - 1; i >= 0; i--)
        {
            var result = seriesOldestFirst[i];
            if (result.Value >= normalFrom || result.Value >= nadir.Value + meaningfulDrop)
            {
                return new SodiumFall(result, seriesOldestFirst[i + 1], latest);
            }
        }

        return new SodiumFall(null, seriesOldestFirst[0], latest);
    }
}
