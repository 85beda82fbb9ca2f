using CdsNatremia.Core.Drugs;
using CdsNatremia.Fhir.Knowledge;
using CdsNatremia.Scenarios;
using CdsNatremia.Service.Tests.Support;

namespace CdsNatremia.Service.Tests.Drugs;

/// <summary>Every drug name the scenario manifest expects a clinician to see appears on that scenario's cards.</summary>
public class DrugMentionsTests(NatremiaFactory factory) : IClassFixture<NatremiaFactory>
{
    private static readonly IReadOnlyList<string> DrugNames = LoadNames();

    private static IReadOnlyList<string> LoadNames()
    {
        for (var dir = new DirectoryInfo(AppContext.BaseDirectory); dir is not null; dir = dir.Parent)
        {
            var profiles = Path.Combine(dir.FullName, "profiles");
            if (Directory.Exists(Path.Combine(profiles, "valuesets")))
            {
                return DrugCauseSets.Causes(KnowledgeLoader.Load(profiles).Base).SelectMany(s => s.Names).ToList();
            }
        }

        throw new DirectoryNotFoundException("profiles/ not found above the test binaries.");
    }

    [Fact]
    public async Task EveryScenario_DrugMentionsAppearOnTheCards()
    {
        var client = factory.CreateClient();
        var checkedScenarios = 0;
        foreach (var scenario in ScenarioLibrary.All)
        {
            var drugs = scenario.ExpectedMentions.Where(m => DrugNames.Contains(m.ToLowerInvariant())).ToList();
            if (drugs.Count == 0)
            {
                continue;
            }

            var text = string.Join("\n", (await HookCalls.RunAsync(client, scenario)).Select(c => (string)c!["summary"]! + "\n" + (string)c.CardText()));
            foreach (var drug in drugs)
            {
                Assert.True(text.Contains(drug, StringComparison.OrdinalIgnoreCase), $"{scenario.Id}: '{drug}' not on the cards");
            }

            checkedScenarios++;
        }

        Assert.True(checkedScenarios >= 8, $"only {checkedScenarios} scenarios mention a drug"); // 01, 02, 03, 07, 17, 18, 21, 22
    }
}
