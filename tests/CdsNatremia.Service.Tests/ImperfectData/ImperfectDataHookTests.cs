using System.Net;
using System.Text.Json.Nodes;
using CdsNatremia.Scenarios;
using CdsNatremia.Service.Tests.Support;

namespace CdsNatremia.Service.Tests.ImperfectData;

/// <summary>
/// Imperfect data over HTTP, on the invented scenarios 25–30 and variants: never silent, never "normal" by default,
/// never another patient's data. Each test fails on the code before fact states were introduced (noted per test).
/// </summary>
public class ImperfectDataHookTests(NatremiaFactory factory) : IClassFixture<NatremiaFactory>
{
    private static string Topic(JsonNode? card) => (string)card!["source"]!["topic"]!["code"]!;

    private static string Text(JsonArray cards) => string.Join("\n", cards.Select(c => (string)c!["summary"]! + "\n" + (string)c.CardText()));

    private Task<JsonArray> RunAsync(string id) => HookCalls.RunAsync(factory.CreateClient(), ScenarioLibrary.Find(id)!);

    [Theory]
    [InlineData("25")]
    [InlineData("26")]
    [InlineData("27")]
    [InlineData("28")]
    [InlineData("29")]
    [InlineData("30")]
    public async Task ImperfectDataScenario_EveryManifestMentionOnTheCards(string id)
    {
        var scenario = ScenarioLibrary.Find(id)!;
        var text = Text(await HookCalls.RunAsync(factory.CreateClient(), scenario));
        Assert.NotEmpty(scenario.ExpectedMentions);
        Assert.All(scenario.ExpectedMentions, m => Assert.Contains(m, text, StringComparison.OrdinalIgnoreCase));
    }

    // Defect 1. Before: the bound was set aside, "no assessment" and the value printed as "LessThan100".
    [Fact]
    public async Task ChartReview_NewestSodiumBelow100_ProfoundCriticalPrintedAsBoundNoRate()
    {
        var cards = await RunAsync("26");
        var card = Assert.Single(cards);
        Assert.Equal("critical", (string?)card!["indicator"]); // below 100 < 125: profound (2014 European guideline)
        Assert.Contains("below 100 mmol/L", (string)card["summary"]!, StringComparison.Ordinal);
        Assert.Contains("(profound", (string)card["summary"]!, StringComparison.Ordinal);
        Assert.DoesNotContain("LessThan", Text(cards), StringComparison.Ordinal);
        Assert.DoesNotContain("no assessment", Text(cards), StringComparison.Ordinal);
        Assert.Contains("no rise, fall or correction rate is computed", (string)card.CardText(), StringComparison.Ordinal);
    }

    // Defect 2. Before: {"cards":[]} because the older usable 137 is normal.
    [Fact]
    public async Task ChartReview_NewestSodiumImplausibleAfterRecentLow_WarningWithReasonAndRecheck()
    {
        var cards = await RunAsync("27");
        var card = Assert.Single(cards);
        Assert.Equal("warning", (string?)card!["indicator"]); // older value 131 within 72 h was low
        Assert.Contains("could not be used", (string)card["summary"]!, StringComparison.Ordinal);
        Assert.Contains("plausible range", (string)card.CardText(), StringComparison.Ordinal);
        Assert.Contains("Sodium, serum or plasma", card["suggestions"]!.ToJsonString(), StringComparison.Ordinal);
        Assert.DoesNotContain("12400 mmol/L: **", (string)card.CardText(), StringComparison.Ordinal); // never the latest
    }

    [Theory]
    [InlineData("1e400")]   // beyond any decimal: the entry does not parse
    [InlineData("12400")]   // outside physiological plausibility (common practice)
    public async Task ChartReview_NewestSodiumUnreadableOlderNormal_InfoCardNeverEmpty(string value)
    {
        var request = HookCalls.Request(ScenarioLibrary.Find("13")!); // normal sodium: no card on clean data
        var sodium = request["prefetch"]!["sodium"]!["entry"]!.AsArray();
        var newest = sodium[0]!["resource"]!.DeepClone().AsObject();
        newest["id"] = "na-newest";
        newest["effectiveDateTime"] = "2026-03-10T11:00:00Z";
        newest.Remove("issued");
        sodium.Add(new JsonObject { ["resource"] = JsonNode.Parse(newest.ToJsonString().Replace("\"value\":" + (double)newest["valueQuantity"]!["value"]!, "\"value\":" + value, StringComparison.Ordinal)) });
        var cards = await HookCalls.CardsAsync(await HookCalls.PostAsync(factory.CreateClient(), "natremia-chart-review", request));
        var card = Assert.Single(cards);
        Assert.Equal("info", (string?)card!["indicator"]);
        Assert.Contains("Observation/na-newest", (string)card.CardText(), StringComparison.Ordinal);
    }

    // Defect 3. Before: a critical "rose 10 mmol/L in 0 h" card from the preliminary 117 to the amended 127.
    [Fact]
    public async Task ResultHook_AmendedSupersedesPreliminary_NoRateCardAndSupersededListed()
    {
        var cards = await RunAsync("25");
        Assert.DoesNotContain(cards, c => Topic(c) == "correction-rate");
        var card = Assert.Single(cards);
        Assert.Contains("127 mmol/L", (string)card!["summary"]!, StringComparison.Ordinal);
        Assert.Contains("superseded by Observation/s25-na-3", (string)card.CardText(), StringComparison.Ordinal);
    }

