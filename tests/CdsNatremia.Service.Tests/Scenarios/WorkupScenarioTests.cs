using System.Globalization;
using System.Text.Json;
using System.Text.Json.Nodes;
using System.Text.RegularExpressions;
using CdsNatremia.Scenarios;
using CdsNatremia.Service.Tests.Support;

namespace CdsNatremia.Service.Tests.Scenarios;

/// <summary>The work-up branches on invented patients (FHIR bundles), over HTTP through the real service.</summary>
public partial class WorkupScenarioTests(NatremiaFactory factory) : IClassFixture<NatremiaFactory>
{
    [Theory]
    // Each branch of the work-up, driven by a scenario bundle; the words are what the card must state.
    [InlineData("01", new[] { "by calculation only", "US units as reported", "cannot exclude a falsely low sodium", "diuretic in use: hydrochlorothiazide" })]
    [InlineData("04", new[] { "**consistent with SIADH**", "pneumonia or chest infection", "(5) Normal thyroid function: **met**", "(6) Normal adrenal function: **met**" })]
    [InlineData("05", new[] { "**hypertonic**", "not hypotonic hyponatremia", "Katz", "Hillier" })]
    [InlineData("06", new[] { "**isotonic**", "**pseudohyponatremia** with very high triglycerides", "no sodium treatment is indicated", "reported as 3500 mg/dL" })]
    [InlineData("07", new[] { "**hypotonic**", "279 − urea 17.134 = 261.9 mOsm/kg" /* urea nitrogen 48 mg/dL ÷ 2.8014, printed as used (issue 13, point 15) */, "**taken while a diuretic was in use**", "heart failure (Condition/s07-hf", "**low effective arterial blood volume**" })]
    [InlineData("08", new[] { "cirrhosis", "**low effective arterial blood volume**", "If **high volume**" })]
    [InlineData("09", new[] { "vomiting or nausea (Condition/s09-vom", "**low effective arterial blood volume**" })]
    [InlineData("10", new[] { "**relative excess water intake**", "does not steer the reasoning" })]
    [InlineData("12", new[] { "alcohol use disorder", "malnutrition", "**hypotonic**" })]
    [InlineData("19", new[] { "**acute**", "30 h before the low value" })]
    [InlineData("21", new[] { "**cannot be read**", "(7) No recent diuretic use: **not met**: chlortalidone" })]
    [InlineData("24", new[] { "Urine osmolality 150 mOsm/kg", "**low effective arterial blood volume**" })]
    public async Task Branch_CardStatesTheBranchAndItsData(string id, string[] expected)
    {
        var detail = (string)(await AssessmentAsync(ScenarioLibrary.Find(id)!)).CardText();
        foreach (var text in expected)
        {
            Assert.True(detail.Contains(text, StringComparison.Ordinal), $"{id}: missing \"{text}\" in\n{detail}");
        }

        Assert.Contains("Advisory only", detail, StringComparison.Ordinal); // the standing caution line (CardRenderer)
    }

    [Fact]
    public async Task Manifest_TonicityGapCorrectionAndOnsetAsExpected()
    {
        var checkedCount = 0;
        foreach (var scenario in ScenarioLibrary.All.Where(s => s.Hook == "patient-view" && s.ExpectsCard))
        {
            var expect = scenario.Expect;
            var detail = (string)(await AssessmentAsync(scenario)).CardText();
            if (expect.TryGetProperty("tonicity", out var tonicity))
            {
                Assert.True(detail.Contains($"→ **{tonicity.GetString()}**", StringComparison.Ordinal), $"{scenario.Id}: tonicity {tonicity}");
                checkedCount++;
            }

            if (expect.TryGetProperty("glucoseCorrectedSodium", out var corrected))
            {
                // Katz 1973 (1.6 per 100 mg/dL) and Hillier 1999 (2.4 per 100 mg/dL), as the manifest states them.
                Assert.Contains($"**{Number(corrected.GetProperty("katz"))} mmol/L**", detail, StringComparison.Ordinal);
                Assert.Contains($"**{Number(corrected.GetProperty("hillier"))} mmol/L**", detail, StringComparison.Ordinal);
                checkedCount++;
            }

            if (expect.TryGetProperty("osmolalGap", out var gap))
            {
                var match = GapPattern().Match(detail);
                Assert.True(match.Success, $"{scenario.Id}: no osmolal gap");
                Assert.InRange(double.Parse(match.Groups[1].Value, CultureInfo.InvariantCulture), gap.GetDouble() - 0.5, gap.GetDouble() + 0.5);
                checkedCount++;
            }

            var acute = expect.TryGetProperty("acute", out var a) && a.ValueKind == JsonValueKind.True;
            Assert.Equal(acute, detail.Contains("so **acute** hyponatremia", StringComparison.Ordinal));
        }

        Assert.True(checkedCount >= 5, "the manifest's work-up expectations were not found");
    }

