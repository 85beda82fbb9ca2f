using CdsNatremia.Core.Engine;
using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Knowledge;
using CdsNatremia.Core.Findings;

namespace CdsNatremia.Core.Drugs;

/// <summary>
/// In heart failure a loop diuretic is part of the treatment (common practice: the mainstay for congestion), so the
/// drug-cause card and the order warning name it as a possible contributor without inviting anyone to stop it for the
/// sodium. Heart failure is read from the <c>condition-heart-failure</c> knowledge set (codes, or name when no code matched).
/// </summary>
public static class HeartFailureTreatment
{
    /// <summary>The heart-failure condition set's id.</summary>
    public const string HeartFailureSetId = "condition-heart-failure";

    /// <summary>The loop-diuretic drug set's id.</summary>
    public const string LoopDiureticSetId = "drug-loop-diuretic";

    /// <summary>The patient's heart-failure condition (the first by id), or null.</summary>
    public static ConditionFact? HeartFailure(DecisionContext context)
    {
        Guard.NotNull(context, nameof(context));
        if (context.Knowledge.Find(HeartFailureSetId) is not { } set)
        {
            return null;
        }

        return context.Request.Facts.Conditions
            .OrderBy(c => c.ResourceId, StringComparer.Ordinal)
            .FirstOrDefault(c => set.MatchesAny(c.Codes) || set.MatchName(c.Text) is not null);
    }

    /// <summary>True when the match is a loop diuretic and the patient has heart failure.</summary>
    public static bool IsTreatment(MedicationMatch match, ConditionFact? heartFailure)
        => heartFailure is not null && string.Equals(Guard.NotNull(match, nameof(match)).Set.Id, LoopDiureticSetId, StringComparison.Ordinal);

    /// <summary>"heart failure (Condition/hf, "Chronic heart failure")" as a finding.</summary>
    public static Finding Cite(ConditionFact heartFailure)
    {
        Guard.NotNull(heartFailure, nameof(heartFailure));
        var reference = Slot.Text("reference", heartFailure.Reference);
        return (string.IsNullOrWhiteSpace(heartFailure.Text)
            ? Finding.Of(FindingKind.DrugHeartFailure, reference)
            : Finding.Of(FindingKind.DrugHeartFailureWithText, reference, Slot.Text("text", heartFailure.Text))).RestingOn(heartFailure.Reference);
    }

    /// <summary>What clinicians usually consider for a loop diuretic in heart failure (replaces the review-the-need line).</summary>
    public static Finding Considerations(MedicationMatch match, ConditionFact heartFailure)
        => Finding.Of(FindingKind.DrugHeartFailureConsider, DrugText.Name(Guard.NotNull(match, nameof(match))), Slot.Phrase("heartFailure", Cite(heartFailure)))
            .RestingOn(heartFailure.Reference);
}
