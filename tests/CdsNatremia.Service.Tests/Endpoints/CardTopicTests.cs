using System.Text.Json;
using System.Text.Json.Nodes;
using CdsNatremia.Fhir.Knowledge;
using CdsNatremia.Scenarios;
using CdsNatremia.Service.Tests.Support;
using Microsoft.Extensions.DependencyInjection;

namespace CdsNatremia.Service.Tests.Endpoints;

/// <summary>
/// Card topics are data: every card of every scenario carries a source.topic Coding whose system, code and display are
/// those of the card-topic CodeSystem the service loaded (profiles/codesystems/card-topic.json; CDS Hooks 2.0 card
/// source.topic is a Coding), so a display is changed in that file alone.
/// </summary>
public sealed class CardTopicTests(NatremiaFactory factory) : IClassFixture<NatremiaFactory>
{
    [Fact]
    public async Task EveryScenario_EveryCardTopic_IsTheLoadedCodeSystemsCodingWithItsDisplay()
    {
        var (url, displays) = CardTopicCodeSystem(factory.Services.GetRequiredService<LoadedKnowledge>().Directory);
        var client = factory.CreateClient();
        var seen = new HashSet<string>(StringComparer.Ordinal);
        foreach (var scenario in ScenarioLibrary.All.Where(s => s.ExpectsCard))
        {
            foreach (var card in (await HookCalls.RunAsync(client, scenario)).Select(c => c!.AsObject()))
            {
                var topic = card["source"]!["topic"]!.AsObject();
                var code = (string)topic["code"]!;
                var where = $"scenario {scenario.Id}, topic '{code}'";
                Assert.True(displays.ContainsKey(code), where + ": not in card-topic.json");
                Assert.Equal(url, (string?)topic["system"]);
                Assert.Equal(displays[code], (string?)topic["display"]);
                seen.Add(code);
            }
        }

        // The library covers the assessment, correction-rate and order cards, so this is not vacuous.
        Assert.True(seen.Count >= 3, "topics seen: " + string.Join(", ", seen));
    }

    private static (string Url, Dictionary<string, string> Displays) CardTopicCodeSystem(string directory)
    {
        using var json = JsonDocument.Parse(File.ReadAllText(Path.Combine(directory, "codesystems", "card-topic.json")));
        var root = json.RootElement;
        return (root.GetProperty("url").GetString()!, root.GetProperty("concept").EnumerateArray()
            .ToDictionary(c => c.GetProperty("code").GetString()!, c => c.GetProperty("display").GetString()!, StringComparer.Ordinal));
    }
}
