using CdsNatremia.Core.Cards;
using CdsNatremia.Core.Tests.Support;

namespace CdsNatremia.Core.Tests.Engine;

/// <summary>Card order: the most urgent first; a safety card before the work-up card of the same urgency.</summary>
public class CardOrderTests
{
    [Fact]
    public void Decide_CriticalRateAndCriticalWorkup_RateCardFirst()
    {
        // 112 → 124 in 20 h: past the 10 mmol/L first-day limit (2014 European guideline), and 124 is profound.
        var cards = Some.Engine().Decide(Some.Request(Some.Facts(Some.Sodium(112, 21), Some.Sodium(118, 11), Some.Sodium(124, 1))));
        Assert.Equal(2, cards.Count);
        Assert.All(cards, c => Assert.Equal(CardIndicator.Critical, c.Indicator));
        Assert.Equal("correction-rate", cards[0].Topic);
        Assert.Equal("sodium-assessment", cards[1].Topic);
    }

    [Fact]
    public void Decide_WarningRateAndCriticalWorkup_CriticalFirst()
    {
        // 112 → 121 in 20 h: approaching (within 2 of 10): a warning; 121 is profound: critical.
        var cards = Some.Engine().Decide(Some.Request(Some.Facts(Some.Sodium(112, 21), Some.Sodium(121, 1))));
        Assert.Equal([CardIndicator.Critical, CardIndicator.Warning], cards.Select(c => c.Indicator));
    }
}
