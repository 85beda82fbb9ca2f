using CdsNatremia.Core.Cards;
using CdsNatremia.Core.CorrectionRate;
using CdsNatremia.Core.Engine;
using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Findings;
using CdsNatremia.Core.Knowledge;
using CdsNatremia.Core.Tests.Support;

namespace CdsNatremia.Core.Tests.CorrectionRate;

public class CorrectionRateCardProducerTests
{
    // ICD-10 F10, mental and behavioural disorders due to use of alcohol (from memory; the project ValueSet uses it as an is-a filter).
    private static readonly KnowledgeBase Knowledge = new(
    [
        new CodeSet("condition-alcohol-use-disorder", "https://example.org/vs/a", "1", "alcohol use disorder", [], [new CodeRef(CodeSystems.Icd10, "F10")], ["alcohol use disorder"]),
        new CodeSet("condition-malnutrition", "https://example.org/vs/m", "1", "malnutrition", [], [], ["malnutrition"]),
        new CodeSet("condition-cirrhosis", "https://example.org/vs/c", "1", "cirrhosis", [], [], ["cirrhosis"]),
    ], "test");

    private static IReadOnlyList<Card> RateCards(PatientFacts facts, HookKind hook = HookKind.PatientView, IReadOnlyList<string>? newResults = null)
    {
        // Through the engine, so each card is rendered (summary, short detail, report) as it is sent.
        var request = Some.Request(facts, hook) with { NewResultIds = newResults ?? [] };
        return new DecisionEngine([new CorrectionRateCardProducer()], new RuleOptions(), Knowledge).Decide(request);
    }

    [Fact]
    public void Produce_TwelveIn20Hours_CriticalWithTheNumbers()
    {
        // Rise 12 mmol/L in 20 h is past the 2014 European guideline's 10 mmol/L in the first 24 h.
        var card = Assert.Single(RateCards(Some.Facts(Some.Sodium(112, 21, id: "na-nadir"), Some.Sodium(118, 11), Some.Sodium(124, 1, id: "na-last"))));
        Assert.Equal(CardIndicator.Critical, card.Indicator);
        Assert.Equal("correction-rate", card.Topic);
        var content = card.Content!;
        Assert.Equal(FindingKind.RateFastSummaryPast, content.Summary.Kind);
        Assert.Equal(12, RateFindings.Number(content.Summary, "rise"));
        Assert.Equal(10, RateFindings.Number(content.Summary, "limit"));
        Assert.Equal(FindingKind.RateLimitFirstDay, RateFindings.Phrase(content.Summary, "label").Kind);
        Assert.Contains("12 mmol/L in 20 h", card.Summary, StringComparison.Ordinal);
        Assert.Equal(3, RateFindings.Number(RateFindings.Of(content.Reasons, FindingKind.RateFastHoursLeft), "hours"), 6);
        Assert.Equal(14.4, RateFindings.Number(RateFindings.Of(content.Reasons, FindingKind.RateFastProjection), "projected"), 6); // 12 + 0.6 × 4
        Assert.Equal(FindingKind.RateFastNextRelower, content.NextSteps[2].Kind); // past the limit: re-lowering is discussed
        Assert.Contains("Observation/na-nadir", card.Report, StringComparison.Ordinal);
        Assert.Contains("Observation/na-last", card.Report, StringComparison.Ordinal);
        Assert.Contains("124 − 112 = 12 mmol/L", card.Report, StringComparison.Ordinal);
        Assert.Contains("Hours left in that window: 3 h", card.Report, StringComparison.Ordinal);
        Assert.Contains("**14.4 mmol/L**", card.Report, StringComparison.Ordinal);
        Assert.Contains("senior clinician", card.Report, StringComparison.Ordinal);
        Assert.Contains("chronic hyponatremia (present 48 h or more", card.Report, StringComparison.Ordinal); // acute vs chronic, 2014 European guideline
        Assert.Contains(SafetyCautions.Standing, card.Detail, StringComparison.Ordinal); // the standing cautions line
        Assert.Contains(SafetyCautions.CorrectionLimits, card.Report, StringComparison.Ordinal); // the full cautions, with osmotic demyelination
        Assert.Contains("Spasovski", card.Report, StringComparison.Ordinal);
        Assert.True(card.Detail.Length <= 700, card.Detail);
    }

    [Fact]
    public void Produce_NineIn20Hours_WarningApproaching()
    {
        var card = Assert.Single(RateCards(Some.Facts(Some.Sodium(112, 21), Some.Sodium(121, 1))));
        Assert.Equal(CardIndicator.Warning, card.Indicator); // 9 is within 2 of 10
        Assert.Equal(FindingKind.RateFastSummaryApproaching, card.Content!.Summary.Kind);
        Assert.Contains("approaching", card.Summary, StringComparison.Ordinal);
        Assert.Equal(FindingKind.RateFastNextSlow, card.Content.NextSteps[2].Kind);
    }

