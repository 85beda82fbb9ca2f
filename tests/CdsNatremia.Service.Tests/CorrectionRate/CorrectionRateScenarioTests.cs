using System.Text.Json.Nodes;
using CdsNatremia.Scenarios;
using CdsNatremia.Service.Tests.Support;

namespace CdsNatremia.Service.Tests.CorrectionRate;

/// <summary>Correction-rate cards on invented patients, over HTTP through the real service.</summary>
public class CorrectionRateScenarioTests(NatremiaFactory factory) : IClassFixture<NatremiaFactory>
{
    internal static JsonNode? ByTopic(JsonArray cards, string topic)
        => cards.FirstOrDefault(c => (string?)c!["source"]!["topic"]!["code"] == topic);

    internal static Scenario WithResources(Scenario scenario, Func<List<JsonObject>, List<JsonObject>> change)
    {
        var bundle = JsonNode.Parse(scenario.BundleJson)!.AsObject();
        var resources = bundle["entry"]!.AsArray().Select(e => e!["resource"]!.AsObject().DeepClone().AsObject()).ToList();
        var entries = new JsonArray();
        foreach (var resource in change(resources))
        {
            entries.Add(new JsonObject { ["resource"] = resource });
        }

        bundle["entry"] = entries;
        return scenario with { BundleJson = bundle.ToJsonString() };
    }

    private static JsonObject SodiumObservation(string id, string status, double value, string effective, string patient = "Patient/s11-pt") => new()
    {
        ["resourceType"] = "Observation",
        ["id"] = id,
        ["status"] = status,
        ["code"] = new JsonObject { ["coding"] = new JsonArray(new JsonObject { ["system"] = "http://loinc.org", ["code"] = "2951-2" }) },
        ["subject"] = new JsonObject { ["reference"] = patient },
        ["effectiveDateTime"] = effective,
        ["valueQuantity"] = new JsonObject { ["value"] = value, ["unit"] = "mmol/L", ["system"] = "http://unitsofmeasure.org", ["code"] = "mmol/L" },
    };

    private async Task<JsonNode> RateCardAsync(Scenario scenario)
    {
        var cards = await HookCalls.RunAsync(factory.CreateClient(), scenario);
        return ByTopic(cards, "correction-rate") ?? throw new InvalidOperationException("no correction-rate card");
    }

    [Fact]
    public async Task Scenario11_ResultHook_CriticalWithTheRightNumbers()
    {
        var scenario = ScenarioLibrary.Find("11")!;
        Assert.Equal("result", scenario.Hook); // org.example.lab-result-arrive
        var card = await RateCardAsync(scenario);
        var summary = (string)card["summary"]!;
        var detail = (string)card.CardText();

        // 112 mmol/L at 2026-03-09 15:00 → 124 at 2026-03-10 11:00: 12 mmol/L in 20 h, past the 2014 European
        // guideline's 10 mmol/L in the first 24 h (Spasovski et al. 2014); the window ends 15:00, 3 h after "now" (12:00).
        Assert.Equal("critical", (string?)card["indicator"]);
        Assert.Contains("12 mmol/L in 20 h (112 → 124)", summary, StringComparison.Ordinal);
        Assert.Contains("Sodium 112 mmol/L at 2026-03-09 15:00 UTC (Observation/s11-na-2)", detail, StringComparison.Ordinal);
        Assert.Contains("Sodium 124 mmol/L at 2026-03-10 11:00 UTC (Observation/s11-na-5)", detail, StringComparison.Ordinal);
        Assert.Contains("Limit reached or approached: 10 mmol/L (first 24 h after the nadir", detail, StringComparison.Ordinal);
        Assert.Contains("Hours left in that window: 3 h", detail, StringComparison.Ordinal);
        Assert.Contains("the rise would be 14.4 mmol/L by 2026-03-10 15:00 UTC", detail, StringComparison.Ordinal); // 12 + 12/20 × 4
        Assert.Contains("osmotic demyelination", detail, StringComparison.Ordinal); // manifest mention
        Assert.Contains("senior clinician", detail, StringComparison.Ordinal);
        var rise = scenario.Expect.GetProperty("riseMmolPerL").GetDouble();
        var hours = scenario.Expect.GetProperty("riseHours").GetDouble();
        Assert.Contains(FormattableString.Invariant($"Rise since the nadir: {rise} mmol/L in {hours} h."), detail, StringComparison.Ordinal); // the manifest's numbers
    }

    [Fact]
    public async Task Scenario11_EnteredInErrorValueInTheMiddle_SetAsideAndNotCounted()
    {
        // A 104 mmol/L result at 03-10 00:00, marked entered-in-error: had it counted it would be the nadir (and high risk).
        var scenario = WithResources(ScenarioLibrary.Find("11")!, r => [.. r, SodiumObservation("s11-na-err", "entered-in-error", 104, "2026-03-10T00:00:00Z")]);
        var detail = (string)(await RateCardAsync(scenario)).CardText();
        Assert.Contains("Observation/s11-na-2", detail, StringComparison.Ordinal); // nadir still 112
        Assert.Contains("124 − 112 = 12 mmol/L", detail, StringComparison.Ordinal);
        Assert.Contains("s11-na-err", detail, StringComparison.Ordinal); // listed as set aside
        Assert.DoesNotContain("High risk of osmotic demyelination", detail, StringComparison.Ordinal);
    }

    [Fact]
    public async Task Scenario11_OutOfOrderAndDuplicatedResources_SameNumbers()
    {
        var scenario = WithResources(ScenarioLibrary.Find("11")!, r =>
        {
            var reversed = Enumerable.Reverse(r).ToList();
            reversed.Add(r.First(x => (string?)x["id"] == "s11-na-3").DeepClone().AsObject());
            return reversed;
        });
        var card = await RateCardAsync(scenario);
        Assert.Equal("critical", (string?)card["indicator"]);
        Assert.Contains("124 − 112 = 12 mmol/L over 20 h", (string)card.CardText(), StringComparison.Ordinal);
        Assert.Contains("4 result(s) from then on", (string)card.CardText(), StringComparison.Ordinal); // duplicate counted once
    }

    [Fact]
    public async Task Scenario11_SameMinuteBloodGasHigher_TakenAsLatestAndLabelled()
    {
        var gas = SodiumObservation("s11-na-gas", "final", 125, "2026-03-10T11:00:00Z");
        gas["code"] = new JsonObject { ["coding"] = new JsonArray(new JsonObject { ["system"] = "http://loinc.org", ["code"] = "32717-1" }) }; // arterial blood (LOINC, reference sheet)
        var scenario = WithResources(ScenarioLibrary.Find("11")!, r => [.. r, gas]);
        var detail = (string)(await RateCardAsync(scenario)).CardText();
        Assert.Contains("125 − 112 = 13 mmol/L", detail, StringComparison.Ordinal);
        Assert.Contains("2 results share the latest minute", detail, StringComparison.Ordinal);
        Assert.Contains("different kinds of specimen", detail, StringComparison.Ordinal);
    }

    [Fact]
    public async Task Scenario11_OnPatientView_SameCard()
    {
        var scenario = ScenarioLibrary.Find("11")! with { Hook = "patient-view" };
        Assert.Equal("critical", (string?)(await RateCardAsync(scenario))["indicator"]);
    }
}
