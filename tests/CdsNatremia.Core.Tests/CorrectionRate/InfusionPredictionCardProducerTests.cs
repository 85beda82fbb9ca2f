using CdsNatremia.Core.Cards;
using CdsNatremia.Core.CorrectionRate;
using CdsNatremia.Core.Engine;
using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Findings;
using CdsNatremia.Core.Knowledge;
using CdsNatremia.Core.Tests.Support;

namespace CdsNatremia.Core.Tests.CorrectionRate;

public class InfusionPredictionCardProducerTests
{
    // ATC C03XA vasopressin antagonists and H01BA02 desmopressin (project ValueSets drug-vaptan, drug-desmopressin; from memory).
    private static readonly KnowledgeBase Knowledge = new(
    [
        new CodeSet("drug-vaptan", "https://example.org/vs/v", "1", "vasopressin-receptor antagonist", [], [new CodeRef(CodeSystems.Atc, "C03XA")], ["tolvaptan"]),
        new CodeSet("drug-desmopressin", "https://example.org/vs/d", "1", "desmopressin", [new CodeRef(CodeSystems.Atc, "H01BA02")], [], ["desmopressin"]),
    ], "test");

    private static MedicationFact Draft(string id, string text, double? millilitres = 150, string route = "intravenous")
        => new("MedicationRequest", id, [], [], text, MedicationUse.Draft, null, null) { VolumeMilliliters = millilitres, Route = route };

    private static PatientFacts Woman55(params LabResult[] labs) => Some.Facts(labs) with { Sex = PatientSex.Female, BirthDate = new DateOnly(1970, 6, 1) };

    private static List<Card> Cards(PatientFacts facts, IReadOnlyList<MedicationFact> drafts, HookKind hook = HookKind.OrderSign, IReadOnlyList<string>? selected = null)
    {
        var request = Some.Request(facts, hook) with { DraftOrders = drafts, SelectedOrders = selected ?? [] };
        return new DecisionEngine(CardProducers.Default(), new RuleOptions(), Knowledge).Decide(request).ToList();
    }

    [Fact]
    public void Produce_Scenario16Numbers_PredictedRiseAndAllowance()
    {
        // 60 kg woman of 55 at 118 mmol/L, 150 mL of 3% saline: TBW 0.5 × 60 = 30 L (reference sheet fractions);
        // Adrogué–Madias (513 − 118) / 31 = 12.7 per litre, × 0.15 = 1.9 mmol/L; first-24-h allowance 10 (European 2014).
        var facts = Woman55(Some.Sodium(118, 4), Some.Lab(Analyte.BodyWeight, 60, 3));
        var card = Assert.Single(Cards(facts, [Draft("nacl3", "sodium chloride 3% intravenous solution")]));
        Assert.Equal("infusion-prediction", card.Topic);
        Assert.Equal(CardIndicator.Warning, card.Indicator); // hypertonic saline within the allowance
        var content = card.Content!;
        Assert.Equal(FindingKind.RateInfusionSummaryPredicted, content.Summary.Kind);
        Assert.Equal(FindingKind.RateInfusionVerdictWithin, RateFindings.Phrase(content.Summary, "verdict").Kind);
        var predicted = RateFindings.Of(content.Reasons, FindingKind.RateInfusionPredictedOne);
        Assert.Equal(1.9, RateFindings.Number(RateFindings.Phrase(predicted, "change"), "value"), 6);
        Assert.Equal(10, RateFindings.Number(predicted, "remaining"));
        Assert.Equal(30, RateFindings.Number(RateFindings.Of(content.Steps, FindingKind.RateInfusionStepWater), "litres"), 6);
        Assert.Contains("+1.9 mmol/L", card.Summary, StringComparison.Ordinal);
        Assert.Contains("+1.9 mmol/L", card.Detail, StringComparison.Ordinal); // the prediction is the weightiest reason
        Assert.Contains("= **30 L**", card.Report, StringComparison.Ordinal);
        Assert.Contains("(513 + 0 − 118) / (30 + 1) = **+12.7 mmol/L**", card.Report, StringComparison.Ordinal);
        Assert.Contains("allowance left now: **10 mmol/L**", card.Report, StringComparison.Ordinal);
        Assert.True(card.Detail.Length <= 700, card.Detail);
    }