    [Fact]
    public async Task MissingTests_DraftLoincServiceRequestsWithAnySelection()
    {
        var card = await AssessmentAsync(ScenarioLibrary.Find("01")!);
        Assert.Equal("any", (string?)card["selectionBehavior"]);
        var byCode = card["suggestions"]!.AsArray().ToDictionary(
            s => (string)s!["actions"]![0]!["resource"]!["code"]!["coding"]![0]!["code"]!, s => s!.AsObject());
        foreach (var code in new[] { "2692-2", "2695-5", "2955-3" }) // serum osmolality, urine osmolality, urine sodium (LOINC, reference sheet)
        {
            Assert.True(byCode.ContainsKey(code), code);
            var resource = byCode[code]["actions"]![0]!["resource"]!;
            Assert.Equal("ServiceRequest", (string?)resource["resourceType"]);
            Assert.Equal("draft", (string?)resource["status"]);
            Assert.Equal("http://loinc.org", (string?)resource["code"]!["coding"]![0]!["system"]);
            // The two most useful recommended, the third offered (SuggestionPolicy: at most two recommended, three on a chart opening).
            Assert.Equal(code != "2955-3", (bool?)byCode[code]["isRecommended"]);
        }

        Assert.Equal(3, byCode.Count);

        Assert.False(byCode.ContainsKey("2345-7")); // glucose was sent with the sodium: not missing
    }

    [Fact]
    public async Task SiAndUsUnits_HyperglycaemiaPatient_SameAssessment()
    {
        // Scenario 05 as sent (glucose 650 mg/dL, urea nitrogen 28 mg/dL) and the same patient in SI units
        // (glucose 36.1 mmol/L, LOINC 14749-6; urea 10.0 mmol/L, LOINC 22664-7; factors 18.016 and 2.8014, reference sheet).
        var us = ScenarioLibrary.Find("05")!;
        var si = us with
        {
            BundleJson = Rewrite(us.BundleJson, ("s05-glu-2", "14749-6", 36.1), ("s05-bun-2", "22664-7", 10.0)),
        };

        var usCard = await AssessmentAsync(us);
        var siCard = await AssessmentAsync(si);

        Assert.Equal((string?)usCard["summary"], (string?)siCard["summary"]);
        Assert.Equal((string?)usCard["indicator"], (string?)siCard["indicator"]);
        foreach (var text in new[] { "→ **hypertonic**", "**136.8 mmol/L**", "**141.2 mmol/L**", "**Osmolal gap** 2.9 mOsm/kg", "= 295 mOsm/kg" })
        {
            Assert.Contains(text, (string)usCard.CardText(), StringComparison.Ordinal);
            Assert.Contains(text, (string)siCard.CardText(), StringComparison.Ordinal);
        }

        // Each input printed as used (issue 13, point 15): 28 mg/dL ÷ 2.8014 = 9.995 mmol/L urea; SI urea 10.
        Assert.Contains("305 − urea 9.995 = 295 mOsm/kg", (string)usCard.CardText(), StringComparison.Ordinal);
        Assert.Contains("305 − urea 10 = 295 mOsm/kg", (string)siCard.CardText(), StringComparison.Ordinal);
    }

    [Fact]
    public async Task SiAndUsUnits_CalculatedOsmolality_SameNumbers()
    {
        // Scenario 01: glucose 104 mg/dL = 5.8 mmol/L, urea nitrogen 16 mg/dL = 5.7 mmol/L urea → 259.5 mOsm/kg either way.
        var us = ScenarioLibrary.Find("01")!;
        var si = us with { BundleJson = Rewrite(us.BundleJson, ("s01-glu-2", "14749-6", 5.8), ("s01-bun-2", "22664-7", 5.7)) };

        var usCard = await AssessmentAsync(us);
        var siCard = await AssessmentAsync(si);

        Assert.Equal((string?)usCard["summary"], (string?)siCard["summary"]);
        Assert.Contains("259.5 mOsm/kg (US units as reported", (string)usCard.CardText(), StringComparison.Ordinal);
        Assert.Contains("259.5 mOsm/kg (SI units", (string)siCard.CardText(), StringComparison.Ordinal);
        Assert.Equal(SuggestionCodes(usCard), SuggestionCodes(siCard));
    }

    private async Task<JsonObject> AssessmentAsync(Scenario scenario)
    {
        var cards = await HookCalls.RunAsync(factory.CreateClient(), scenario);
        return cards.Single(c => (string?)c!["source"]!["topic"]!["code"] == "sodium-assessment")!.AsObject();
    }

    private static IEnumerable<string> SuggestionCodes(JsonObject card)
        => card["suggestions"]!.AsArray().Select(s => (string)s!["actions"]![0]!["resource"]!["code"]!["coding"]![0]!["code"]!).Order(StringComparer.Ordinal);

    private static string Number(JsonElement value) => value.GetDouble().ToString("0.#", CultureInfo.InvariantCulture);

    /// <summary>Re-codes Observations into SI units: new LOINC code, value in mmol/L, reference range dropped.</summary>
    private static string Rewrite(string bundleJson, params (string Id, string Loinc, double Value)[] changes)
    {
        var bundle = JsonNode.Parse(bundleJson)!;
        foreach (var entry in bundle["entry"]!.AsArray())
        {
            var resource = entry!["resource"]!.AsObject();
            foreach (var (id, loinc, value) in changes.Where(c => c.Id == (string?)resource["id"]))
            {
                resource["code"] = new JsonObject { ["coding"] = new JsonArray(new JsonObject { ["system"] = "http://loinc.org", ["code"] = loinc }) };
                resource["valueQuantity"] = new JsonObject { ["value"] = value, ["unit"] = "mmol/L", ["system"] = "http://unitsofmeasure.org", ["code"] = "mmol/L" };
                resource.Remove("referenceRange");
            }
        }

        return bundle.ToJsonString();
    }

    [GeneratedRegex(@"\*\*Osmolal gap\*\* (-?[\d.]+) mOsm/kg")]
    private static partial Regex GapPattern();
}
