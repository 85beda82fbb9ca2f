using System.Text.Json.Nodes;
using CdsNatremia.Scenarios;
using CdsNatremia.Service.Tests.Support;

namespace CdsNatremia.Service.Tests.Course;

/// <summary>Cards about the assessment, the correction rate and drugs carry the CDS Hooks "smart" link to the sodium course (CDS Hooks 2.0, Link).</summary>
public sealed class CourseLinkTests
{
    private const string LaunchUrl = "https://cds.example.org/natremia/course/launch";

    [Theory]
    [InlineData("01")] // assessment and drug cause
    [InlineData("17")] // a drug order warning
    public async Task Cards_LaunchUrlConfigured_TopicCardsCarryASmartLinkNamingTheCardOnly(string id)
    {
        using var factory = NatremiaFactory.With(new Dictionary<string, string?> { ["Natremia:Course:LaunchUrl"] = LaunchUrl });
        using var client = factory.CreateClient();
        var scenario = ScenarioLibrary.Find(id)!;
        var cards = await HookCalls.RunAsync(client, scenario);
        var linked = cards.Where(c => SmartLinks(c!).Count > 0).ToList();
        Assert.NotEmpty(linked);
        foreach (var card in cards)
        {
            var topic = (string)card!["source"]!["topic"]!["code"]!;
            var expected = topic is "sodium-assessment" or "correction-rate" or "drug-cause" or "drug-order-warning";
            Assert.Equal(expected, SmartLinks(card).Count > 0);
            if (!expected)
            {
                continue;
            }

            var link = Assert.Single(SmartLinks(card));
            Assert.Equal("smart", (string?)link["type"]);
            Assert.Equal("Open the sodium course", (string?)link["label"]);
            Assert.Equal(LaunchUrl, (string?)link["url"]);
            var context = JsonNode.Parse((string)link["appContext"]!)!;
            Assert.Equal((string?)card["uuid"], (string?)context["card"]);
            Assert.Equal(topic, (string?)context["topic"]);
            Assert.DoesNotContain(scenario.PatientId, (string)link["appContext"]!, StringComparison.Ordinal);
        }
    }

    [Fact]
    public async Task Cards_NoLaunchUrl_NoSmartLinkOnlyTheReport()
    {
        using var factory = new NatremiaFactory();
        using var client = factory.CreateClient();
        var cards = await HookCalls.RunAsync(client, ScenarioLibrary.Find("01")!);
        Assert.NotEmpty(cards);
        Assert.All(cards, c => Assert.Empty(SmartLinks(c!)));
        Assert.All(cards, c => Assert.Equal("absolute", (string?)Assert.Single(c!["links"]!.AsArray())!["type"]));
    }

    /// <summary>The card's links of type smart (a card also links to its full report, type absolute).</summary>
    private static List<JsonNode> SmartLinks(JsonNode card)
        => (card["links"] as JsonArray ?? []).OfType<JsonNode>().Where(l => (string?)l["type"] == "smart").ToList();
}
