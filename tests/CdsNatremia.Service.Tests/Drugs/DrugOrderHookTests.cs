using System.Net;
using System.Text.Json.Nodes;
using CdsNatremia.Scenarios;
using CdsNatremia.Service.Tests.Support;

namespace CdsNatremia.Service.Tests.Drugs;

/// <summary>The prescribing warning over HTTP through the real service, on invented patients and draftOrders Bundles.</summary>
public class DrugOrderHookTests(NatremiaFactory factory) : IClassFixture<NatremiaFactory>
{
    private const string OverrideSystem = "https://cdsnatremia.example.org/fhir/CodeSystem/override-reason";

    /// <summary>A draft order for a lisinopril and hydrochlorothiazide tablet whose Medication is contained in the order.</summary>
    private const string CombinationDraftOrders = """
        {"resourceType":"Bundle","type":"collection","entry":[
          {"fullUrl":"https://ehr.example.org/fhir/MedicationRequest/draft-lis-hctz","resource":{
            "resourceType":"MedicationRequest","id":"draft-lis-hctz","status":"draft","intent":"order",
            "contained":[{"resourceType":"Medication","id":"med1",
              "code":{"coding":[{"system":"http://www.whocc.no/atc","code":"C09BA03","display":"lisinopril and diuretics"}],"text":"lisinopril 20 mg and hydrochlorothiazide 12.5 mg tablet"},
              "ingredient":[{"itemCodeableConcept":{"text":"lisinopril"}},
                            {"itemCodeableConcept":{"coding":[{"system":"http://www.nlm.nih.gov/research/umls/rxnorm","code":"5487","display":"hydrochlorothiazide"}],"text":"hydrochlorothiazide"}}]}],
            "medicationReference":{"reference":"#med1"},
            "subject":{"reference":"Patient/s17-pt"},"authoredOn":"2026-03-10T11:50:00Z",
            "dosageInstruction":[{"text":"one tablet by mouth once daily"}]}},
          {"fullUrl":"https://ehr.example.org/fhir/MedicationRequest/draft-amlodipine","resource":{
            "resourceType":"MedicationRequest","id":"draft-amlodipine","status":"draft","intent":"order",
            "medicationCodeableConcept":{"text":"amlodipine 5 mg tablet"},
            "subject":{"reference":"Patient/s17-pt"},"authoredOn":"2026-03-10T11:50:00Z"}}
        ]}
        """;

    private static JsonObject Request(Scenario scenario, string hook, string? draftOrders = null, string[]? selections = null)
    {
        var body = HookCalls.Request(scenario with { Hook = hook, DraftOrdersJson = draftOrders ?? scenario.DraftOrdersJson });
        var context = body["context"]!.AsObject();
        if (hook == "order-sign")
        {
            context.Remove("selections");
        }
        else if (selections is not null)
        {
            context["selections"] = new JsonArray(selections.Select(s => (JsonNode)JsonValue.Create(s)).ToArray());
        }

        return body;
    }

    private async Task<List<JsonNode>> DrugCardsAsync(JsonObject body, string serviceId)
        => (await HookCalls.CardsAsync(await HookCalls.PostAsync(factory.CreateClient(), serviceId, body)))
            .Where(c => (string?)c!["source"]!["topic"]!["code"] == "drug-order-warning")
            .Select(c => c!)
            .ToList();

    [Fact]
    public async Task OrderSelect_Scenario17CitalopramAt129_WarningWithTheTwoSuggestions()
    {
        var scenario = ScenarioLibrary.Find("17")!;
        var card = Assert.Single(await DrugCardsAsync(HookCalls.Request(scenario), "natremia-order-select"));
        Assert.Equal("warning", (string?)card["indicator"]); // 129: moderate, not profound (2014 European guideline)
        Assert.Contains("citalopram", (string)card["summary"]!, StringComparison.Ordinal);
        Assert.Contains("129 mmol/L", (string)card["summary"]!, StringComparison.Ordinal);
        Assert.Equal("at-most-one", (string?)card["selectionBehavior"]);

        var suggestions = card["suggestions"]!.AsArray();
        Assert.Equal(2, suggestions.Count);
        var delete = suggestions[0]!["actions"]!.AsArray().Single()!;
        Assert.Equal("delete", (string?)delete["type"]);
        Assert.Equal("MedicationRequest/draft-citalopram", (string?)delete["resourceId"]); // exactly the selected draft
        var create = suggestions[1]!["actions"]!.AsArray().Single()!;
        Assert.Equal("create", (string?)create["type"]);
        var serviceRequest = create["resource"]!;
        Assert.Equal("ServiceRequest", (string?)serviceRequest["resourceType"]);
        Assert.Equal("draft", (string?)serviceRequest["status"]);
        Assert.Equal("http://loinc.org", (string?)serviceRequest["code"]!["coding"]![0]!["system"]);
        Assert.Equal("2951-2", (string?)serviceRequest["code"]!["coding"]![0]!["code"]); // LOINC serum sodium (reference sheet, verified)
        Assert.Equal("2026-03-17T12:00:00Z", (string?)serviceRequest["occurrencePeriod"]!["end"]); // now + 168 h (option default)

        var reasons = card["overrideReasons"]!.AsArray();
        Assert.Equal(7, reasons.Count); // every code of profiles/codesystems/override-reason.json
        Assert.All(reasons, r =>
        {
            Assert.Equal(OverrideSystem, (string?)r!["system"]);
            Assert.False(string.IsNullOrWhiteSpace((string?)r["code"]));
            Assert.False(string.IsNullOrWhiteSpace((string?)r["display"]));
        });
        Assert.Contains("Advisory only", (string)card.CardText(), StringComparison.Ordinal);
    }