    // Defect 4. Before: the card printed "Observation/s28-x-na (Sodium 112 mmol/L …)" and "newest result unusable".
    [Fact]
    public async Task ChartReview_AnotherPatientsResult_OnlyCountedNeverShownNeverDrivesSummary()
    {
        var cards = await RunAsync("28");
        var card = Assert.Single(cards);
        var text = Text(cards);
        Assert.DoesNotContain("s28-x-na", text, StringComparison.Ordinal);
        Assert.DoesNotContain("s28-other", text, StringComparison.Ordinal);
        Assert.DoesNotContain("112", text, StringComparison.Ordinal);
        Assert.DoesNotContain("11:00", text, StringComparison.Ordinal);
        Assert.Contains("1 resource about another patient was ignored", text, StringComparison.Ordinal);
        Assert.Equal("info", (string?)card!["indicator"]); // own 131: mild (2014 European guideline)
        Assert.DoesNotContain("unusable", (string)card["summary"]!, StringComparison.Ordinal);
    }

    // Defect 5. Before: "No recent diuretic use: **met**" and "consistent with SIADH".
    [Fact]
    public async Task ChartReview_UnresolvedCombinationTablet_DiureticCriterionCouldNotBeReadNamedByItsText()
    {
        var detail = (string)Assert.Single(await RunAsync("29"))!.CardText();
        Assert.Contains("No recent diuretic use: **unknown (could not be read)**", detail, StringComparison.Ordinal);
        Assert.Contains("Blood-pressure combination tablet (pharmacy record)", detail, StringComparison.Ordinal);
        Assert.DoesNotContain("consistent with SIADH", detail, StringComparison.Ordinal);
    }

    // Defect 17. Before: the stopped statement was not read and "No recent diuretic use" was met.
    [Fact]
    public async Task ChartReview_ThiazideStoppedFourDaysAgo_RecentlyStoppedPossibleNeverLikely()
    {
        var detail = (string)Assert.Single(await RunAsync("30"))!.CardText();
        Assert.Contains("No recent diuretic use: **not met**", detail, StringComparison.Ordinal);
        Assert.Contains("recently stopped", detail, StringComparison.Ordinal);
        Assert.Contains("**possible contributor**", detail, StringComparison.Ordinal);
        Assert.DoesNotContain("likely contributor", detail, StringComparison.Ordinal);
    }

    [Fact]
    public async Task Discovery_MedicationPrefetch_AsksForStoppedAndCompleted()
    {
        var json = await factory.CreateClient().GetStringAsync("/cds-services");
        Assert.Contains("status=active,intended,on-hold,stopped,completed", json, StringComparison.Ordinal);
        Assert.Contains("MedicationRequest?patient={{context.patientId}}\\u0026status=active,on-hold,stopped,completed", json.Replace("&", "\\u0026", StringComparison.Ordinal), StringComparison.Ordinal);
    }

    // Defect 16. Before: 412, although the arrived results hold a sodium.
    [Fact]
    public async Task ResultHook_NoHistoryAvailable_AnswersFromArrivedResultsNamingChecksNotMade()
    {
        var scenario = ScenarioLibrary.Find("11")!;
        var response = await HookCalls.PostAsync(factory.CreateClient(), "natremia-result-review", HookCalls.Request(scenario, includePrefetch: false));
        Assert.Equal(HttpStatusCode.OK, response.StatusCode);
        var cards = await HookCalls.CardsAsync(response);
        var card = Assert.Single(cards, c => Topic(c) == "sodium-assessment");
        var detail = (string)card!.CardText();
        Assert.Contains("124 mmol/L", (string)card["summary"]!, StringComparison.Ordinal);
        Assert.Contains("Sodium history not available", detail, StringComparison.Ordinal);
        Assert.Contains("**onset**", detail, StringComparison.Ordinal);
        Assert.Contains("**correction rate**", detail, StringComparison.Ordinal);
        Assert.Contains("**drug timing**", detail, StringComparison.Ordinal);
    }

    [Fact]
    public async Task ChartReview_NoHistoryAvailable_Still412()
    {
        var response = await HookCalls.PostAsync(factory.CreateClient(), "natremia-chart-review", HookCalls.Request(ScenarioLibrary.Find("01")!, includePrefetch: false));
        Assert.Equal(HttpStatusCode.PreconditionFailed, response.StatusCode);
    }

    // Defect 14. Before: critical (profound 124) although the result is five days old.
    [Fact]
    public async Task ChartReview_StaleProfoundResult_AtMostWarning()
    {
        var scenario = ScenarioLibrary.Find("01")!;
        var request = HookRequestBuilder.Build(scenario, "patient-view", TimeSpan.FromDays(-5), Guid.NewGuid());
        var cards = await HookCalls.CardsAsync(await HookCalls.PostAsync(factory.CreateClient(), "natremia-chart-review", request));
        Assert.All(cards, c => Assert.NotEqual("critical", (string?)c!["indicator"]));
        Assert.Contains("stale", (string)cards[0]!["summary"]!, StringComparison.Ordinal);
    }

    // Defect 18. Before: the critical work-up card came before the critical correction-rate card.
    [Fact]
    public async Task ResultHook_CriticalRateAndCriticalWorkup_RateCardFirst()
    {
        var cards = await RunAsync("11");
        Assert.True(cards.Count >= 2);
        Assert.Equal("correction-rate", Topic(cards[0]));
        var order = cards.Select(c => (string)c!["indicator"]! switch { "critical" => 2, "warning" => 1, _ => 0 }).ToList();
        Assert.Equal(order.OrderByDescending(i => i).ToList(), order);
    }
}
