using System.Text.Json.Nodes;
using CdsNatremia.Scenarios;
using CdsNatremia.Service.Tests.Support;

namespace CdsNatremia.Service.Tests.Audit;

/// <summary>Advice that is not repeated: a chart opening after an override of the same findings does not interrupt again.</summary>
public class RepeatedAdviceTests
{
    private static JsonObject Assessment(JsonArray cards)
        => cards.Single(c => (string?)c!["source"]!["topic"]!["code"] == "sodium-assessment")!.AsObject();

    [Fact]
    public async Task PatientView_SecondOpeningAfterOverride_InfoSayingLastReviewed()
    {
        await using var factory = NatremiaFactory.With(new() { ["Natremia:Display:TimeZone"] = "Europe/Berlin" });
        var client = factory.CreateClient();
        var first = Assessment(await HookCalls.RunAsync(client, ScenarioLibrary.Find("01")!));
        Assert.NotEqual("info", (string?)first["indicator"]); // scenario 01 interrupts on the first opening

        factory.Clock.Advance(TimeSpan.FromMinutes(10));
        var at = factory.Clock.GetUtcNow();
        using var feedback = await FeedbackCalls.PostAsync(client, FeedbackCalls.Body(FeedbackCalls.Overridden((string)first["uuid"]!, at, "already-reviewed")));
        Assert.True(feedback.IsSuccessStatusCode, await feedback.Content.ReadAsStringAsync());

        factory.Clock.Advance(TimeSpan.FromHours(2));
        var second = Assessment(await HookCalls.RunAsync(client, ScenarioLibrary.Find("01")!));

        Assert.Equal("info", (string?)second["indicator"]);
        Assert.StartsWith("Last reviewed 2 h ago: ", (string)second["summary"]!, StringComparison.Ordinal);
        // 12:10 UTC on 10 March is 13:10 in Berlin (CET, UTC+01:00: IANA tz database).
        Assert.Contains("**Already reviewed** 2026-03-10 13:10 (UTC+01:00) (2 h ago)", (string)second.CardText(), StringComparison.Ordinal);
    }

    [Fact]
    public async Task PatientView_SecondOpeningWithoutFeedback_InterruptsAgain()
    {
        await using var factory = new NatremiaFactory();
        var client = factory.CreateClient();
        var first = Assessment(await HookCalls.RunAsync(client, ScenarioLibrary.Find("01")!));
        factory.Clock.Advance(TimeSpan.FromHours(2));
        var second = Assessment(await HookCalls.RunAsync(client, ScenarioLibrary.Find("01")!));
        Assert.Equal((string?)first["indicator"], (string?)second["indicator"]);
        Assert.DoesNotContain("Already reviewed", (string)second.CardText(), StringComparison.Ordinal);
    }

    [Fact]
    public async Task PatientView_OverrideOlderThanTheQuietPeriod_InterruptsAgain()
    {
        await using var factory = NatremiaFactory.With(new() { ["Natremia:Audit:RepeatQuietHours"] = "1" });
        var client = factory.CreateClient();
        var first = Assessment(await HookCalls.RunAsync(client, ScenarioLibrary.Find("01")!));
        using var feedback = await FeedbackCalls.PostAsync(client, FeedbackCalls.Body(FeedbackCalls.Overridden((string)first["uuid"]!, factory.Clock.GetUtcNow(), "already-reviewed")));
        Assert.True(feedback.IsSuccessStatusCode, await feedback.Content.ReadAsStringAsync());
        factory.Clock.Advance(TimeSpan.FromHours(2));
        var second = Assessment(await HookCalls.RunAsync(client, ScenarioLibrary.Find("01")!));
        Assert.Equal((string?)first["indicator"], (string?)second["indicator"]);
    }
}
