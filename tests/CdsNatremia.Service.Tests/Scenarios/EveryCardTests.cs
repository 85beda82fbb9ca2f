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
}