    [Fact]
    public async Task OrderSelect_DraftNotSelected_NoDrugCard()
    {
        var scenario = ScenarioLibrary.Find("17")!;
        Assert.Empty(await DrugCardsAsync(Request(scenario, "order-select", selections: ["MedicationRequest/some-other-order"]), "natremia-order-select"));
    }

    [Fact]
    public async Task OrderSign_Scenario17_SameWarning()
    {
        var scenario = ScenarioLibrary.Find("17")!;
        var card = Assert.Single(await DrugCardsAsync(Request(scenario, "order-sign"), "natremia-order-sign"));
        Assert.Equal("MedicationRequest/draft-citalopram", (string?)card["suggestions"]![0]!["actions"]![0]!["resourceId"]);
    }

    [Fact]
    public async Task OrderSign_ThiazideInAContainedAceCombination_NamesTheThiazideAndOnlyThatDraft()
    {
        var scenario = ScenarioLibrary.Find("17")!;
        var card = Assert.Single(await DrugCardsAsync(Request(scenario, "order-sign", CombinationDraftOrders), "natremia-order-sign"));
        Assert.Contains("hydrochlorothiazide", (string)card["summary"]!, StringComparison.Ordinal);
        Assert.Contains("matched by code RxNorm 5487", (string)card.CardText(), StringComparison.Ordinal);
        Assert.Equal("MedicationRequest/draft-lis-hctz", (string?)card["suggestions"]![0]!["actions"]![0]!["resourceId"]);
    }

    [Fact]
    public async Task OrderSign_ReorderWithStableNormalSodium_NoDrugCard()
    {
        // Scenario 13: sodium 140 then 139 mmol/L (normal, stable); the patient re-orders citalopram.
        var scenario = ScenarioLibrary.Find("13")!;
        var drafts = ScenarioLibrary.Find("17")!.DraftOrdersJson!.Replace("Patient/s17-pt", "Patient/s13-pt", StringComparison.Ordinal);
        Assert.Empty(await DrugCardsAsync(Request(scenario, "order-sign", drafts), "natremia-order-sign"));
    }

    [Fact]
    public async Task OrderSign_ProfoundSodium_Critical()
    {
        // Scenario 01: sodium 124 mmol/L, profound (< 125, 2014 European guideline); a citalopram draft for her.
        var scenario = ScenarioLibrary.Find("01")!;
        var drafts = ScenarioLibrary.Find("17")!.DraftOrdersJson!.Replace("Patient/s17-pt", "Patient/s01-pt", StringComparison.Ordinal);
        var card = Assert.Single(await DrugCardsAsync(Request(scenario, "order-sign", drafts), "natremia-order-sign"));
        Assert.Equal("critical", (string?)card["indicator"]);
        Assert.Contains("hydrochlorothiazide", (string)card.CardText(), StringComparison.Ordinal); // she already takes it: acting together
    }

    [Fact]
    public async Task OrderSign_DraftForAnotherPatient_NotWarnedOn()
    {
        var scenario = ScenarioLibrary.Find("17")!;
        var drafts = scenario.DraftOrdersJson!.Replace("Patient/s17-pt", "Patient/someone-else", StringComparison.Ordinal);
        Assert.Empty(await DrugCardsAsync(Request(scenario, "order-sign", drafts), "natremia-order-sign"));
    }

    [Fact]
    public async Task OrderSign_DraftOrdersNotABundle_ClientError()
    {
        var body = Request(ScenarioLibrary.Find("17")!, "order-sign");
        body["context"]!["draftOrders"] = "not a bundle";
        var response = await HookCalls.PostAsync(factory.CreateClient(), "natremia-order-sign", body);
        Assert.True((int)response.StatusCode is >= 400 and < 500, $"HTTP {(int)response.StatusCode}");
        Assert.NotEqual(HttpStatusCode.InternalServerError, response.StatusCode);
    }
}
