using CdsNatremia.Core.Assessment;
using CdsNatremia.Core.Cards;
using CdsNatremia.Core.Engine;
using CdsNatremia.Core.Tests.Support;
using CdsNatremia.Core.Text;

namespace CdsNatremia.Core.Tests.Cards;

/// <summary>Suggestions that mean something: ordered by usefulness, at most two recommended, three on a chart opening (local choice, documented in SuggestionPolicy).</summary>
public class SuggestionPolicyTests
{
    private static Suggestion Lab(LabOrderProposal proposal, bool recommended) => LabOrders.AsSuggestion(proposal, recommended);

    private static Card CardWith(params Suggestion[] suggestions) => new()
    {
        Summary = "s",
        Indicator = CardIndicator.Warning,
        Detail = "d",
        Topic = "sodium-assessment",
        RuleIds = ["r"],
        Suggestions = suggestions,
    };

    private static readonly Suggestion[] FiveRecommended =
    [
        Lab(LabOrders.UrineSodium("r"), recommended: true),
        Lab(LabOrders.Glucose("r"), recommended: true),
        Lab(LabOrders.SerumOsmolality("r"), recommended: true),
        Lab(LabOrders.Cortisol("r"), recommended: false),
        Lab(LabOrders.UrineOsmolality("r"), recommended: true),
        Lab(LabOrders.SerumSodium("r"), recommended: true),
    ];

    [Fact]
    public void Apply_ManyRecommended_OnlyTheTwoMostUsefulStayRecommended()
    {
        var card = SuggestionPolicy.Apply(CardWith(FiveRecommended), HookKind.OrderSign);
        Assert.Equal(6, card.Suggestions.Count); // nothing dropped outside a chart opening
        Assert.Equal(["order-2951-2", "order-2692-2"], card.Suggestions.Where(s => s.IsRecommended == true).Select(s => s.Key));
        Assert.Equal("order-2951-2", card.Suggestions[0].Key); // recheck sodium first
    }

    [Fact]
    public void Apply_PatientView_AtMostThreeSuggestionsMostUsefulFirst()
    {
        var card = SuggestionPolicy.Apply(CardWith(FiveRecommended), HookKind.PatientView);
        Assert.Equal(["order-2951-2", "order-2692-2", "order-2345-7"], card.Suggestions.Select(s => s.Key));
        Assert.Equal([true, true, false], card.Suggestions.Select(s => s.IsRecommended == true));
    }

    [Fact]
    public void Apply_NotRecommendedByTheRule_NeverGainsARecommendation()
    {
        var card = SuggestionPolicy.Apply(CardWith(Lab(LabOrders.Cortisol("r"), false), Lab(LabOrders.Thyrotropin("r"), false)), HookKind.PatientView);
        Assert.All(card.Suggestions, s => Assert.NotEqual(true, s.IsRecommended));
    }

    [Fact]
    public void Apply_RecommendedBeforeOffered_EvenWhenTheOfferedTestRanksHigher()
    {
        // A serum sodium offered (not recommended) by the drug rule must not push a recommended osmolality off the chart card.
        var card = SuggestionPolicy.Apply(
            CardWith(Lab(LabOrders.SerumSodium("r"), false), Lab(LabOrders.Glucose("r"), true), Lab(LabOrders.SerumOsmolality("r"), true), Lab(LabOrders.UrineOsmolality("r"), true)),
            HookKind.PatientView);
        Assert.Equal(["order-2692-2", "order-2345-7", "order-2695-5"], card.Suggestions.Select(s => s.Key));
    }

    [Fact]
    public void Decide_EveryPatientViewCard_AtMostThreeSuggestionsAndTwoRecommended()
    {
        // 121 mmol/L with nothing else on record: the work-up misses every test (profound band: 2014 European guideline).
        var cards = Some.Engine().Decide(Some.Request(Some.Facts(Some.Sodium(121))));
        Assert.NotEmpty(cards);
        Assert.All(cards, c =>
        {
            Assert.InRange(c.Suggestions.Count, 0, SuggestionPolicy.MaxOnChartOpening);
            Assert.InRange(c.Suggestions.Count(s => s.IsRecommended == true), 0, SuggestionPolicy.MaxRecommended);
        });
        Assert.Contains(cards, c => c.Suggestions.Count == SuggestionPolicy.MaxOnChartOpening); // the cap was needed
    }

    [Theory]
    [InlineData(168, "7 days")]
    [InlineData(48, "2 days")]
    [InlineData(24, "24 h")]  // under 48 h stays in hours
    [InlineData(36, "36 h")]
    [InlineData(60, "60 h")]  // not whole days
    public void ClinicalDurationHours_WholeDaysFrom48h_ReadAsDays(double hours, string expected)
        => Assert.Equal(expected, ClinicalDuration.Hours(hours));
}