    [Fact]
    public void Produce_DayTwoOfTheEuropeanPreset_FirstDayRiseNotChargedAgainstTheLaterLimit()
    {
        // 2014 European guideline (reference sheet): ≤ 10 mmol/L in the first 24 h after the nadir, ≤ 8 in each 24 h after.
        // 110 at the nadir, 119 at 23 h (9 on day 1), 120 at 30 h (1 on day 2): within both; a rolling 24-h window from the
        // nadir would have read 10 against 8 and raised a false critical card (found in review).
        var cards = RateCards(Some.Facts(Some.Sodium(110, 31, id: "na-nadir"), Some.Sodium(119, 8), Some.Sodium(120, 1)));
        Assert.DoesNotContain(cards, c => c.Indicator == CdsNatremia.Core.Cards.CardIndicator.Critical);
    }

    [Fact]
    public void Produce_DayTwoRiseOfNine_CriticalAgainstTheLaterDayLimit()
    {
        // Same guideline: day 2 runs from nadir + 24 h; 112 at 24 h then 121 at 46 h is 9 > 8 in that day.
        var cards = RateCards(Some.Facts(Some.Sodium(110, 48, id: "na-nadir"), Some.Sodium(112, 24), Some.Sodium(121, 2)));
        Assert.Contains(cards, c => c.Indicator == CdsNatremia.Core.Cards.CardIndicator.Critical);
    }

    [Fact]
    public void Produce_OvershootThenRelowered_CriticalSayingTheLimitWasPassed()
    {
        // 2014 European guideline (reference sheet): ≤ 10 mmol/L in the first 24 h. 110 → 122 at 12 h passed it, even
        // though sodium was re-lowered to 118 at 20 h (found in review: the card used to say "approaching").
        var cards = RateCards(Some.Facts(Some.Sodium(110, 21, id: "na-nadir"), Some.Sodium(122, 9, id: "na-peak"), Some.Sodium(118, 1)));
        var card = Assert.Single(cards);
        Assert.Equal(CdsNatremia.Core.Cards.CardIndicator.Critical, card.Indicator);
        Assert.Equal(FindingKind.RateFastSummaryPassed, card.Content!.Summary.Kind);
        Assert.Equal(122, RateFindings.Number(card.Content.Summary, "peak"));
        var passed = RateFindings.Of(card.Content.Reasons, FindingKind.RateFastPassed);
        Assert.Contains("Observation/na-peak", passed.Evidence);
        Assert.Contains("limit was passed", card.Summary, StringComparison.Ordinal);
        Assert.Contains("Observation/na-peak", card.Detail, StringComparison.Ordinal); // the weightiest reason is on the short card
    }

    [Fact]
    public void Produce_LowerValueSecondsAfterTheLatestInTheSameMinute_NoFailure()
    {
        // Same-minute results are simultaneous (the highest is taken as the latest). A lower one 20 s later used to become
        // the nadir after the latest result and leave the rate window empty (a 500, found by fuzzing).
        var facts = Some.Facts(Some.Sodium(112, 21), Some.Sodium(120, 1), Some.Sodium(110, 1 - (20.0 / 3600)));
        var cards = RateCards(facts);
        Assert.All(cards, c => Assert.Contains("Advisory only", c.Detail, StringComparison.Ordinal));
        Assert.All(cards, c => Assert.Contains(FindingKind.RateFastStepSameTime, c.Content!.Steps.Select(f => f.Kind)));
    }

    [Fact]
    public void Produce_SlowSafeRise_NoCard()
        => Assert.Empty(RateCards(Some.Facts(Some.Sodium(126, 21), Some.Sodium(130, 1))));

    [Fact]
    public void Produce_RiseFromANormalSodium_NoCard()
        => Assert.Empty(RateCards(Some.Facts(Some.Sodium(135, 21), Some.Sodium(147, 1)))); // 135 is normal (2014 European guideline: hyponatremia < 135)

    [Fact]
    public void Produce_RiseFromJustBelowNormal_Watched()
        => Assert.Single(RateCards(Some.Facts(Some.Sodium(134, 21), Some.Sodium(146, 1))));

    [Fact]
    public void Produce_SingleResult_NoCard()
        => Assert.Empty(RateCards(Some.Facts(Some.Sodium(118, 1))));

    [Fact]
    public void Produce_HighRiskNadir105_StricterLimitAndSaysWhy()
    {
        // Nadir ≤ 105 mmol/L: high risk (US expert panel, Verbalis et al. 2013): 8 in any 24 h, so 8 is at the limit.
        var card = Assert.Single(RateCards(Some.Facts(Some.Sodium(105, 21), Some.Sodium(113, 1))));
        Assert.Equal(CardIndicator.Critical, card.Indicator);
        var caution = RateFindings.Of(card.Content!.Cautions, FindingKind.RateHighRiskCaution);
        Assert.Equal(8, RateFindings.Number(caution, "day"));
        Assert.Contains("High risk of osmotic demyelination", card.Detail, StringComparison.Ordinal); // the caution is on the short card
        Assert.Contains("lowest sodium 105 mmol/L", card.Report, StringComparison.Ordinal);
    }

