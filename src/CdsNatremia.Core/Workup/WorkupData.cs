using CdsNatremia.Core.Facts;

namespace CdsNatremia.Core.Workup;

/// <summary>How the work-up rules pick the results that belong with the sodium they assess.</summary>
public static class WorkupData
{
    /// <summary>
    /// The result of <paramref name="analyte"/> closest in time to <paramref name="at"/> within ± <paramref name="withinHours"/>
    /// (ties: the newer, then by id), or null. Pairing by time keeps an old glucose from being read with today's sodium.
    /// </summary>
    public static LabResult? Paired(PatientFacts facts, Analyte analyte, DateTimeOffset at, double withinHours)
    {
        Guard.NotNull(facts, nameof(facts));
        return facts.Results(analyte)
            .Select(r => (Result: r, Distance: Math.Abs((r.EffectiveAt - at).TotalHours)))
            .Where(x => x.Distance <= withinHours)
            .OrderBy(x => x.Distance)
            .ThenByDescending(x => x.Result.EffectiveAt)
            .ThenBy(x => x.Result.ResourceId, StringComparer.Ordinal)
            .Select(x => x.Result)
            .FirstOrDefault();
    }

    /// <summary>The newest result of <paramref name="analyte"/> taken no earlier than <paramref name="from"/>, or null.</summary>
    public static LabResult? NewestSince(PatientFacts facts, Analyte analyte, DateTimeOffset from)
        => Guard.NotNull(facts, nameof(facts)).Results(analyte).FirstOrDefault(r => r.EffectiveAt >= from);

    /// <summary>True when medication data could not be obtained (the host's prefetch keys for statements or orders).</summary>
    public static bool MedicationsUnreadable(PatientFacts facts)
        => Guard.NotNull(facts, nameof(facts)).Unavailable.Keys.Any(k => k.StartsWith("medication", StringComparison.OrdinalIgnoreCase));

    /// <summary>True when condition data could not be obtained.</summary>
    public static bool ConditionsUnreadable(PatientFacts facts)
        => Guard.NotNull(facts, nameof(facts)).Unavailable.Keys.Any(k => k.StartsWith("condition", StringComparison.OrdinalIgnoreCase));

    /// <summary>A duration for card text: hours up to 72 h ("30 h"), whole days beyond ("98 days").</summary>
    public static string Duration(double hours)
        => Math.Abs(hours) <= 72 ? Text.ClinicalNumber.Rounded(hours, 1) + " h" : Invariant.Format($"{Math.Round(hours / 24):0} days");
}
