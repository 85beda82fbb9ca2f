using CdsNatremia.Core.Cards;
using CdsNatremia.Core.Engine;
using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Tests.Support;

namespace CdsNatremia.Core.Tests.Assessment;

public class SodiumAssessmentCardProducerTests
{
    [Theory]
    [InlineData(124, CardIndicator.Critical)] // profound < 125 (2014 European guideline) → critical (default indicator map)
    [InlineData(127, CardIndicator.Warning)] // moderate 125–129 → warning
    [InlineData(132, CardIndicator.Info)] // mild 130–134.9 → info
    public void Decide_LowSodium_OneAssessmentCardWithBandIndicator(double sodium, CardIndicator expected)
    {
        var cards = Some.Engine().Decide(Some.Request(Some.Facts(Some.Sodium(sodium))));

        var card = Assert.Single(cards);
        Assert.Equal(expected, card.Indicator);
        Assert.Contains("sodium.severity", card.RuleIds);
    }

    [Theory]
    [InlineData(135)]
    [InlineData(140)]
    [InlineData(152)] // high sodium is out of scope: no card
    public void Decide_NormalOrHighSodium_NoCard(double sodium)
        => Assert.Empty(Some.Engine().Decide(Some.Request(Some.Facts(Some.Sodium(sodium)))));

    [Fact]
    public void Decide_NoSodiumAtAll_NoCard()
        => Assert.Empty(Some.Engine().Decide(Some.Request(Some.Facts())));

    [Fact]
    public void Decide_UsesTheLatestResultNotTheLowest()
    {
        var cards = Some.Engine().Decide(Some.Request(Some.Facts(Some.Sodium(118, hoursAgo: 30), Some.Sodium(131, hoursAgo: 1))));
        var card = Assert.Single(cards, c => c.Topic == "sodium-assessment"); // the 13 mmol/L rise also gets a correction-rate card
        Assert.Contains(cards, c => c.Topic == "correction-rate");
        Assert.StartsWith("Sodium 131 mmol/L (mild", card.Summary, StringComparison.Ordinal);
    }

    [Fact]
    public void Decide_StaleResult_LabelledAndRecheckSuggested()
    {
        var card = Assert.Single(Some.Engine().Decide(Some.Request(Some.Facts(Some.Sodium(128, hoursAgo: 80)))));
        Assert.Contains("**stale**", card.Report, StringComparison.Ordinal);
        var suggestion = Assert.Single(card.Suggestions, s => s.Actions[0].Create!.LoincCode == "2951-2"); // LOINC 2951-2 serum/plasma sodium, reference sheet
        Assert.Contains("stale", card.Summary, StringComparison.Ordinal);
    }

    [Fact]
    public void Decide_ResultJustInsideStaleWindow_NotStale()
    {
        var card = Assert.Single(Some.Engine().Decide(Some.Request(Some.Facts(Some.Sodium(128, hoursAgo: 71.9)))));
        Assert.DoesNotContain("**stale**", card.Report, StringComparison.Ordinal);
    }

    [Fact]
    public void Decide_PreliminaryResult_CountedAndLabelled()
    {
        var card = Assert.Single(Some.Engine().Decide(Some.Request(Some.Facts(Some.Sodium(130, preliminary: true)))));
        Assert.Contains("preliminary", card.Summary, StringComparison.Ordinal);
        Assert.Contains("**preliminary**", card.Report, StringComparison.Ordinal);
    }

    [Fact]
    public void Decide_OnlyUnusableSodium_InfoCardWithNoAssessment()
    {
        var facts = Some.Facts() with
        {
            SetAside = [new SetAsideItem("Observation/x", "Sodium 302 mg/dL", "unit 'mg/dL' is not accepted", Analyte.Sodium, Some.Now)],
        };
        var card = Assert.Single(Some.Engine().Decide(Some.Request(facts)));
        Assert.Equal(CardIndicator.Info, card.Indicator);
        Assert.Contains("no assessment", card.Summary, StringComparison.OrdinalIgnoreCase);
        Assert.Contains("unit 'mg/dL' is not accepted", card.Report, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData(100)]
    [InlineData(119)]
    [InlineData(126)]
    [InlineData(133)]
    public void EveryCard_SummaryUnder140AndCarriesCautions(double sodium)
    {
        var facts = Some.Facts(Some.Sodium(sodium, hoursAgo: 100, preliminary: true, specimen: SpecimenKind.ArterialBlood, id: new string('x', 64)));
        foreach (var card in Some.Engine().Decide(Some.Request(facts)))
        {
            Assert.True(card.Summary.Length < 140, card.Summary);
            foreach (var caution in SafetyCautions.All)
            {
                Assert.Contains(caution, card.Report, StringComparison.Ordinal);
            }
        }
    }

    [Fact]
    public void Decide_ResultHook_AlsoAssesses()
        => Assert.Single(Some.Engine().Decide(Some.Request(Some.Facts(Some.Sodium(126)), HookKind.ResultArrive)));

    [Fact]
    public void Decide_OrderSignWithoutOrders_NoAssessmentCard()
        => Assert.Empty(Some.Engine().Decide(Some.Request(Some.Facts(Some.Sodium(126)), HookKind.OrderSign)));
}
