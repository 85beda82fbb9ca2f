using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Text;

namespace CdsNatremia.Core.Drugs;

/// <summary>
/// Sets a drug's start against the fall (<see cref="SodiumFall"/>). Rules, with the boundaries:
/// <list type="bullet">
/// <item>recorded as intended (not yet taken): unlikely;</item>
/// <item>start unknown: possible;</item>
/// <item>start strictly before the first low result and a result before the fall on record: likely (a start at or
/// before the result before the fall means the drug was already taken while sodium was higher, and it fell afterwards);</item>
/// <item>start strictly before the first low result but nothing before the fall on record: possible;</item>
/// <item>start at or after the first low result: unlikely (the sodium was already about this low before it began).</item>
/// </list>
/// Pure; the fall and the medication carry every time used.
/// </summary>
public static class DrugTiming
{
    /// <summary>The verdict and its evidence.</summary>
    public static TimingEvidence Assess(MedicationFact medication, SodiumFall? fall, TimeDisplay? display = null)
    {
        display ??= TimeDisplay.Utc(default);
        Guard.NotNull(medication, nameof(medication));
        if (medication.Use == MedicationUse.Intended)
        {
            return new TimingEvidence(TimingVerdict.Unlikely, $"recorded as intended, not yet taken ({Markdown.Escape(medication.Reference)})");
        }

        if (medication.StartedAt is not { } start)
        {
            return new TimingEvidence(TimingVerdict.Possible, "start date not recorded, so its timing against the fall cannot be judged");
        }

        var started = Invariant.Format($"started {Day(start)} ({Markdown.Escape(medication.StartSource ?? "start")})");
        if (fall is null)
        {
            return new TimingEvidence(TimingVerdict.Possible, started + "; the latest sodium is not low, so there is no fall to set it against");
        }

        if (start >= fall.FirstLow.EffectiveAt)
        {
            return new TimingEvidence(TimingVerdict.Unlikely, Invariant.Format(
                $"{started}, on or after {Value(fall.FirstLow, display)}, when sodium was already near its lowest: unlikely to have started the fall, though it can keep sodium low"));
        }

        if (fall.Before is not { } before)
        {
            return new TimingEvidence(TimingVerdict.Possible, Invariant.Format(
                $"{started}, before the first low result ({Value(fall.FirstLow, display)}); no earlier higher sodium is on record, so when the fall began is unknown"));
        }

        return start > before.EffectiveAt
            ? new TimingEvidence(TimingVerdict.Likely, Invariant.Format(
                $"{started}, after {Value(before, display)} and before {Value(fall.FirstLow, display)}: it began before the fall"))
            : new TimingEvidence(TimingVerdict.Likely, Invariant.Format(
                $"{started}, so already taken when sodium was {Value(before, display)}; sodium fell afterwards to {Value(fall.FirstLow, display)}"));
    }

    private static string Day(DateTimeOffset at) => at.ToUniversalTime().ToString("yyyy-MM-dd", System.Globalization.CultureInfo.InvariantCulture);

    private static string Value(LabResult result, TimeDisplay display)
        => Invariant.Format($"{Invariant.Number(result.Value)} mmol/L at {display.Time(result.EffectiveAt)} ({Markdown.Escape(result.Reference)})");
}
