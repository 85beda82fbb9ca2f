using CdsNatremia.Core.CorrectionRate;
using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Findings;
using CdsNatremia.Core.Sodium;
using CdsNatremia.Core.Tests.Support;

namespace CdsNatremia.Core.Tests.CorrectionRate;

public class RateWindowsTests
{
    private static readonly CorrectionRateOptions Options = new();
    private static readonly CorrectionLimits Limits = Options.Resolve(); // 2014 European guideline: 10 first 24 h, 8 each 24 h after

    private static CorrectionEpisode Episode(params LabResult[] results)
        => CorrectionEpisode.Find(SodiumSeries.From(Some.Facts(results), Some.Now, new SodiumReadingOptions()), Options)!;

    private static RateWindow Day(CorrectionEpisode episode, bool highRisk = false)
        => RateWindows.Measure(episode, episode.Latest.EffectiveAt, 24, Limits, highRisk, Some.Now, Options);

    [Fact]
    public void Measure_RiseFromTheNadir_Anchored()
    {
        var episode = Episode(Some.Sodium(125, 400), Some.Sodium(112, 21, id: "nadir"), Some.Sodium(115, 15), Some.Sodium(119, 8), Some.Sodium(124, 1, id: "last"));
        var day = Day(episode);
        Assert.Equal("nadir", episode.Nadir.ResourceId); // the old 125 is outside the 72 h look-back and not lower anyway
        Assert.True(day.AnchoredAtNadir);
        Assert.Equal(12, day.Rise);
        Assert.Equal(RateStatus.AtOrPast, day.Status); // 12 ≥ 10 (European 2014, first 24 h)
        Assert.Equal(3, day.HoursLeft!.Value, 6); // window ends 21 h ago + 24 h = 3 h from now
        Assert.Equal(14.4, day.ProjectedRise!.Value, 6); // 12 / 20 h × 4 h more to the window end + 12
    }

    [Theory]
    [InlineData(9.9, RateStatus.Approaching)] // just below 10, within the 2 mmol/L margin
    [InlineData(10, RateStatus.AtOrPast)] // at the limit counts as reached
    [InlineData(10.1, RateStatus.AtOrPast)]
    [InlineData(7.9, RateStatus.Within)] // below the margin; projection 7.9 + 7.9/20 × 4 = 9.48 < 10
    [InlineData(0, RateStatus.NoRise)]
    public void Measure_BoundariesOfTheFirstDayLimit(double rise, RateStatus expected)
        => Assert.Equal(expected, Day(Episode(Some.Sodium(112, 21), Some.Sodium(112 + rise, 1))).Status);

    [Fact]
    public void Measure_ExactlyTwentyFourHoursAfterTheNadir_StillTheFirstDay()
    {
        var day = Day(Episode(Some.Sodium(110, 30), Some.Sodium(119, 6)));
        Assert.True(day.AnchoredAtNadir);
        Assert.Equal(FindingKind.RateLimitFirstDay, day.LimitLabel.Kind);
        Assert.Equal(10, day.Limit); // 9 < 10: within, though 9 ≥ 8 would be past a later-day limit
        Assert.Equal(0, day.HoursLeft); // window ended 6 h ago
    }

    [Fact]
    public void Measure_OneMinutePastTwentyFourHours_RollingWindowWithTheLaterLimit()
    {
        var day = Day(Episode(Some.Sodium(110, 30 + (1.0 / 60)), Some.Sodium(119, 6)));
        Assert.False(day.AnchoredAtNadir);
        Assert.Equal(8, day.Limit); // European 2014: ≤ 8 in each 24 h after the first
        Assert.Equal(RateStatus.AtOrPast, day.Status); // the nadir is still the best estimate at the window start
        Assert.Null(day.HoursLeft);
    }

    [Fact]
    public void Measure_RollingWindow_BaselineIsTheLowestAtOrInsideTheStart()
    {
        // Nadir 110 at −60 h, 118 at −30 h, 116 at −20 h, 124 at −1 h: window −25 h to −1 h; at its start sodium was 118,
        // inside it 116: the lower 116 is the baseline, rise 8.
        var day = Day(Episode(Some.Sodium(110, 60), Some.Sodium(118, 30), Some.Sodium(116, 20, id: "dip"), Some.Sodium(124, 1)));
        Assert.Equal("dip", day.Baseline.ResourceId);
        Assert.Equal(8, day.Rise);
    }

