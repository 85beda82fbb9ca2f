using CdsNatremia.Core.Cards;
using CdsNatremia.Core.CorrectionRate;
using CdsNatremia.Core.Engine;
using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Findings;
using CdsNatremia.Core.Tests.Support;

namespace CdsNatremia.Core.Tests.Clinical;

/// <summary>Issue 13 (9): vaptan and desmopressin draft orders.</summary>
public class VaptanAndDesmopressinOrderTests
{
    private static readonly MedicationFact Tolvaptan = SomeClinical.Draft("tv", "tolvaptan 15 mg tablet", codes: SomeDrugs.Atc("C03XA01"));
    private static readonly MedicationFact Desmopressin = SomeClinical.Draft("dd", "desmopressin 2 micrograms injection", codes: SomeDrugs.Atc("H01BA02"));

    private static IReadOnlyList<Card> Orders(PatientFacts facts, params MedicationFact[] drafts)
        => SomeClinical.Decide(facts, HookKind.OrderSign, drafts);

    [Theory]
    [InlineData(1, CardIndicator.Critical)] // fresh: 112 → 124 in 20 h is past the 10 mmol/L first-24-h limit (2014 European guideline)
    [InlineData(80, CardIndicator.Warning)] // the same rise, newest result 80 h old: stale (72 h window), recheck first
    public void Produce_VaptanAfterTheLimitWasPassed_CriticalOnlyOnAFreshSodium(double latestHoursAgo, CardIndicator expected)
    {
        var facts = Some.Facts(Some.Sodium(112, latestHoursAgo + 20), Some.Sodium(124, latestHoursAgo));
        var card = Assert.Single(Orders(facts, Tolvaptan), c => c.RuleIds.Contains("sodium.rate-caution-order.vaptan"));
        Assert.Equal(expected, card.Indicator);
    }

    [Theory]
    [InlineData(127, "moderate")] // 125–129 (2014 European guideline)
    [InlineData(120, "profound")] // < 125
    public void Produce_VaptanInModerateOrProfound_SaysTheEuropeanGuidelineRecommendsAgainst(double sodium, string band)
    {
        // 2014 European guideline (Spasovski et al.): recommends against vaptans in moderate or profound hyponatraemia.
        var card = Assert.Single(Orders(Some.Facts(Some.Sodium(sodium, 3)), Tolvaptan));
        Assert.Equal(RateCautionOrderCardProducer.Topic, card.Topic);
        var guideline = Assert.Single(card.Content!.Reasons, f => f.Kind == FindingKind.RateVaptanGuidelineBand);
        Assert.Equal(new TextValue(band, Escape: true), guideline["band"]);
        Assert.Equal(FindingKind.RateVaptanSummaryAdvisedAgainst, card.Content.Summary.Kind);
        Assert.Contains("**The 2014 European guideline recommends against vasopressin-receptor antagonists in moderate or profound hyponatraemia**", card.Report, StringComparison.Ordinal);
        Assert.Contains("latest sodium is " + band, card.Report, StringComparison.Ordinal);
        Assert.Contains("advises against vaptans here", card.Summary, StringComparison.Ordinal);
        Assert.Contains("can injure the liver", card.Report, StringComparison.Ordinal); // prescribing information, from memory
        Assert.Contains("limiting the duration of treatment", card.Report, StringComparison.Ordinal);
    }

    [Fact]
    public void Produce_VaptanInMildHyponatraemia_GuidelineStatedButNotForThisBand()
    {
        var card = Assert.Single(Orders(Some.Facts(Some.Sodium(131, 3)), Tolvaptan));
        Assert.Contains(card.Content!.Reasons, f => f.Kind == FindingKind.RateVaptanGuideline);
        Assert.Contains("the latest usable sodium is not in those bands", card.Report, StringComparison.Ordinal);
        Assert.DoesNotContain("advises against vaptans here", card.Summary, StringComparison.Ordinal);
        Assert.Contains("avoid in liver disease", card.Summary, StringComparison.Ordinal);
    }

