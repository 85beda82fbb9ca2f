using CdsNatremia.Core.Facts;

namespace CdsNatremia.Core.Drugs;

/// <summary>The trigger of an order warning and the results behind it.</summary>
/// <param name="Trigger">Low, falling or absent.</param>
/// <param name="Latest">The latest usable sodium, when there is one.</param>
/// <param name="Higher">For a falling sodium: the higher result it fell from.</param>
/// <param name="AgeYears">The patient's age, when known.</param>
public sealed record OrderWarningReason(OrderWarningTrigger Trigger, LabResult? Latest, LabResult? Higher, int? AgeYears)
{
    /// <summary>
    /// Decides whether a draft order of a drug that can lower sodium deserves a warning; null when the sodium is
    /// normal and stable (no card). Definitions: <b>low</b>, the latest usable sodium is below the lower limit of
    /// normal; <b>falling</b>, the latest is normal but at least <see cref="DrugCauseOptions.MeaningfulDropMmolPerL"/>
    /// below the highest result taken within <see cref="DrugCauseOptions.FallingWindowHours"/> before it;
    /// <b>absent</b> (when enabled), no usable sodium within <see cref="DrugCauseOptions.RecentSodiumDays"/> of now for a
    /// patient aged at least <see cref="DrugCauseOptions.AbsentSodiumMinimumAgeYears"/>.
    /// </summary>
    public static OrderWarningReason? Decide(
        IReadOnlyList<LabResult> seriesOldestFirst,
        double normalFrom,
        DrugCauseOptions options,
        DateTimeOffset now,
        int? ageYears)
    {
        Guard.NotNull(seriesOldestFirst, nameof(seriesOldestFirst));
        Guard.NotNull(options, nameof(options));
        var latest = seriesOldestFirst.Count > 0 ? seriesOldestFirst[^1] : null;
        if (latest is not null && latest.Value < normalFrom)
        {
            return new OrderWarningReason(OrderWarningTrigger.Low, latest, null, ageYears);
        }

        if (latest is not null)
        {
            var windowStart = latest.EffectiveAt.AddHours(-options.FallingWindowHours);
            var higher = seriesOldestFirst
                .Where(r => r.EffectiveAt >= windowStart && r.EffectiveAt < latest.EffectiveAt)
                .OrderByDescending(r => r.Value)
                .ThenByDescending(r => r.EffectiveAt)
                .FirstOrDefault();
            if (higher is not null && higher.Value - latest.Value >= options.MeaningfulDropMmolPerL)
            {
                return new OrderWarningReason(OrderWarningTrigger.Falling, latest, higher, ageYears);
            }
        }

        var recent = latest is not null && latest.EffectiveAt >= now.AddDays(-options.RecentSodiumDays);
        if (!recent && options.WarnWhenSodiumAbsent && ageYears is { } age && age >= options.AbsentSodiumMinimumAgeYears)
        {
            return new OrderWarningReason(OrderWarningTrigger.AbsentOlderPatient, latest, null, ageYears);
        }

        return null;
    }
}
