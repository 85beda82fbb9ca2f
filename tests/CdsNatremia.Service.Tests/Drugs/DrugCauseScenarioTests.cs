using System.Text.Json.Nodes;
using CdsNatremia.Scenarios;
using CdsNatremia.Service.Tests.Support;

namespace CdsNatremia.Service.Tests.Drugs;

/// <summary>The drug-cause reasoning on the assessment card, over HTTP on the invented patients of the scenario library.</summary>
public class DrugCauseScenarioTests(NatremiaFactory factory) : IClassFixture<NatremiaFactory>
{
    private async Task<JsonNode> AssessmentAsync(string id)
    {
        var cards = await HookCalls.RunAsync(factory.CreateClient(), ScenarioLibrary.Find(id)!);
        return cards.Single(c => (string?)c!["source"]!["topic"]!["code"] == "sodium-assessment")!;
    }

    [Fact]
    public async Task Scenario18_ThiazideInAceCombination_CardNamesTheThiazideAndItsTiming()
    {
        var card = await AssessmentAsync("18");
        var detail = (string)card.CardText();
        Assert.Contains("hydrochlorothiazide", (string)card["summary"]!, StringComparison.Ordinal);
        Assert.Contains("**hydrochlorothiazide**", detail, StringComparison.Ordinal);
        Assert.Contains("lisinopril and hydrochlorothiazide tablet", detail, StringComparison.Ordinal);
        Assert.Contains("matched by code RxNorm 5487", detail, StringComparison.Ordinal); // the ingredient's code, not the product's class
        Assert.Contains("thiazide or thiazide-like diuretic; primary tier", detail, StringComparison.Ordinal);
        // Started 2026-02-03 (authoredOn), after 139 mmol/L on 2026-01-08 and before 126 mmol/L on 2026-03-10.
        Assert.Contains("started 2026-02-03 (authoredOn), after 139 mmol/L at 2026-01-08 09:00 UTC", detail, StringComparison.Ordinal);
        Assert.Contains("126 mmol/L at 2026-03-10 08:20 UTC", detail, StringComparison.Ordinal);
        Assert.Contains("**likely contributor**", detail, StringComparison.Ordinal);
        Assert.Contains("clinicians usually consider whether it is still needed", detail, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("01", "hydrochlorothiazide", "started 2026-02-17 (effectivePeriod.start), after 138 mmol/L")]
    [InlineData("02", "sertraline", "started 2026-02-28 (effectivePeriod.start), after 137 mmol/L")]
    [InlineData("03", "carbamazepine", "started 2012-05-01 (effectivePeriod.start), so already taken when sodium was 131 mmol/L")]
    [InlineData("21", "chlortalidone", "started 2025-12-01 (effectivePeriod.start), after 134 mmol/L")]
    [InlineData("22", "eslicarbazepine", "started 2025-11-05 (effectivePeriod.start), after 140 mmol/L")]
    public async Task PatientView_DrugNamedWithTimingAndLikelyVerdict(string id, string drug, string timing)
    {
        var detail = (string)(await AssessmentAsync(id)).CardText();
        Assert.Contains($"**{drug}", detail, StringComparison.Ordinal); // bold in the findings ("eslicarbazepine acetate" names the salt)
        Assert.Contains(timing, detail, StringComparison.Ordinal);
        Assert.Contains("likely contributor", detail, StringComparison.Ordinal);
        Assert.Contains("primary tier", detail, StringComparison.Ordinal);
    }

    [Fact]
    public async Task Scenario21_AtcOnlyCode_MatchedByThatCode()
        => Assert.Contains("matched by code ATC C03BA04", (string)(await AssessmentAsync("21")).CardText(), StringComparison.Ordinal);

    [Fact]
    public async Task Scenario03_AntiEpileptic_CautionAgainstStoppingAbruptly()
        => Assert.Contains("not stopped abruptly", (string)(await AssessmentAsync("03")).CardText(), StringComparison.Ordinal);

    [Fact]
    public async Task Scenario07_LoopAndThiazideLikeDiuretics_CalledOutTogether()
    {
        // Furosemide (loop diuretic, secondary tier, text only) and metolazone (thiazide-like, RxNorm 6916).
        var detail = (string)(await AssessmentAsync("07")).CardText();
        Assert.Contains("Medicines acting together", detail, StringComparison.Ordinal);
        Assert.Contains("furosemide", detail, StringComparison.Ordinal);
        Assert.Contains("metolazone", detail, StringComparison.Ordinal);
        Assert.Contains("secondary tier", detail, StringComparison.Ordinal);
    }

    [Fact]
    public async Task Scenario13_NormalSodium_NoDrugReasoning()
        => Assert.Empty(await HookCalls.RunAsync(factory.CreateClient(), ScenarioLibrary.Find("13")!));
}