    [Fact]
    public void Produce_VaptanWithCirrhosisInTheRecord_NamesTheLiverDisease()
    {
        // ICD-10 K74.6 cirrhosis (from memory); the label advises avoiding tolvaptan in liver disease (from memory).
        var facts = Some.Facts(Some.Sodium(127, 3)) with { Conditions = [SomeClinical.Condition("cirr", "K74.6", "Cirrhosis of liver")] };
        var card = Assert.Single(Orders(facts, Tolvaptan));
        Assert.Contains(card.Content!.Reasons, f => f.Kind == FindingKind.RateVaptanLiverDisease && f.Evidence.Contains("Condition/cirr"));
        Assert.Contains("**The record shows liver disease** (Condition/cirr", card.Report, StringComparison.Ordinal);
        Assert.Contains("Condition/cirr", card.ResourcesUsed);
    }

    [Fact]
    public void Produce_DesmopressinForLowSodium_OneCardThatSaysItLowersSodium()
    {
        // Desmopressin (ATC H01BA02) reduces water excretion: it lowers sodium. One order, one card (issue 13).
        var cards = Orders(Some.Facts(Some.Sodium(126, 3)), Desmopressin);
        var card = Assert.Single(cards);
        Assert.Equal("drug-order-warning", card.Topic);
        Assert.Contains("can lower sodium", card.Summary, StringComparison.Ordinal);
        Assert.DoesNotContain("raise", card.Summary, StringComparison.OrdinalIgnoreCase);
    }

    [Fact]
    public void Produce_DesmopressinAfterOvercorrection_RecognisedStrategyUnderSeniorCare()
    {
        // 112 → 124 in 20 h passes the first-24-h limit of 10 mmol/L (2014 European guideline): a deliberate re-lowering order.
        var facts = Some.Facts(Some.Sodium(112, 21, id: "na-112"), Some.Sodium(124, 1, id: "na-124"));
        var card = Assert.Single(Orders(facts, Desmopressin));
        Assert.Contains("**recognised strategy under senior care**", card.Detail, StringComparison.Ordinal);
        Assert.Contains("**The chart shows over-correction**", card.Detail, StringComparison.Ordinal);
        Assert.Equal(CardIndicator.Warning, card.Indicator); // a deliberate strategy: not an emergency card
    }

    [Fact]
    public void Produce_DesmopressinAfterOvercorrectionToNormal_RateCautionCardSaysItLowersSodium()
    {
        // 120 → 136 in 20 h: past the limit and now normal, so the prescribing warning has no reason to speak; the one card
        // left says desmopressin lowers sodium and names the re-lowering strategy.
        var facts = Some.Facts(Some.Sodium(120, 21), Some.Sodium(136, 1));
        var card = Assert.Single(Orders(facts, Desmopressin));
        Assert.Equal(RateCautionOrderCardProducer.Topic, card.Topic);
        Assert.Contains("it lowers sodium", card.Summary, StringComparison.Ordinal);
        Assert.Contains(card.Content!.Reasons, f => f.Kind == FindingKind.RateDesmopressinRelowering);
        Assert.Contains("**lowers** sodium (it does not raise it)", card.Report, StringComparison.Ordinal);
        Assert.Contains("recognised strategy under senior care", card.Summary, StringComparison.Ordinal);
    }

    [Fact]
    public void Produce_DesmopressinSelectedByBareId_StillOneCard()
    {
        // A selection given as the bare id "dd" (not "MedicationRequest/dd"): one rule (DraftOrders) decides which drafts
        // an order hook speaks about, so the prescribing warning takes it as selected and speaks, and the rate-caution
        // card stays quiet: one card, never zero (never silent), never two.
        var request = Some.Request(Some.Facts(Some.Sodium(126, 3)), HookKind.OrderSelect) with { DraftOrders = [Desmopressin], SelectedOrders = ["dd"] };
        var card = Assert.Single(Some.Engine(knowledge: SomeClinical.Knowledge).Decide(request));
        Assert.Equal("drug-order-warning", card.Topic);
        Assert.Contains("can lower sodium", card.Summary, StringComparison.Ordinal);
    }

    [Fact]
    public void Produce_DesmopressinWithoutOvercorrection_NoReloweringText()
    {
        var card = Assert.Single(Orders(Some.Facts(Some.Sodium(126, 3)), Desmopressin));
        Assert.DoesNotContain("recognised strategy", card.Detail, StringComparison.Ordinal);
    }
}