    [Fact]
    public void Measure_OutOfOrderInput_SameAsInOrder()
    {
        var a = Some.Sodium(112, 21, id: "a");
        var b = Some.Sodium(118, 10, id: "b");
        var c = Some.Sodium(121, 1, id: "c");
        var ordered = Day(Episode(a, b, c));
        var shuffled = Day(Episode(c, a, b));
        Assert.Equal(ordered.Rise, shuffled.Rise);
        Assert.Equal(ordered.Baseline.ResourceId, shuffled.Baseline.ResourceId);
        Assert.Equal("c", shuffled.Latest.ResourceId);
    }

    [Fact]
    public void Measure_DuplicateObservation_CountedOnce()
    {
        var nadir = Some.Sodium(112, 21, id: "n");
        var last = Some.Sodium(121, 1, id: "l");
        var episode = Episode(nadir, last, last, nadir);
        Assert.Equal(2, episode.Results.Count);
        Assert.Equal(9, Day(episode).Rise);
    }

    [Fact]
    public void Find_SameMinuteResults_HighestTakenAsLatestOthersKept()
    {
        var lab = Some.Sodium(121, 1, id: "lab");
        var gas = Some.Sodium(123, 1, specimen: SpecimenKind.ArterialBlood, id: "gas");
        var episode = Episode(Some.Sodium(112, 21, id: "n"), lab, gas);
        Assert.Equal("gas", episode.Latest.ResourceId); // the cautious choice for an over-correction check
        Assert.Equal("lab", Assert.Single(episode.SameTimeAsLatest).ResourceId);
        var day = Day(episode);
        Assert.Equal(11, day.Rise);
        Assert.True(day.MixedSpecimens); // blood gas vs laboratory: labelled
    }

    [Fact]
    public void Measure_SameMinuteNadirAndLatest_NoProjection()
    {
        var day = Day(Episode(Some.Sodium(112, 1, id: "a"), Some.Sodium(113, 1, id: "b")));
        Assert.Null(day.ProjectedRise); // no elapsed time, no rate
    }

    [Fact]
    public void Find_FallingSeries_NadirIsTheLatest_NoRise()
    {
        var episode = Episode(Some.Sodium(128, 30), Some.Sodium(122, 10), Some.Sodium(118, 1, id: "low"));
        Assert.Equal("low", episode.Nadir.ResourceId);
        Assert.False(episode.IsRising);
        Assert.Equal(RateStatus.NoRise, Day(episode).Status);
    }

    [Fact]
    public void Find_RepeatedLowestValue_TheMostRecentStartsTheEpisode()
    {
        var episode = Episode(Some.Sodium(112, 40, id: "first"), Some.Sodium(116, 30), Some.Sodium(112, 20, id: "again"), Some.Sodium(117, 1));
        Assert.Equal("again", episode.Nadir.ResourceId);
    }

    [Fact]
    public void Measure_HighRisk_EightInAny24h()
    {
        var day = Day(Episode(Some.Sodium(112, 21), Some.Sodium(120, 1)), highRisk: true);
        Assert.Equal(8, day.Limit); // US expert panel: 8 mmol/L in any 24 h at high risk
        Assert.Equal(RateStatus.AtOrPast, day.Status);
    }

    [Fact]
    public void Measure_48hWindow_EighteenLimit()
    {
        var episode = Episode(Some.Sodium(110, 47), Some.Sodium(118, 24), Some.Sodium(127, 1));
        var two = RateWindows.Measure(episode, episode.Latest.EffectiveAt, 48, Limits, false, Some.Now, Options);
        Assert.Equal(18, two.Limit); // 10 + 8 (European 2014), the US panel's 18 in 48 h
        Assert.Equal(17, two.Rise);
        Assert.Equal(RateStatus.Approaching, two.Status);
    }
}
