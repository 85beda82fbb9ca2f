using CdsNatremia.Core.Assessment;
using CdsNatremia.Core.CorrectionRate;
using CdsNatremia.Core.Drugs;

namespace CdsNatremia.Core.Engine;

/// <summary>The producers the service runs, in order. Add a new card-producing rule here.</summary>
public static class CardProducers
{
    /// <summary>The default set.</summary>
    public static IReadOnlyList<ICardProducer> Default() =>
    [
        new SodiumAssessmentCardProducer(AssessmentRules.Default()),
        new CorrectionRateCardProducer(),
        new InfusionPredictionCardProducer(),
        new RateCautionOrderCardProducer(),
        new DrugOrderWarningProducer(),
    ];
}
