using CdsNatremia.Core.Cards;
using CdsNatremia.Core.CorrectionRate;
using CdsNatremia.Core.Engine;
using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Rendering;
using CdsNatremia.Core.Tests.Support;

namespace CdsNatremia.Core.Tests.CorrectionRate;

/// <summary>
/// The short card of every rate card stays within its 700-character budget when every patient caution applies at once
/// (a child, a stale sodium, high-risk factors), and it still carries the cautions and the standing line.
/// </summary>
public class RateCardBudgetTests
{
    private static readonly MedicationFact Tolvaptan = SomeClinical.Draft("tv", "tolvaptan 15 mg tablet", codes: SomeDrugs.Atc("C03XA01"));
    private static readonly MedicationFact Desmopressin = SomeClinical.Draft("dd", "desmopressin 2 micrograms injection", codes: SomeDrugs.Atc("H01BA02"));

    // A child of 10 (adult from 18, common practice) with low potassium (3.1 < 3.5, common practice) and cirrhosis
    // (ICD-10 K74, from memory): high risk per the US expert panel (Verbalis et al. 2013); sodium 80 h old (stale after 72 h).
    private static PatientFacts Everything(params LabResult[] sodium)
        => SomeClinical.Woman(10, [.. sodium, Some.Lab(Analyte.Potassium, 3.1, 81), Some.Lab(Analyte.BodyWeight, 30, 81), Some.Lab(Analyte.UrineOsmolality, 640, 81)]) with
        {
            Conditions = [SomeClinical.Condition("liver", "K74.6", "Cirrhosis of liver with a long free-text description from the record")],
        };

    public static TheoryData<string> Cases => ["fast", "passed", "slow", "infusion", "vaptan", "desmopressin"];

    [Theory]
    [MemberData(nameof(Cases))]
    public void Detail_EveryCautionAtOnce_WithinTheBudgetAndCautionsKept(string @case)
    {
        var (facts, hook, drafts) = @case switch
        {
            "fast" => (Everything(Some.Sodium(104, 100), Some.Sodium(116, 80)), HookKind.PatientView, Array.Empty<MedicationFact>()),
            "passed" => (Everything(Some.Sodium(104, 100), Some.Sodium(118, 90), Some.Sodium(110, 80)), HookKind.PatientView, []),
            "slow" => (Everything(Some.Sodium(104, 110), Some.Sodium(104.5, 80)), HookKind.PatientView, []),
            "infusion" => (Everything(Some.Sodium(104, 100), Some.Sodium(110, 80)), HookKind.OrderSign, [SomeClinical.Draft("ns", "sodium chloride 0.9%", 1000, "intravenous")]),
            "vaptan" => (Everything(Some.Sodium(104, 100), Some.Sodium(116, 80)), HookKind.OrderSign, [Tolvaptan]),
            _ => (Everything(Some.Sodium(104, 100), Some.Sodium(136, 80)), HookKind.OrderSign, [Desmopressin]),
        };
        var cards = SomeClinical.Decide(facts, hook, drafts).Where(c => c.Topic is CorrectionRateCardProducer.Topic or InfusionPredictionCardProducer.Topic or RateCautionOrderCardProducer.Topic).ToList();
        Assert.NotEmpty(cards);
        foreach (var card in cards)
        {
            Assert.True(card.Detail.Length <= CardRenderer.DetailBudget, card.Detail.Length + ": " + card.Detail);
            Assert.True(card.Summary.Length < 140, card.Summary);
            Assert.Contains(SafetyCautions.Standing, card.Detail, StringComparison.Ordinal);
            Assert.Contains("Child (10 years)", card.Detail, StringComparison.Ordinal); // the engine's child caution
            Assert.Contains("High risk of osmotic demyelination", card.Detail, StringComparison.Ordinal);
        }
    }
}
