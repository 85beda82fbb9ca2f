using CdsNatremia.Core.Drugs;
using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Tests.Support;

namespace CdsNatremia.Core.Tests.Drugs;

public class OrderWarningReasonTests
{
    // Lower limit of normal 135 mmol/L (reference sheet, common practice; 2014 European guideline: hyponatremia < 135).
    private const double NormalFrom = 135;
    private static readonly DrugCauseOptions Defaults = new();

    private static OrderWarningReason? Decide(int? age, params LabResult[] series)
        => OrderWarningReason.Decide(series.OrderBy(r => r.EffectiveAt).ToList(), NormalFrom, Defaults, Some.Now, age);

    [Theory]
    [InlineData(134.9, OrderWarningTrigger.Low)] // just below the lower limit of normal
    [InlineData(129.0, OrderWarningTrigger.Low)] // scenario 17's value
    public void Decide_LowLatest_Low(double value, OrderWarningTrigger expected)
        => Assert.Equal(expected, Decide(50, Some.Sodium(value))!.Trigger);

    [Fact]
    public void Decide_AtTheLowerLimitAndStable_NoWarning()
        => Assert.Null(Decide(80, Some.Sodium(135.0, hoursAgo: 24 * 30), Some.Sodium(135.0)));

    [Theory]
    [InlineData(140.0, true)]  // 140 → 136: a drop of 4 mmol/L, the meaningful drop (default 4, common practice)
    [InlineData(139.9, false)] // 3.9: within variation
    public void Decide_DropWithinTheWindow_Boundary(double earlier, bool falling)
    {
        var reason = Decide(50, Some.Sodium(earlier, hoursAgo: 48), Some.Sodium(136));
        Assert.Equal(falling, reason?.Trigger == OrderWarningTrigger.Falling);
    }

    [Theory]
    [InlineData(168.0, true)]  // taken exactly 7 days (the default window) before the latest: inside
    [InlineData(168.1, false)] // just outside the window
    public void Decide_FallingWindow_Boundary(double hoursBeforeLatest, bool falling)
    {
        var reason = Decide(50, Some.Sodium(142, hoursAgo: 2 + hoursBeforeLatest), Some.Sodium(136, hoursAgo: 2));
        Assert.Equal(falling, reason?.Trigger == OrderWarningTrigger.Falling);
    }

    [Theory]
    [InlineData(64, false)] // below the configured age (default 65, common practice)
    [InlineData(65, true)]  // at it
    public void Decide_NoSodium_WarnsFromTheConfiguredAge(int age, bool warns)
        => Assert.Equal(warns, Decide(age)?.Trigger == OrderWarningTrigger.AbsentOlderPatient);

    [Fact]
    public void Decide_NoSodiumAndUnknownAge_NoWarning()
        => Assert.Null(Decide(null));

    [Theory]
    [InlineData(179.9, false)] // a normal sodium inside the recent window (default 180 days) is a baseline
    [InlineData(180.1, true)]  // older than the window: no recent baseline
    public void Decide_OldNormalSodium_CountsAsAbsentForOlderPatient(double daysAgo, bool warns)
        => Assert.Equal(warns, Decide(80, Some.Sodium(140, hoursAgo: 24 * daysAgo))?.Trigger == OrderWarningTrigger.AbsentOlderPatient);

    [Fact]
    public void Decide_AbsentWarningSwitchedOff_NoWarning()
    {
        var options = new DrugCauseOptions { WarnWhenSodiumAbsent = false };
        Assert.Null(OrderWarningReason.Decide([], NormalFrom, options, Some.Now, 90));
    }
}
