using CdsNatremia.Scenarios;
using CdsNatremia.Service.Tests.Support;

namespace CdsNatremia.Service.Tests.Scenarios;

/// <summary>Foundation behaviour on invented patients, over HTTP through the real service.</summary>
public class FoundationScenarioTests(NatremiaFactory factory) : IClassFixture<NatremiaFactory>
{
    [Fact]
    public async Task ThiazidePatient_ProfoundCriticalCardCitingTheObservation()
    {
        var cards = await HookCalls.RunAsync(factory.CreateClient(), ScenarioLibrary.Find("01")!);
        var card = cards.Single(c => (string?)c!["source"]!["topic"]!["code"] == "sodium-assessment")!;
        Assert.Equal("critical", (string?)card["indicator"]); // 124 < 125: profound (2014 European guideline)
        Assert.Contains("124 mmol/L", (string)card["summary"]!, StringComparison.Ordinal);
        Assert.Contains("Observation/s01-na-2", (string)card.CardText(), StringComparison.Ordinal);
        Assert.True(Guid.TryParse((string?)card["uuid"], out _));
    }

    [Theory]
    [InlineData("13")] // normal sodium
    [InlineData("15")] // latest entered-in-error, valid 136 before it
    [InlineData("23")] // exactly 135: normal (hyponatremia is < 135)
    public async Task NormalSodium_NoCard(string id)
        => Assert.Empty(await HookCalls.RunAsync(factory.CreateClient(), ScenarioLibrary.Find(id)!));

    [Fact]
    public async Task UnusableUnit_CardSaysWhichResultWasSetAsideAndWhy()
    {
        var card = (await HookCalls.RunAsync(factory.CreateClient(), ScenarioLibrary.Find("14")!)).First()!;
        var detail = (string)card.CardText();
        Assert.Contains("mg/dL", detail, StringComparison.Ordinal);
        Assert.Contains("not one the service accepts", detail, StringComparison.Ordinal);
        Assert.Equal("info", (string?)card["indicator"]); // older valid 131: mild → info
    }

    [Fact]
    public async Task PreliminaryResult_LabelledPreliminary()
    {
        var card = (await HookCalls.RunAsync(factory.CreateClient(), ScenarioLibrary.Find("20")!)).First()!;
        Assert.Contains("preliminary", (string)card["summary"]!, StringComparison.Ordinal);
    }

    [Fact]
    public async Task ResultHook_AssessesTheNewResult()
    {
        var cards = await HookCalls.RunAsync(factory.CreateClient(), ScenarioLibrary.Find("11")!);
        Assert.Contains(cards, c => ((string)c!["summary"]!).Contains("124 mmol/L", StringComparison.Ordinal));
    }

    [Fact]
    public async Task EveryScenario_CardsFollowTheStandardAndCarryCautions()
    {
        var client = factory.CreateClient();
        foreach (var scenario in ScenarioLibrary.All)
        {
            foreach (var card in await HookCalls.RunAsync(client, scenario))
            {
                var summary = (string)card!["summary"]!;
                Assert.True(summary.Length < 140, $"{scenario.Id}: {summary}");
                Assert.Contains((string)card["indicator"]!, new[] { "info", "warning", "critical" });
                Assert.False(string.IsNullOrWhiteSpace((string?)card["source"]!["label"]));
                Assert.Contains("Advisory only", (string)card.CardText(), StringComparison.Ordinal);
                Assert.Contains("osmotic demyelination", (string)card.CardText(), StringComparison.Ordinal);
                Assert.Contains("local protocols", (string)card.CardText(), StringComparison.Ordinal);
                if (card["suggestions"] is { } suggestions)
                {
                    Assert.NotEmpty(suggestions.AsArray());
                    Assert.Contains((string)card["selectionBehavior"]!, new[] { "any", "at-most-one" });
                }
            }
        }
    }

    [Fact]
    public async Task EveryScenario_BandAndIndicatorAsTheManifestExpects()
    {
        var client = factory.CreateClient();
        foreach (var scenario in ScenarioLibrary.All.Where(s => s.Hook is "patient-view" or "result"))
        {
            var cards = await HookCalls.RunAsync(client, scenario);
            var assessment = cards.FirstOrDefault(c => (string?)c!["source"]!["topic"]!["code"] == "sodium-assessment");
            if (!scenario.ExpectsCard)
            {
                Assert.True(assessment is null, $"{scenario.Id}: expected no assessment card");
                continue;
            }

            Assert.True(assessment is not null, $"{scenario.Id}: expected an assessment card");
            Assert.Contains($"({scenario.ExpectedBand}", (string)assessment!["summary"]!, StringComparison.Ordinal);
        }
    }
}