    [Fact]
    public void Produce_Nadir106_NotHighRisk_EightIsOnlyApproaching()
        => Assert.Equal(CardIndicator.Warning, Assert.Single(RateCards(Some.Facts(Some.Sodium(106, 21), Some.Sodium(114, 1)))).Indicator);

    [Theory]
    [InlineData(3.7, 3.8, true)] // below the laboratory's lower limit
    [InlineData(3.8, 3.8, false)] // at it: not low
    [InlineData(3.4, null, true)] // no limit sent: configured 3.5 (common practice)
    [InlineData(3.5, null, false)]
    public void Produce_LowPotassium_HighRisk(double potassium, double? referenceLow, bool highRisk)
    {
        var k = Some.Lab(Analyte.Potassium, potassium, 2) with { ReferenceLow = referenceLow };
        var card = Assert.Single(RateCards(Some.Facts(Some.Sodium(112, 21), Some.Sodium(120, 1), k)));
        Assert.Equal(highRisk ? CardIndicator.Critical : CardIndicator.Warning, card.Indicator); // 8: at the high-risk limit, or approaching 10
        Assert.Equal(highRisk, RateFindings.Has(card.Content!.Cautions, FindingKind.RateHighRiskCaution));
        Assert.Equal(highRisk, card.Report.Contains("low potassium: ", StringComparison.Ordinal));
    }

    [Fact]
    public void Produce_AlcoholUseDisorder_HighRiskNamed()
    {
        var facts = Some.Facts(Some.Sodium(112, 21), Some.Sodium(120, 1)) with
        {
            Conditions = [new ConditionFact("c1", [new CodeRef(CodeSystems.Icd10, "F10.2")], "Alcohol dependence", null)],
        };
        var card = Assert.Single(RateCards(facts));
        Assert.Equal(CardIndicator.Critical, card.Indicator);
        Assert.Contains("alcohol use disorder", card.Detail, StringComparison.Ordinal); // named in the short caution
        Assert.Contains("Condition/c1", card.Report, StringComparison.Ordinal);
        Assert.Contains("Condition/c1", card.ResourcesUsed);
    }

    [Fact]
    public void Produce_ResultHookWithoutANewSodium_NoCard()
    {
        var facts = Some.Facts(Some.Sodium(112, 21), Some.Sodium(124, 1, id: "na-new"));
        Assert.Empty(RateCards(facts, HookKind.ResultArrive, ["k-new"]));
        Assert.Single(RateCards(facts, HookKind.ResultArrive, ["na-new"]));
    }

    [Fact]
    public void Produce_EnteredInErrorValueSetAside_NotCounted()
    {
        // The FHIR layer sets an entered-in-error result aside; only the usable results count, and the card lists it.
        var facts = Some.Facts(Some.Sodium(112, 21), Some.Sodium(120, 1)) with
        {
            SetAside = [new SetAsideItem("Observation/na-err", "Sodium 131 mmol/L", "status entered-in-error", Analyte.Sodium, Some.Now.AddHours(-10))],
        };
        var card = Assert.Single(RateCards(facts));
        Assert.Contains("8 mmol/L", card.Summary, StringComparison.Ordinal);
        Assert.Contains("Not used: Sodium 131 mmol/L: could not be read", card.Detail, StringComparison.Ordinal); // counted on the short card
        Assert.Contains("Observation/na-err", card.Report, StringComparison.Ordinal);
    }

    [Fact]
    public void Produce_ProfoundAndFlatForADay_InfoTooSlow()
    {
        // Minimum goal 4 mmol/L per day (US expert panel, Verbalis et al. 2013); 118 → 119 in 24 h is below it.
        var card = Assert.Single(RateCards(Some.Facts(Some.Sodium(118, 25), Some.Sodium(119, 1))));
        Assert.Equal(CardIndicator.Info, card.Indicator);
        Assert.Equal(FindingKind.RateSlowSummaryRose, card.Content!.Summary.Kind);
        Assert.Equal(4, RateFindings.Number(card.Content.Summary, "goal"));
        Assert.Equal(1, RateFindings.Number(card.Content.Headline, "perDay"), 6); // 1 mmol/L over 24 h
        Assert.Contains("minimum goal of 4 mmol/L", card.Summary, StringComparison.Ordinal);
    }

    [Fact]
    public void Produce_ModerateAndFlat_NoSlowCard()
        => Assert.Empty(RateCards(Some.Facts(Some.Sodium(126, 25), Some.Sodium(126, 1)))); // not profound

    [Fact]
    public void Produce_MixedSpecimens_Labelled()
    {
        var card = Assert.Single(RateCards(Some.Facts(Some.Sodium(112, 21), Some.Sodium(124, 1, specimen: SpecimenKind.ArterialBlood))));
        Assert.Contains("whole-blood specimen", card.Report, StringComparison.Ordinal);
        Assert.Contains("different kinds of specimen", card.Report, StringComparison.Ordinal);
        var day = card.Content!.Steps.First(f => f.Kind == FindingKind.RateWindow);
        Assert.Contains(Assert.IsType<ListValue>(day["extras"]).Values, v => v is PhraseValue { Finding.Kind: FindingKind.RateWindowMixedSpecimens });
    }
}
