using System.Text.Json.Nodes;
using CdsNatremia.Scenarios;
using CdsNatremia.Service.Tests.Support;

namespace CdsNatremia.Service.Tests.Clinical;

/// <summary>
/// Issue 13's clinical rules over HTTP through the real service, on the invented scenarios 35–42 (scenarios.json).
/// </summary>
public class ClinicalSafetyHookTests(NatremiaFactory factory) : IClassFixture<NatremiaFactory>
{
    private async Task<JsonArray> RunAsync(string id) => await HookCalls.RunAsync(factory.CreateClient(), ScenarioLibrary.Find(id)!);

    private static JsonNode ByTopic(JsonArray cards, string topic)
        => Assert.Single(cards, c => (string?)c!["source"]!["topic"]!["code"] == topic)!;

    [Theory]
    [InlineData("35")]
    [InlineData("36")]
    [InlineData("37")]
    [InlineData("38")]
    [InlineData("39")]
    [InlineData("40")]
    [InlineData("41")]
    [InlineData("42")]
    public async Task Scenario_ManifestMentionsAndIndicatorOnTheCards(string id)
    {
        var scenario = ScenarioLibrary.Find(id)!;
        var cards = await HookCalls.RunAsync(factory.CreateClient(), scenario);
        var text = string.Join("\n", cards.Select(c => (string)c!["summary"]! + "\n" + (string)c.CardText()));
        foreach (var mention in scenario.ExpectedMentions)
        {
            Assert.True(text.Contains(mention, StringComparison.OrdinalIgnoreCase), $"{id}: '{mention}' not on the cards");
        }

        Assert.Contains(cards, c => (string?)c!["indicator"] == scenario.ExpectedIndicator);
    }

    [Fact]
    public async Task OrderSign_Scenario35SalineIntoConcentratedUrine_WarnsSodiumMayFall()
    {
        // Urine 640 mOsm/kg above 0.9% saline's 308: desalination (Steele et al., Ann Intern Med 1997;126:20).
        var card = ByTopic(await RunAsync("35"), "infusion-prediction");
        Assert.Equal("warning", (string?)card["indicator"]);
        var summary = (string)card["summary"]!;
        Assert.Contains("sodium may fall", summary, StringComparison.Ordinal);
        Assert.DoesNotContain("within the", summary, StringComparison.Ordinal);
        var detail = (string)card.CardText();
        Assert.Contains("urine osmolality 640 mOsm/kg", detail, StringComparison.Ordinal);
        // Total body water fraction 0.45 for a woman of 75 (reference sheet), printed as used: 60 × 0.45 = 27 L.
        Assert.Contains("× 0.45 (woman, age 75 years) = **27 L**", detail, StringComparison.Ordinal);
    }

    [Fact]
    public async Task OrderSign_Scenario35WithoutUrineStudies_SaysThePredictionAssumesNoUrineLosses()
    {
        var scenario = ScenarioLibrary.Find("35")!;
        var bundle = JsonNode.Parse(scenario.BundleJson)!.AsObject();
        var entries = bundle["entry"]!.AsArray();
        foreach (var entry in entries.Where(e => ((string?)e!["resource"]!["id"])!.StartsWith("s35-u", StringComparison.Ordinal)).ToList())
        {
            entries.Remove(entry);
        }

        var cards = await HookCalls.RunAsync(factory.CreateClient(), scenario with { BundleJson = bundle.ToJsonString() });
        var card = ByTopic(cards, "infusion-prediction");
        Assert.Contains("The prediction assumes no urine losses.", (string)card.CardText(), StringComparison.Ordinal);
    }

    [Fact]
    public async Task OrderSelect_Scenario36VaptanAtModerateSodiumWithCirrhosis_GuidelineAndLiverCaution()
    {
        // 2014 European guideline: against vaptans in moderate or profound hyponatraemia; tolvaptan label (from memory): avoid in liver disease.
        var card = ByTopic(await RunAsync("36"), "rate-caution-order");
        Assert.Equal("warning", (string?)card["indicator"]);
        Assert.Contains("advises against vaptans here", (string)card["summary"]!, StringComparison.Ordinal);
        var detail = (string)card.CardText();
        Assert.Contains("latest sodium is moderate", detail, StringComparison.Ordinal);
        Assert.Contains("**The record shows liver disease** (Condition/s36-liver", detail, StringComparison.Ordinal);
        Assert.Contains("limiting the duration of treatment", detail, StringComparison.Ordinal);
    }

