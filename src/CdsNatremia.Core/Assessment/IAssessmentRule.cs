using CdsNatremia.Core.Engine;

namespace CdsNatremia.Core.Assessment;

/// <summary>
/// One step of the hyponatremia work-up. Rules run in order on a patient whose latest usable sodium is low, and each
/// adds its findings, reasoning steps (with the data they used), differential, next steps and suggestions to the one
/// assessment card.
/// </summary>
public interface IAssessmentRule
{
    /// <summary>A stable id, e.g. "sodium.severity"; the card's audit record lists the ids of the rules that spoke.</summary>
    string RuleId { get; }

    /// <summary>Adds this rule's contribution. Must be pure.</summary>
    void Apply(DecisionContext context, AssessmentBuilder card);
}
