using CdsNatremia.Core.Text;

namespace CdsNatremia.Core.Tests.Text;

/// <summary>Times shown to clinicians: the display zone and the result's age (wording: common practice for chart displays).</summary>
public class TimeDisplayTests
{
    private static readonly DateTimeOffset Now = new(2026, 12, 2, 12, 40, 0, TimeSpan.Zero);

    private static TimeZoneInfo Berlin => TimeZoneInfo.FindSystemTimeZoneById("Europe/Berlin");

    [Theory]
    [InlineData(0, "just now")]
    [InlineData(59, "just now")]               // under a minute
    [InlineData(60, "1 min ago")]
    [InlineData(59 * 60 + 59, "59 min ago")]   // rounded down, never fresher than it is
    [InlineData(3600, "1 h ago")]
    [InlineData(3 * 3600 + 59 * 60, "3 h ago")]
    [InlineData(48 * 3600 - 1, "47 h ago")]    // under 48 h still in hours
    [InlineData(48 * 3600, "2 days ago")]
    [InlineData(10 * 86400 + 3600, "10 days ago")]
    public void Age_SecondsBeforeNow_WordedInWholeUnitsRoundedDown(int secondsBefore, string expected)
        => Assert.Equal(expected, TimeDisplay.Utc(Now).Age(Now.AddSeconds(-secondsBefore)));

    [Fact]
    public void Age_SlightlyAfterNow_JustNow()
        => Assert.Equal("just now", TimeDisplay.Utc(Now).Age(Now.AddSeconds(30)));

    [Fact]
    public void AgeAndTime_Utc_AgeThenShortTimeWithoutLabel()
        => Assert.Equal("3 h ago, 02 Dec 09:40", TimeDisplay.Utc(Now).AgeAndTime(Now.AddHours(-3)));

    [Fact]
    public void AgeAndTime_Berlin_LocalWallClockWithoutUtcLabel()
        // 09:40 UTC on 2 December is 10:40 in Berlin (CET, UTC+01:00: IANA tz database).
        => Assert.Equal("3 h ago, 02 Dec 10:40", new TimeDisplay(Berlin, Now).AgeAndTime(Now.AddHours(-3)));

    [Fact]
    public void Time_Utc_KeepsTheUtcLabel()
        => Assert.Equal("2026-12-02 09:40 UTC", TimeDisplay.Utc(Now).Time(Now.AddHours(-3)));

    [Theory]
    [InlineData(2026, 12, 2, 9, 40, "2026-12-02 10:40 (UTC+01:00)")] // winter time, CET (IANA tz database)
    [InlineData(2026, 7, 1, 9, 40, "2026-07-01 11:40 (UTC+02:00)")]  // summer time, CEST (IANA tz database)
    public void Time_Berlin_LocalTimeWithTheOffsetInForceThen(int y, int mo, int d, int h, int mi, string expected)
        => Assert.Equal(expected, new TimeDisplay(Berlin, Now).Time(new DateTimeOffset(y, mo, d, h, mi, 0, TimeSpan.Zero)));

    [Fact]
    public void Time_WestOfUtc_NegativeOffsetPrinted()
        // 09:40 UTC on 2 December is 04:40 in New York (EST, UTC−05:00: IANA tz database).
        => Assert.Equal("2026-12-02 04:40 (UTC−05:00)", new TimeDisplay(TimeZoneInfo.FindSystemTimeZoneById("America/New_York"), Now).Time(Now.AddHours(-3)));
}
