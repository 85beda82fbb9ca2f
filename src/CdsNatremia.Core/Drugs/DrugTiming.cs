using System.Globalization;
using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Findings;

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
/// Pure; the fall and the medication carry every time used. The evidence is a finding (its kind names the case, its slots
/// the times and resources used); the phrase catalogue words it.
/// </summary>
public static class DrugTiming
{
    /// <summary>The verdict and its evidence.</summary>
    public static TimingEvidence Assess(MedicationFact medication, SodiumFall? fall)
    {
        Guard.NotNull(medication, nameof(medication));
        if (medication.Use == MedicationUse.Intended)
        {
            return new TimingEvidence(TimingVerdict.Unlikely, Finding.Of(FindingKind.DrugTimingIntended, Slot.Text("reference", medication.Reference)).RestingOn(medication.Reference));
        }

        if (medication.StartedAt is not { } start)
        {
            return new TimingEvidence(TimingVerdict.Possible, Finding.Of(FindingKind.DrugTimingStartUnknown).With(Certainty.Unknown).RestingOn(medication.Reference));
        }

        // The start day as recorded (UTC date): a date-only start must not move to the day before in a zone west of UTC.
        var day = Slot.Verbatim("day", start.ToUniversalTime().ToString("yyyy-MM-dd", CultureInfo.InvariantCulture));
        var started = Slot.Phrase("started", medication.StartSource is { } source
            ? Finding.Of(FindingKind.DrugTimingStarted, day, Slot.Text("source", source))
            : Finding.Of(FindingKind.DrugTimingStartedNoSource, day));
        if (fall is null)
        {
            return new TimingEvidence(TimingVerdict.Possible, Finding.Of(FindingKind.DrugTimingNoFall, started).RestingOn(medication.Reference));
        }

        if (start >= fall.FirstLow.EffectiveAt)
        {
            return new TimingEvidence(TimingVerdict.Unlikely, Finding.Of(FindingKind.DrugTimingAfterFirstLow, started, SodiumAt("firstLow", fall.FirstLow))
                .RestingOn(medication.Reference, fall.FirstLow.Reference));
        }

        if (fall.Before is not { } before)
        {
            return new TimingEvidence(TimingVerdict.Possible, Finding.Of(FindingKind.DrugTimingNoBefore, started, SodiumAt("firstLow", fall.FirstLow))
                .RestingOn(medication.Reference, fall.FirstLow.Reference));
        }

        var kind = start > before.EffectiveAt ? FindingKind.DrugTimingDuringFall : FindingKind.DrugTimingAlreadyTaken;
        return new TimingEvidence(TimingVerdict.Likely, Finding.Of(kind, started, SodiumAt("before", before), SodiumAt("firstLow", fall.FirstLow))
            .With(Certainty.Likely)
            .RestingOn(medication.Reference, before.Reference, fall.FirstLow.Reference));
    }

    /// <summary>"124 mmol/L at 2026-03-10 06:30 UTC (Observation/na-1)" as a nested phrase named <paramref name="slot"/>.</summary>
    public static Slot SodiumAt(string slot, LabResult result)
    {
        Guard.NotNull(result, nameof(result));
        return Slot.Phrase(slot, Finding.Of(
            FindingKind.DrugSodiumAt,
            Slot.Number("value", result.Value),
            Slot.Time("time", result.EffectiveAt),
            Slot.Text("reference", result.Reference)));
    }
}
