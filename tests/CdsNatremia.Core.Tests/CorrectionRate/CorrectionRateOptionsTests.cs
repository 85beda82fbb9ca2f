using CdsNatremia.Core.CorrectionRate;

namespace CdsNatremia.Core.Tests.CorrectionRate;

public class CorrectionRateOptionsTests
{
    [Fact]
    public void Resolve_European2014_TenThenEight()
    {
        var limits = new CorrectionRateOptions { Preset = CorrectionRatePreset.European2014 }.Resolve();

        // 2014 European guideline (Spasovski et al., Eur J Endocrinol 2014;170:G1; reference sheet: secondary):
        // ≤ 10 mmol/L in the first 24 h, ≤ 8 mmol/L in each 24 h after.
        Assert.Equal(10, limits.FirstDay);
        Assert.Equal(8, limits.LaterDay);
        Assert.Equal(18, limits.TwoDays); // 10 + 8 over the first 48 h, which the guideline's two limits imply
        // High risk: the US expert panel's 8 mmol/L in any 24 h (Verbalis et al., Am J Med 2013;126:S1; secondary).
        Assert.Equal(8, limits.HighRiskDay);
        Assert.Contains("Spasovski", limits.Source, StringComparison.Ordinal);
    }

    [Fact]
    public void Resolve_UsExpertPanel_TenInAny24hEighteenIn48hEightAtHighRisk()
    {
        var limits = new CorrectionRateOptions { Preset = CorrectionRatePreset.UsExpertPanel2013 }.Resolve();

        // US expert panel (Verbalis et al., Am J Med 2013;126:S1; reference sheet: secondary): 10–12 mmol/L in 24 h
        // (the preset takes the lower end), 18 in 48 h; 8 in any 24 h at high risk; minimum goal 4–8 (4–6 high risk) per day.
        Assert.Equal(10, limits.FirstDay);
        Assert.Equal(10, limits.LaterDay);
        Assert.Equal(18, limits.TwoDays);
        Assert.Equal(8, limits.HighRiskDay);
        Assert.Equal(16, limits.HighRiskTwoDays); // 8 in each of two 24 h periods, derived from "8 in any 24 h"
        Assert.Equal(4, limits.MinimumDailyGoal);
        Assert.Equal(4, limits.MinimumDailyGoalHighRisk);
        Assert.Contains("Verbalis", limits.Source, StringComparison.Ordinal);
    }

    [Fact]
    public void Resolve_Default_IsTheEuropeanGuideline()
        => Assert.Equal(new CorrectionRateOptions { Preset = CorrectionRatePreset.European2014 }.Resolve(), new CorrectionRateOptions().Resolve());

    [Fact]
    public void Resolve_Custom_TakesTheConfiguredNumbers()
    {
        var limits = new CorrectionRateOptions { Preset = CorrectionRatePreset.Custom, FirstDayLimit = 6, LaterDayLimit = 5, TwoDayLimit = 11, CustomSource = "local" }.Resolve();
        Assert.Equal((6, 5, 11), (limits.FirstDay, limits.LaterDay, limits.TwoDays));
        Assert.Equal("local", limits.Source);
    }

    [Theory]
    [InlineData(true, true, 8)] // high risk: 8 in any 24 h (US panel)
    [InlineData(false, true, 10)] // first 24 h: 10 (European 2014)
    [InlineData(false, false, 8)] // each later 24 h: 8 (European 2014)
    public void Day_PicksTheLimitForTheWindowAndRisk(bool highRisk, bool firstDay, double expected)
        => Assert.Equal(expected, new CorrectionRateOptions().Resolve().Day(firstDay, highRisk));
}