    [Fact]
    public async Task OrderSign_Scenario37DesmopressinAfterOvercorrection_OneCardThatLowersSodiumAndNamesTheStrategy()
    {
        var cards = await RunAsync("37");
        var desmopressin = cards.Where(c => ((string)c!["summary"]!).Contains("desmopressin", StringComparison.OrdinalIgnoreCase)).ToList();
        var card = Assert.Single(desmopressin)!;
        Assert.Contains("lower sodium", (string)card["summary"]!, StringComparison.Ordinal);
        Assert.DoesNotContain("raise", (string)card["summary"]!, StringComparison.OrdinalIgnoreCase);
        Assert.Contains("**recognised strategy under senior care**", (string)card.CardText(), StringComparison.Ordinal);
        Assert.Equal("warning", (string?)card["indicator"]);
    }

    [Fact]
    public async Task PatientView_Scenario38Child_AdultLimitsMayNotApply()
    {
        var card = ByTopic(await RunAsync("38"), "sodium-assessment");
        Assert.Contains("adult limits may not apply", (string)card["summary"]!, StringComparison.Ordinal);
        Assert.Contains("**This patient is a child (9 years old, under 18)**", (string)card.CardText(), StringComparison.Ordinal);
    }

    [Fact]
    public async Task ResultHook_Scenario39LowPotassiumAndMalnutrition_HighRiskStatedWithFactorsAndLimit()
    {
        // US expert panel (Verbalis et al. 2013): hypokalaemia and malnutrition are high-risk factors; limit 8 mmol/L in any 24 h.
        var card = ByTopic(await RunAsync("39"), "sodium-assessment");
        var detail = (string)card.CardText();
        Assert.Contains("**This patient is at high risk of osmotic demyelination**", detail, StringComparison.Ordinal);
        Assert.Contains("low potassium: 3.1 mmol/L", detail, StringComparison.Ordinal);
        Assert.Contains("malnutrition", detail, StringComparison.Ordinal);
        Assert.Contains("no more than 8 mmol/L in any 24 h", detail, StringComparison.Ordinal);
    }

    [Fact]
    public async Task PatientView_Scenario40Mannitol_NotHypotonicFirstAndNotCritical()
    {
        var card = ByTopic(await RunAsync("40"), "sodium-assessment");
        Assert.Equal("warning", (string?)card["indicator"]); // profound band, but hypertonic: not an emergency low-sodium card
        Assert.StartsWith("Not hypotonic:", (string)card["summary"]!, StringComparison.Ordinal);
        Assert.Contains("likely mannitol", (string)card["summary"]!, StringComparison.Ordinal);
    }

    [Fact]
    public async Task PatientView_Scenario41LowCortisol_AdrenalInsufficiencyUrgently()
    {
        var card = ByTopic(await RunAsync("41"), "sodium-assessment");
        Assert.Contains("consider adrenal insufficiency urgently", (string)card["summary"]!, StringComparison.Ordinal);
        Assert.Contains("**can raise sodium quickly**", (string)card.CardText(), StringComparison.Ordinal);
    }

    [Fact]
    public async Task PatientView_Scenario42FurstRatioAboveOne_RestrictionUnlikelyToWork()
    {
        // (112 + 46) / 126 = 1.25 > 1 (Furst et al., Am J Med Sci 2000;319:240).
        var detail = (string)ByTopic(await RunAsync("42"), "sodium-assessment").CardText();
        Assert.Contains("(urine sodium 112 + urine potassium 46) / serum sodium 126 = **1.25**", detail, StringComparison.Ordinal);
        Assert.Contains("**fluid restriction is unlikely to work**", detail, StringComparison.Ordinal);
        Assert.DoesNotContain("fluid restriction is the usual first step", detail, StringComparison.Ordinal);
    }
}
