using System.Text.Json.Nodes;
using CdsNatremia.Scenarios;
using CdsNatremia.Service.Tests.Support;

namespace CdsNatremia.Service.Tests.CorrectionRate;

/// <summary>Infusion predictions and rate cautions on the order hooks, over HTTP with draftOrders and selections.</summary>
public class InfusionOrderHookTests(NatremiaFactory factory) : IClassFixture<NatremiaFactory>
{
    private static JsonNode? ByTopic(JsonArray cards, string topic) => CorrectionRateScenarioTests.ByTopic(cards, topic);

    private static Scenario Scenario16(string hook = "order-sign", IReadOnlyList<string>? selections = null)
        => ScenarioLibrary.Find("16")! with { Hook = hook, Selections = selections ?? [] };

    private static string DraftOrders(params JsonObject[] requests)
    {
        var entries = new JsonArray();
        foreach (var request in requests)
        {
            entries.Add(new JsonObject { ["resource"] = request });
        }

        return new JsonObject { ["resourceType"] = "Bundle", ["type"] = "collection", ["entry"] = entries }.ToJsonString();
    }

    private static JsonObject Draft(string id, JsonObject medication, string? route = "intravenous", double? millilitres = null)
    {
        // FHIR JSON allows no nulls: optional elements are left out.
        var dosage = new JsonObject();
        if (route is not null)
        {
            dosage["route"] = new JsonObject { ["text"] = route };
        }

        if (millilitres is not null)
        {
            dosage["doseAndRate"] = new JsonArray(new JsonObject
            {
                ["doseQuantity"] = new JsonObject { ["value"] = millilitres, ["unit"] = "mL", ["system"] = "http://unitsofmeasure.org", ["code"] = "mL" },
            });
        }

        return new JsonObject
        {
            ["resourceType"] = "MedicationRequest",
            ["id"] = id,
            ["status"] = "draft",
            ["intent"] = "proposal",
            ["medicationCodeableConcept"] = medication,
            ["subject"] = new JsonObject { ["reference"] = "Patient/s16-pt" },
            ["dosageInstruction"] = new JsonArray(dosage),
        };
    }

    [Fact]
    public async Task Scenario16_OrderSign_PredictedRiseAndRemainingAllowance()
    {
        var scenario = Scenario16();
        var card = ByTopic(await HookCalls.RunAsync(factory.CreateClient(), scenario), "infusion-prediction")!;
        var detail = (string)card.CardText();

        // Adrogué–Madias (N Engl J Med 2000;342:1581): TBW 0.5 × 60 = 30 L (woman under 70, reference sheet);
        // (513 − 118) / (30 + 1) = 12.7 mmol/L per litre; 150 mL → 1.9 mmol/L; first-24-h limit 10 (European 2014).
        var water = scenario.Expect.GetProperty("totalBodyWaterL").GetDouble();
        var perLitre = scenario.Expect.GetProperty("predictedRisePerLitreMmolPerL").GetDouble();
        var forOrder = scenario.Expect.GetProperty("predictedRiseForOrderMmolPerL").GetDouble();
        Assert.Contains(FormattableString.Invariant($"= **{water} L**"), detail, StringComparison.Ordinal); // the manifest's numbers
        Assert.Contains(FormattableString.Invariant($"= **+{perLitre} mmol/L**"), detail, StringComparison.Ordinal);
        Assert.Contains(FormattableString.Invariant($"= **+{forOrder} mmol/L**"), detail, StringComparison.Ordinal);
        Assert.Contains("60 kg (Observation/s16-wt-1", detail, StringComparison.Ordinal);
        Assert.Contains("× 0.5 (woman, age 55 years) = **30 L**", detail, StringComparison.Ordinal);
        Assert.Contains("(513 + 0 − 118) / (30 + 1) = **+12.7 mmol/L**", detail, StringComparison.Ordinal);
        Assert.Contains("**for 150 mL** = +12.7 × 150 / 1000 = **+1.9 mmol/L**", detail, StringComparison.Ordinal);
        Assert.Contains("allowance left now: **10 mmol/L**", detail, StringComparison.Ordinal);
        Assert.Contains("+1.9 mmol/L; within the 10 mmol/L left", (string)card["summary"]!, StringComparison.Ordinal);
        Assert.Contains("3%", (string)card["summary"]!, StringComparison.Ordinal); // manifest mention
        Assert.Equal("warning", (string?)card["indicator"]);
    }

