using System.Text.Json.Nodes;
using CdsNatremia.Scenarios;
using CdsNatremia.Service.Tests.Support;

namespace CdsNatremia.Service.Tests.CorrectionRate;

/// <summary>Correction-rate and infusion cards on invented patients, over HTTP through the real service.</summary>
public class CorrectionRateScenarioTests(NatremiaFactory factory) : IClassFixture<NatremiaFactory>
{
    private static JsonNode? ByTopic(JsonArray cards, string topic)
        => cards.FirstOrDefault(c => (string?)c!["source"]!["topic"]!["code"] == topic);

    [Fact]
    public async Task Dump()
    {
        foreach (var id in new[] { "11", "16" })
        {
            var cards = await HookCalls.RunAsync(factory.CreateClient(), ScenarioLibrary.Find(id)!);
            foreach (var c in cards)
            {
                Console.WriteLine("=== " + (string?)c!["indicator"] + " | " + (string?)c["summary"]);
                Console.WriteLine((string?)c["detail"]);
            }
        }
    }
}
