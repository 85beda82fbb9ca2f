using System.Net;
using System.Text.Json.Nodes;
using CdsNatremia.Scenarios;
using CdsNatremia.Service.Tests.Support;

namespace CdsNatremia.Service.Tests.Endpoints;

/// <summary>
/// A prefetch key holding something other than what its template asks for (CDS Hooks 2.0 Prefetch: the value is the
/// result of the template's FHIR query) is not that data. A required key (sodium) is then treated as absent: fetched
/// when a FHIR server is given, else 412 with the reason. An optional key is listed as not usable on the card.
/// </summary>
public sealed class PrefetchTemplateTests(NatremiaFactory factory) : IClassFixture<NatremiaFactory>
{
    private const string Service = "natremia-chart-review";
    private static readonly Scenario Thiazide = ScenarioLibrary.Find("01")!;

    public static TheoryData<string, string> WrongSodium => new()
    {
        { """{"resourceType":"Patient","id":"s01-pt","gender":"female"}""", "holds a Patient" },
        { """{"resourceType":"Binary","contentType":"text/plain","data":"aGVsbG8="}""", "holds a Binary" },
        { """{"resourceType":"NoSuchType","id":"x"}""", "holds a NoSuchType" },
        { """{"resourceType":"Bundle","type":"searchset","entry":[{"resource":{"resourceType":"Condition","id":"c1","subject":{"reference":"Patient/s01-pt"}}},{"resource":{"resourceType":"Patient","id":"s01-pt"}}]}""", "is a Bundle holding Condition, Patient" },
    };

    [Theory]
    [MemberData(nameof(WrongSodium))]
    public async Task RequiredKeyOfAnotherType_NoFhirServer_412WithTheReason(string sodium, string reason)
    {
        var body = HookCalls.Request(Thiazide);
        body["prefetch"]!["sodium"] = JsonNode.Parse(sodium);

        var response = await HookCalls.PostAsync(factory.CreateClient(), Service, body);
        var text = await response.Content.ReadAsStringAsync();

        Assert.Equal(HttpStatusCode.PreconditionFailed, response.StatusCode);
        Assert.Contains($"prefetch 'sodium' {reason}", text, StringComparison.Ordinal);
        Assert.Contains("its template asks for a Bundle of Observation", text, StringComparison.Ordinal);
    }

    [Theory]
    [MemberData(nameof(WrongSodium))]
    public async Task RequiredKeyOfAnotherType_FhirServerGiven_FetchedAndAssessed(string sodium, string reason)
    {
        Assert.NotEmpty(reason);
        using var fhir = FhirServerFake.Start();
        fhir.ServeScenario(Thiazide);
        using var fetching = NatremiaFactory.With(new()
        {
            ["Natremia:Fetching:AllowedServers:0"] = fhir.BaseUrl,
            ["Natremia:Fetching:Budget"] = "00:00:10",
            ["Natremia:Fetching:AttemptTimeout"] = "00:00:05",
        });
        var body = HookCalls.Request(Thiazide);
        body["prefetch"]!["sodium"] = JsonNode.Parse(sodium);
        body["fhirServer"] = fhir.BaseUrl;
        body["fhirAuthorization"] = new JsonObject
        {
            ["access_token"] = "tpl-token", ["token_type"] = "Bearer", ["expires_in"] = 300, ["scope"] = "patient/*.read", ["subject"] = "ehr-client",
        };

        var cards = await HookCalls.CardsAsync(await HookCalls.PostAsync(fetching.CreateClient(), Service, body));

        // Scenario 01 (scenarios.json): sodium 124 mmol/L from the FHIR server, so the assessment card appears.
        var card = cards.Single(c => (string?)c!["source"]!["topic"]!["code"] == "sodium-assessment")!;
        Assert.Contains("124", (string)card["summary"]!, StringComparison.Ordinal);
        Assert.Equal(1, fhir.CountOf("Observation"));
    }

    [Fact]
    public async Task OptionalKeyOfAnotherType_ListedAsNotUsable()
    {
        var body = HookCalls.Request(Thiazide);
        body["prefetch"]!["conditions"] = JsonNode.Parse("""{"resourceType":"Bundle","type":"searchset","entry":[{"resource":{"resourceType":"Observation","id":"o1","status":"final","code":{"text":"x"}}}]}""");

        var cards = await HookCalls.CardsAsync(await HookCalls.PostAsync(factory.CreateClient(), Service, body));
        var detail = (string)cards.Single(c => (string?)c!["source"]!["topic"]!["code"] == "sodium-assessment")!.CardText();

        Assert.Contains("Data the service could not use", detail, StringComparison.Ordinal);
        Assert.Contains("prefetch 'conditions' is a Bundle holding Observation, but its template asks for a Bundle of Condition", detail, StringComparison.Ordinal);
    }

    [Fact]
    public async Task RequiredKeyBundleWithOperationOutcomeAndIncludedEntries_Used()
    {
        // The control: the template's own type, with an OperationOutcome entry and an included resource, is accepted.
        var body = HookCalls.Request(Thiazide);
        var sodium = body["prefetch"]!["sodium"]!.AsObject();
        var entries = sodium["entry"]!.AsArray();
        entries.Add(JsonNode.Parse("""{"resource":{"resourceType":"OperationOutcome","issue":[{"severity":"information","code":"informational","diagnostics":"partial"}]},"search":{"mode":"outcome"}}"""));
        entries.Add(JsonNode.Parse("""{"resource":{"resourceType":"Patient","id":"s01-pt"},"search":{"mode":"include"}}"""));

        var response = await HookCalls.PostAsync(factory.CreateClient(), Service, body);

        Assert.Equal(HttpStatusCode.OK, response.StatusCode);
        Assert.Contains("124", (string)(await HookCalls.CardsAsync(response)).First()!["summary"]!, StringComparison.Ordinal);
    }

    [Fact]
    public async Task MedicationSearchWithItsMedications_Used()
    {
        // Scenario 18 (scenarios.json): the medication searches carry the referenced Medication (an ACE-thiazide
        // combination) beside the MedicationRequests, as EHRs do; the drug-cause card must still name the thiazide.
        var scenario = ScenarioLibrary.Find("18")!;

        var cards = await HookCalls.RunAsync(factory.CreateClient(), scenario);

        Assert.Contains("hydrochlorothiazide", cards.ToJsonString(), StringComparison.OrdinalIgnoreCase);
        Assert.DoesNotContain("its template asks for", cards.ToJsonString(), StringComparison.Ordinal);
    }
}