    [Fact]
    public async Task Scenario16_OrderSelect_SelectedDraftPredicted()
    {
        var cards = await HookCalls.RunAsync(factory.CreateClient(), Scenario16("order-select", ["MedicationRequest/draft-nacl3"]));
        Assert.NotNull(ByTopic(cards, "infusion-prediction"));
    }

    [Fact]
    public async Task Scenario16_OrderSelect_SomethingElseSelected_NoPrediction()
    {
        var cards = await HookCalls.RunAsync(factory.CreateClient(), Scenario16("order-select", ["MedicationRequest/other"]));
        Assert.Null(ByTopic(cards, "infusion-prediction"));
    }

    [Fact]
    public async Task Scenario16_NoWeight_SaysSoAndNeverInventsOne()
    {
        var scenario = CorrectionRateScenarioTests.WithResources(Scenario16(), r => r.Where(x => (string?)x["id"] != "s16-wt-1").ToList());
        var card = ByTopic(await HookCalls.RunAsync(factory.CreateClient(), scenario), "infusion-prediction")!;
        var detail = (string)card.CardText();
        Assert.Contains("No usable body weight", detail, StringComparison.Ordinal);
        Assert.Contains("Example only, not this patient's weight", detail, StringComparison.Ordinal);
        Assert.DoesNotContain("for 150 mL", detail, StringComparison.Ordinal);
    }

    [Fact]
    public async Task LitreOfThreePercentByStrength_WouldExceed_Critical()
    {
        // Recognised by ATC B05XA03 (fluid-sodium-chloride ValueSet) and the ingredient strength 30 mg/mL (3%).
        var medication = new JsonObject
        {
            ["coding"] = new JsonArray(new JsonObject { ["system"] = "http://www.whocc.no/atc", ["code"] = "B05XA03" }),
            ["text"] = "sodium chloride 30 mg/mL infusion",
        };
        var scenario = Scenario16() with { DraftOrdersJson = DraftOrders(Draft("draft-litre", medication, millilitres: 1000)) };
        var card = ByTopic(await HookCalls.RunAsync(factory.CreateClient(), scenario), "infusion-prediction")!;
        Assert.Equal("critical", (string?)card["indicator"]); // +12.7 > 10 left
        Assert.Contains("would exceed the 10 mmol/L left", (string)card["summary"]!, StringComparison.Ordinal);
    }

    [Fact]
    public async Task VaptanDraft_RateCautionCard()
    {
        // ATC C03XA01 tolvaptan, in the drug-vaptan ValueSet.
        var medication = new JsonObject
        {
            ["coding"] = new JsonArray(new JsonObject { ["system"] = "http://www.whocc.no/atc", ["code"] = "C03XA01" }),
            ["text"] = "tolvaptan 15 mg tablet",
        };
        var scenario = Scenario16() with { DraftOrdersJson = DraftOrders(Draft("draft-vaptan", medication, route: "oral")) };
        var cards = await HookCalls.RunAsync(factory.CreateClient(), scenario);
        var card = ByTopic(cards, "rate-caution-order")!;
        Assert.Equal("warning", (string?)card["indicator"]);
        Assert.Contains("MedicationRequest/draft-vaptan", (string)card.CardText(), StringComparison.Ordinal);
        Assert.Null(ByTopic(cards, "infusion-prediction"));
    }
}
