using System.Text.Json.Nodes;
using System.Text.RegularExpressions;
using CdsNatremia.Scenarios;
using CdsNatremia.Service.Tests.Support;

namespace CdsNatremia.Service.Tests.Configuration;

/// <summary>The display time zone setting (Natremia:Display:TimeZone) changes every time shown on the cards.</summary>
public partial class DisplayTimeZoneTests
{
    private static async Task<JsonArray> CardsAsync(string zone, string scenarioId)
    {
        await using var factory = NatremiaFactory.With(new() { ["Natremia:Display:TimeZone"] = zone });
        return await HookCalls.RunAsync(factory.CreateClient(), ScenarioLibrary.Find(scenarioId)!);
    }

    private static string Text(JsonArray cards)
        => string.Join("\n", cards.Select(c => (string)c!["summary"]! + "\n" + (string?)c["detail"]));

    [Theory]
    [InlineData("01")] // patient-view
    [InlineData("08")]
    public async Task PatientView_BerlinZone_NoTimeShownInUtcAndEveryTimeShifted(string scenarioId)
    {
        var utc = Text(await CardsAsync("UTC", scenarioId));
        var berlin = Text(await CardsAsync("Europe/Berlin", scenarioId));

        Assert.Matches(UtcTime(), utc);
        Assert.DoesNotMatch(UtcTime(), berlin); // no time left in UTC
        // The scenario anchor is in March, before the change to summer time: Berlin is UTC+01:00 (IANA tz database).
        Assert.Contains("(UTC+01:00)", berlin, StringComparison.Ordinal);
        // Every time shown moved: as many clock times in both answers, and none of the UTC answer's left in Berlin's
        // unless an hour later also appears there.
        var utcTimes = ClockTime().Matches(utc).Select(m => m.Value).ToList();
        var berlinTimes = ClockTime().Matches(berlin).Select(m => m.Value).ToList();
        Assert.Equal(utcTimes.Count, berlinTimes.Count);
        Assert.Equal(utcTimes.Select(PlusOneHour), berlinTimes);
    }

    [Fact]
    public async Task PatientView_Summary_CarriesTheResultAge()
    {
        var cards = await CardsAsync("Europe/Berlin", "01");
        var summary = (string)cards.Single(c => (string?)c!["source"]!["topic"]!["code"] == "sodium-assessment")!["summary"]!;
        Assert.Matches(AgeThenTime(), summary);
    }

    [Fact]
    public void Start_UnknownTimeZone_RefusesNamingTheSetting()
    {
        using var factory = NatremiaFactory.With(new() { ["Natremia:Display:TimeZone"] = "Mars/Olympus_Mons" });
        var error = Assert.ThrowsAny<Exception>(() => factory.CreateClient());
        Assert.Contains("Natremia:Display:TimeZone", Exceptions.AllMessages(error), StringComparison.Ordinal);
    }

    [GeneratedRegex(@"\d{2}:\d{2} UTC\b")]
    private static partial Regex UtcTime();

    private static string PlusOneHour(string hhmm)
        => TimeOnly.ParseExact(hhmm, "HH:mm", System.Globalization.CultureInfo.InvariantCulture).AddHours(1).ToString("HH:mm", System.Globalization.CultureInfo.InvariantCulture);

    /// <summary>A clock time "HH:mm", not the offset inside "(UTC+01:00)".</summary>
    [GeneratedRegex(@"(?<![+−\d:])\b\d{2}:\d{2}\b")]
    private static partial Regex ClockTime();

    [GeneratedRegex(@"(\d+ (min|h|days) ago|just now), \d{2} [A-Z][a-z]{2} \d{2}:\d{2}")]
    private static partial Regex AgeThenTime();
}
