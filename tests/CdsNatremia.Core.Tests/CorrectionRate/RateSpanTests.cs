using CdsNatremia.Core.CorrectionRate;
using CdsNatremia.Core.Engine;
using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Knowledge;
using CdsNatremia.Core.Sodium;
using CdsNatremia.Core.Tests.Support;

namespace CdsNatremia.Core.Tests.CorrectionRate;

/// <summary>The minimum span of a rate (default 2 h, common practice) and window labels that match the measured span.</summary>
public class RateSpanTests
{
    private static IReadOnlyList<CdsNatremia.Core.Cards.Card> RateCards(PatientFacts facts, RuleOptions? options = null)
        => new DecisionEngine([new CorrectionRateCardProducer()], options ?? new RuleOptions(), KnowledgeBase.Empty).Decide(Some.Request(facts));

    private static RateWindow Day(PatientFacts facts, CorrectionRateOptions? options = null)
    {
        options ??= new CorrectionRateOptions();
        var series = SodiumSeries.From(facts, Some.Now, new SodiumReadingOptions());
        var episode = CorrectionEpisode.Find(series, options)!;
        return RateWindows.Measure(episode, episode.Latest.EffectiveAt, 24, options.Resolve(), false, Some.Now, options);
    }

    // 117 → 133 is 16 mmol/L: far past the 10 mmol/L first-day limit (2014 European guideline) if it were a rise.
    [Theory]
    [InlineData(0.5, false)]   // 30 min apart: below the 2-h minimum span, no rate
    [InlineData(1.99, false)]  // just below 2 h
    [InlineData(2.0, true)]    // at 2 h: a rate is computed
    [InlineData(3.0, true)]
    public void Produce_TwoResultsApart_RateOnlyFromTheMinimumSpan(double hoursApart, bool expectCard)
    {
        var facts = Some.Facts(Some.Sodium(117, 1 + hoursApart), Some.Sodium(133, 1));
        Assert.Equal(expectCard, RateCards(facts).Count > 0);
    }

    [Fact]
    public void Measure_ResultsCloserThanMinimumSpan_NoRiseAndSaysWhy()
    {
        var window = Day(Some.Facts(Some.Sodium(117, 1.5), Some.Sodium(133, 1)));
        Assert.True(window.SpanTooShort);
        Assert.Equal(RateStatus.NoRise, window.Status);
        Assert.Null(window.ProjectedRise);
    }

    [Fact]
    public void Measure_MinimumSpanConfiguredToZero_RateComputed()
    {
        var options = new CorrectionRateOptions { MinimumRateSpanHours = 0 };
        Assert.Equal(RateStatus.AtOrPast, Day(Some.Facts(Some.Sodium(117, 1.5), Some.Sodium(133, 1)), options).Status);
    }

    [Fact]
    public void Produce_RiseMeasuredOver29HoursAgainstA24HourLimit_LabelSaysTheMeasuredSpan()
    {
        // Nadir 110 at 53 h, 118 at 29 h, 127 now: the day-2 window has no result at its start, so its baseline is 29 h back.
        var card = Assert.Single(RateCards(Some.Facts(Some.Sodium(110, 54), Some.Sodium(118, 30), Some.Sodium(127, 1))));
        Assert.Contains("rise measured over 29 h", card.Report, StringComparison.Ordinal);
        Assert.DoesNotContain("**24-h window** (the 24 h ending", card.Report, StringComparison.Ordinal);
    }
}