    [Fact]
    public void Produce_OrderWouldExceedWhatIsLeft_Critical()
    {
        // Already +7 in 10 h; 1000 mL of 3% saline for a 50 kg woman at 119: (513 − 119) / 26 = 15.2 > 3 left.
        var facts = Woman55(Some.Sodium(112, 11), Some.Sodium(119, 1), Some.Lab(Analyte.BodyWeight, 50, 3));
        var card = Assert.Single(Cards(facts, [Draft("big", "sodium chloride 3%", 1000)]), c => c.Topic == "infusion-prediction");
        Assert.Equal(CardIndicator.Critical, card.Indicator);
        Assert.Equal(FindingKind.RateInfusionVerdictExceed, RateFindings.Phrase(card.Content!.Summary, "verdict").Kind);
        Assert.Contains("would exceed the 3 mmol/L left", card.Summary, StringComparison.Ordinal);
    }

    [Fact]
    public void Produce_OrderWouldExceedButSodiumIsStale_WarningNotCritical()
    {
        // The same rise and order as above, but the newest sodium is 80 h old (stale window 72 h, SodiumReadingOptions):
        // a stale result gives at most a warning, recheck first (issue rule; common practice).
        var facts = Woman55(Some.Sodium(112, 90), Some.Sodium(119, 80), Some.Lab(Analyte.BodyWeight, 50, 3));
        var card = Assert.Single(Cards(facts, [Draft("big", "sodium chloride 3%", 1000)]), c => c.Topic == "infusion-prediction");
        Assert.Equal(CardIndicator.Warning, card.Indicator);
        Assert.True(RateFindings.Has(card.Content!.Cautions, FindingKind.RateInfusionSerumStale));
        Assert.Contains("h old", card.Detail, StringComparison.Ordinal); // a caution: on the short card
    }

