using System.Text.Json;
using System.Text.Json.Nodes;
using CdsNatremia.Scenarios;
using CdsNatremia.Service.Tests.Support;

namespace CdsNatremia.Service.Tests.Scenarios;

/// <summary>Over HTTP on every scenario of the library: override reasons on every card, suggestions that mean something.</summary>
public class EveryCardTests(NatremiaFactory factory) : IClassFixture<NatremiaFactory>
{
    private static (string Url, Dictionary<string, string> Displays) OverrideReasonCodeSystem()
    {
        for (var dir = new DirectoryInfo(AppContext.BaseDirectory); dir is not null; dir = dir.Parent)
        {
            var file = Path.Combine(dir.FullName, "profiles", "codesystems", "override-reason.json");
            if (File.Exists(file))
            {
                using var json = JsonDocument.Parse(File.ReadAllText(file));
                var root = json.RootElement;
                return (root.GetProperty("url").GetString()!, root.GetProperty("concept").EnumerateArray()
                    .ToDictionary(c => c.GetProperty("code").GetString()!, c => c.GetProperty("display").GetString()!, StringComparer.Ordinal));
            }
        }

        throw new InvalidOperationException("profiles/codesystems/override-reason.json not found above the test binaries.");
    }

    [Fact]
    public async Task EveryScenario_EveryCard_OverrideReasonsFromTheCodeSystemAndAtMostTwoRecommended()
    {
        var (url, displays) = OverrideReasonCodeSystem();
        var client = factory.CreateClient();
        var cardsSeen = 0;
        var topics = new HashSet<string>(StringComparer.Ordinal);
        foreach (var scenario in ScenarioLibrary.All.Where(s => s.ExpectsCard))
        {
            foreach (var card in (await HookCalls.RunAsync(client, scenario)).Select(c => c!.AsObject()))
            {
                cardsSeen++;
                var where = $"scenario {scenario.Id}, card '{(string?)card["summary"]}'";
                topics.Add((string)card["source"]!["topic"]!["code"]!);
                var reasons = card["overrideReasons"] as JsonArray;
                Assert.True(reasons is { Count: > 0 }, where + ": no overrideReasons");
                foreach (var reason in reasons!)
                {
                    Assert.Equal(url, (string?)reason!["system"]);
                    var code = (string)reason["code"]!;
                    Assert.True(displays.ContainsKey(code), $"{where}: {code} is not in the CodeSystem");
                    Assert.Equal(displays[code], (string?)reason["display"]);
                }

                var suggestions = card["suggestions"] as JsonArray ?? [];
                Assert.True(suggestions.Count(s => (bool?)s!["isRecommended"] == true) <= 2, where + ": more than two recommended");
                if (scenario.Hook == "patient-view")
                {
                    Assert.True(suggestions.Count <= 3, where + ": more than three suggestions on a chart opening");
                }
            }
        }

        Assert.True(cardsSeen > 0);
        Assert.True(topics.Count >= 3, "only these card kinds were seen: " + string.Join(", ", topics)); // the check spans card kinds
    }

    /// <summary>
    /// A card is read in seconds at the bedside: on every scenario each card's summary is under 140 characters (CDS Hooks
    /// 2.0, card attributes), its detail at most 700 characters (our budget, issue 14), and it still carries the
    /// patient's own facts: the assessment card names the latest usable sodium the scenario expects, and every drug the
    /// scenario expects to be named appears in the card or its report. The card's link opens its full report.
    /// </summary>
    [Fact]
    public async Task EveryScenario_EveryCard_ShortDetailWithinBudgetWithPatientFactsAndLinkedReport()
    {
        var client = factory.CreateClient();
        var longest = 0;
        foreach (var scenario in ScenarioLibrary.All.Where(s => s.ExpectsCard))
        {
            var cards = (await HookCalls.RunAsync(client, scenario)).Select(c => c!.AsObject()).ToList();
            foreach (var card in cards)
            {
                var summary = (string)card["summary"]!;
                var detail = (string)card["detail"]!;
                var where = $"scenario {scenario.Id}, card '{summary}'";
                longest = Math.Max(longest, detail.Length);
                Assert.True(summary.Length < 140, $"{where}: summary has {summary.Length} characters");
                Assert.True(detail.Length <= 700, $"{where}: detail has {detail.Length} characters:\n{detail}");
                Assert.Contains("Advisory only", detail, StringComparison.Ordinal);

                var link = Assert.Single((card["links"] as JsonArray)!, l => ((string?)l!["url"])?.Contains("/reports/", StringComparison.Ordinal) == true);
                Assert.Equal("absolute", (string?)link!["type"]);
                var url = new Uri((string)link["url"]!);
                using var page = await client.GetAsync(url.PathAndQuery);
                Assert.Equal(System.Net.HttpStatusCode.OK, page.StatusCode);
                var html = await page.Content.ReadAsStringAsync();
                Assert.Contains("Sources", html, StringComparison.Ordinal);
                Assert.Contains("no-store", page.Headers.CacheControl?.ToString() ?? string.Empty, StringComparison.Ordinal);
            }

            if (scenario.Expect.TryGetProperty("latestValidSodium", out var sodium) && sodium.ValueKind == JsonValueKind.Number
                && cards.FirstOrDefault(c => (string?)c["source"]!["topic"]!["code"] == "sodium-assessment") is { } assessment)
            {
                var value = sodium.GetDouble().ToString(System.Globalization.CultureInfo.InvariantCulture);
                Assert.True(
                    ((string)assessment["summary"]! + (string)assessment["detail"]!).Contains(value + " mmol/L", StringComparison.Ordinal),
                    $"scenario {scenario.Id}: the assessment card does not name the latest sodium {value} mmol/L");
            }
        }

        Assert.True(longest > 200, "no card detail says anything"); // the budget check must see real cards
    }

    /// <summary>An unknown or malformed report id answers 404 with a page, never 500, and never reflects the id.</summary>
    [Theory]
    [InlineData("AAAAAAAAAAAAAAAAAAAAAA")]
    [InlineData("not-a-report")]
    [InlineData("%3Cscript%3E")]
    public async Task ReportLink_UnknownOrMalformedId_NotFoundPage(string id)
    {
        using var page = await factory.CreateClient().GetAsync("/reports/" + id);
        Assert.Equal(System.Net.HttpStatusCode.NotFound, page.StatusCode);
        var html = await page.Content.ReadAsStringAsync();
        Assert.Contains("not available", html, StringComparison.Ordinal);
        Assert.DoesNotContain("<script>", html, StringComparison.Ordinal);
    }
}
