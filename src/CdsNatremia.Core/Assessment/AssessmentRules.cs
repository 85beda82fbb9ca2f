using CdsNatremia.Core.Drugs;

namespace CdsNatremia.Core.Assessment;

/// <summary>The work-up rules, in the order a clinician reasons. Add a new work-up step here.</summary>
public static class AssessmentRules
{
    /// <summary>The default order.</summary>
    public static IReadOnlyList<IAssessmentRule> Default() =>
    [
        new SodiumSeverityRule(),
        new DrugCauseRule(),
    ];
}
