using CdsNatremia.Core.CorrectionRate;
using CdsNatremia.Core.Drugs;
using CdsNatremia.Core.Workup;

namespace CdsNatremia.Core.Assessment;

/// <summary>The work-up rules, in the order a clinician reasons. Add a new work-up step here.</summary>
public static class AssessmentRules
{
    /// <summary>The default order.</summary>
    public static IReadOnlyList<IAssessmentRule> Default() =>
    [
        new SodiumSeverityRule(),
        new PaediatricRule(),
        new TonicityRule(),
        new NotHypotonicRule(),
        new OnsetRule(),
        new HighRiskRule(),
        new UrineStudiesRule(),
        new FurstRatioRule(),
        new VolumeCluesRule(),
        new SiadhChecklistRule(),
        new LowCortisolRule(),
        new DrugCauseRule(),
        new RecentlyStoppedDrugRule(),
        new MissingTestsRule(),
    ];
}
