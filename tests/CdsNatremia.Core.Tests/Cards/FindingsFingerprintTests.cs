using CdsNatremia.Core.Cards;
using CdsNatremia.Core.Tests.Support;
using CdsNatremia.Core.Text;

namespace CdsNatremia.Core.Tests.Cards;

/// <summary>The findings fingerprint: same findings, same fingerprint; a new result or a worse band, another.</summary>
public class FindingsFingerprintTests
{
    private static Card Workup(params CdsNatremia.Core.Facts.LabResult[] labs)
        => Some.Engine().Decide(Some.Request(Some.Facts(labs))).Single(c => c.Topic == "sodium-assessment");

    [Fact]
    public void Decide_SameChartTwice_SameFingerprint()
        => Assert.Equal(Workup(Some.Sodium(128, id: "na-1")).Fingerprint, Workup(Some.Sodium(128, id: "na-1")).Fingerprint);

    [Fact]
    public void Decide_SameChartLaterNow_SameFingerprint()
    {
        var request = Some.Request(Some.Facts(Some.Sodium(128, id: "na-1")));
        var later = request with { Now = request.Now.AddHours(3) };
        Assert.Equal(
            Some.Engine().Decide(request).Single(c => c.Topic == "sodium-assessment").Fingerprint,
            Some.Engine().Decide(later).Single(c => c.Topic == "sodium-assessment").Fingerprint);
    }

    [Fact]
    public void Decide_NewResult_OtherFingerprint()
        => Assert.NotEqual(
            Workup(Some.Sodium(128, hoursAgo: 6, id: "na-1")).Fingerprint,
            Workup(Some.Sodium(128, hoursAgo: 6, id: "na-1"), Some.Sodium(128, hoursAgo: 1, id: "na-2")).Fingerprint);

    [Fact]
    public void Decide_WorseBand_OtherFingerprint()
        // 128 moderate, 122 profound (2014 European guideline bands): the indicator and the rules differ.
        => Assert.NotEqual(Workup(Some.Sodium(128, id: "na-1")).Fingerprint, Workup(Some.Sodium(122, id: "na-1")).Fingerprint);

    [Fact]
    public void Quiet_ReviewedCard_InfoWithLastReviewedTimeAndAge()
    {
        var card = Workup(Some.Sodium(122, id: "na-1"));
        var quiet = RepeatedAdvice.Quiet(card, Some.Now.AddHours(-3), TimeDisplay.Utc(Some.Now));
        Assert.Equal(CardIndicator.Info, quiet.Indicator);
        Assert.StartsWith("Last reviewed 3 h ago: ", quiet.Summary, StringComparison.Ordinal);
        Assert.InRange(quiet.Summary.Length, 1, Summary.MaxLength);
        Assert.Contains("**Already reviewed** 2026-03-10 09:00 UTC (3 h ago)", quiet.Report, StringComparison.Ordinal);
        Assert.EndsWith(card.Report, quiet.Report, StringComparison.Ordinal); // the advice itself is still all there
        Assert.Equal(card.Fingerprint, quiet.Fingerprint);
    }
}