    [Fact]
    public void Produce_NoWeight_SaysSoAndGivesOnlyALabelledExamplePerLitre()
    {
        var card = Assert.Single(Cards(Woman55(Some.Sodium(118, 4)), [Draft("nacl3", "sodium chloride 3%")]));
        Assert.True(RateFindings.Has(card.Content!.Reasons, FindingKind.RateInfusionNoWeight));
        Assert.Equal(FindingKind.RateInfusionNextWeight, card.Content.NextSteps[0].Kind);
        Assert.Equal(FindingKind.RateInfusionVerdictNoWeight, RateFindings.Phrase(card.Content.Summary, "verdict").Kind);
        Assert.Contains("No usable body weight", card.Detail, StringComparison.Ordinal);
        Assert.Contains("Example only, not this patient's weight", card.Report, StringComparison.Ordinal);
        Assert.Contains("example weight of 70 kg", card.Report, StringComparison.Ordinal);
        Assert.DoesNotContain("for 150 mL", card.Report, StringComparison.Ordinal); // no prediction for the volume
        Assert.DoesNotContain("predicted sodium change", card.Summary, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData(0)]
    [InlineData(-60)]
    [InlineData(900)]
    public void Produce_ImplausibleWeight_NotUsedAndSaid(double kg)
    {
        var card = Assert.Single(Cards(Woman55(Some.Sodium(118, 4), Some.Lab(Analyte.BodyWeight, kg, 3)), [Draft("nacl3", "sodium chloride 3%")]));
        Assert.Equal(kg, RateFindings.Number(RateFindings.Of(card.Content!.Reasons, FindingKind.RateInfusionWeightImplausible), "weight"));
        Assert.Contains("No usable body weight", card.Detail, StringComparison.Ordinal);
        Assert.Contains("was not used", card.Report, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData(-150.0)]
    [InlineData(0.0)]
    [InlineData(null)]
    public void Produce_NoUsableVolume_PerLitreOnly(double? millilitres)
    {
        var card = Assert.Single(Cards(Woman55(Some.Sodium(118, 4), Some.Lab(Analyte.BodyWeight, 60, 3)), [Draft("nacl3", "sodium chloride 3%", millilitres)]));
        var step = RateFindings.Of(card.Content!.Steps, FindingKind.RateInfusionStepOrder);
        Assert.Equal(FindingKind.RateInfusionPredictionPerLitre, RateFindings.Phrase(step, "prediction").Kind);
        Assert.Contains("**+12.7 mmol/L**", card.Report, StringComparison.Ordinal); // (513 − 118) / 31, Adrogué–Madias
        Assert.Contains("only the per-litre figure", card.Report, StringComparison.Ordinal);
        Assert.Contains("per litre only", card.Summary, StringComparison.Ordinal);
    }

    [Fact]
    public void Produce_OrderSelect_OnlySelectedDrafts()
    {
        var facts = Woman55(Some.Sodium(118, 4), Some.Lab(Analyte.BodyWeight, 60, 3));
        var drafts = new[] { Draft("a", "sodium chloride 3%"), Draft("b", "sodium chloride 0.9%", 1000) };
        var card = Assert.Single(Cards(facts, drafts, HookKind.OrderSelect, ["MedicationRequest/b"]));
        Assert.Contains("MedicationRequest/b", card.ResourcesUsed);
        Assert.DoesNotContain("MedicationRequest/a", card.ResourcesUsed);
        Assert.Contains("MedicationRequest/b", card.Report, StringComparison.Ordinal);
        Assert.DoesNotContain("MedicationRequest/a", card.Report, StringComparison.Ordinal);
        Assert.Empty(Cards(facts, drafts, HookKind.OrderSelect, ["MedicationRequest/other"]));
    }

    [Fact]
    public void Produce_NormalSodium_NoCardForARoutineFluid()
        => Assert.Empty(Cards(Woman55(Some.Sodium(139, 4), Some.Lab(Analyte.BodyWeight, 60, 3)), [Draft("ns", "sodium chloride 0.9%", 1000)]));

    [Fact]
    public void Produce_NoSodiumData_NoCard()
        => Assert.Empty(Cards(Woman55(Some.Lab(Analyte.BodyWeight, 60, 3)), [Draft("ns", "sodium chloride 0.9%", 1000)]));

    [Fact]
    public void Produce_SodiumReceivedButUnusable_SaysSoWithoutPrediction()
    {
        var facts = Woman55(Some.Lab(Analyte.BodyWeight, 60, 3)) with
        {
            SetAside = [new SetAsideItem("Observation/na-x", "Sodium 302 mg/dL", "unit not accepted", Analyte.Sodium, Some.Now.AddHours(-2))],
        };
        var card = Assert.Single(Cards(facts, [Draft("nacl3", "sodium chloride 3%")]));
        Assert.True(RateFindings.Has(card.Content!.Reasons, FindingKind.RateInfusionNoSerum));
        Assert.Contains("No usable sodium result", card.Detail, StringComparison.Ordinal);
        Assert.Contains("Observation/na-x", card.Report, StringComparison.Ordinal);
        Assert.DoesNotContain("Per litre", card.Report, StringComparison.Ordinal);
    }

    [Fact]
    public void Produce_StaleSodium_Said()
    {
        var card = Assert.Single(Cards(Woman55(Some.Sodium(118, 80), Some.Lab(Analyte.BodyWeight, 60, 3)), [Draft("nacl3", "sodium chloride 3%")]));
        Assert.Contains("80 h old", card.Detail, StringComparison.Ordinal); // stale after 72 h (SodiumReadingOptions default): a caution
    }

    [Fact]
    public void Produce_OralSalt_NoCard()
        => Assert.Empty(Cards(Woman55(Some.Sodium(118, 4)), [Draft("tab", "sodium chloride 3%", route: "oral")]));

    [Fact]
    public void Produce_VaptanDraft_RateCautionCard()
    {
        var vaptan = new MedicationFact("MedicationRequest", "tv", [new CodeRef(CodeSystems.Atc, "C03XA01")], [], "tolvaptan 15 mg", MedicationUse.Draft, null, null) { Route = "oral" };
        var card = Assert.Single(Cards(Woman55(Some.Sodium(122, 4)), [vaptan]));
        Assert.Equal("rate-caution-order", card.Topic);
        Assert.Equal(CardIndicator.Warning, card.Indicator);
        Assert.Contains("ATC C03XA01", card.Report, StringComparison.Ordinal);
        Assert.Contains("Allowance left now", card.Report, StringComparison.Ordinal);
        Assert.True(RateFindings.Has(card.Content!.Steps, FindingKind.RateAllowanceLeft));
    }

    [Fact]
    public void Produce_DesmopressinDraft_RateCautionCard()
    {
        var ddavp = new MedicationFact("MedicationRequest", "dd", [], [], "desmopressin 2 micrograms", MedicationUse.Draft, null, null);
        Assert.Equal("rate-caution-order", Assert.Single(Cards(Woman55(Some.Sodium(122, 4)), [ddavp])).Topic);
    }
}
