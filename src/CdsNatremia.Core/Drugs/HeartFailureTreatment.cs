using CdsNatremia.Core.Engine;
using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Knowledge;
using CdsNatremia.Core.Text;

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
            .FirstOrDefault(c => c.Codes.Any(set.Matches) || set.MatchName(c.Text) is not null);
    }

    /// <summary>True when the match is a loop diuretic and the patient has heart failure.</summary>
    public static bool IsTreatment(MedicationMatch match, ConditionFact? heartFailure)
        => heartFailure is not null && string.Equals(Guard.NotNull(match, nameof(match)).Set.Id, LoopDiureticSetId, StringComparison.Ordinal);

    /// <summary>"heart failure (Condition/hf, "Chronic heart failure")".</summary>
    public static string Cite(ConditionFact heartFailure)
    {
        Guard.NotNull(heartFailure, nameof(heartFailure));
        var text = string.IsNullOrWhiteSpace(heartFailure.Text) ? string.Empty : ", \"" + Markdown.Escape(heartFailure.Text) + "\"";
        return $"heart failure ({Markdown.Escape(heartFailure.Reference)}{text})";
    }

    /// <summary>What clinicians usually consider for a loop diuretic in heart failure (replaces the review-the-need line).</summary>
    public static string Considerations(MedicationMatch match, ConditionFact heartFailure)
        => $"{DrugText.Name(Guard.NotNull(match, nameof(match)))} treats the patient's {Cite(heartFailure)}: a loop diuretic is part of heart-failure treatment and is **not stopped for the sodium**; its dose, fluid intake and the low sodium are reviewed together with the team managing the heart failure (common practice).";
}
