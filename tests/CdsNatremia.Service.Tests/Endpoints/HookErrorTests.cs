using System.Net;
using System.Text.Json.Nodes;
using CdsNatremia.Scenarios;
using CdsNatremia.Service.Tests.Support;

namespace CdsNatremia.Service.Tests.Endpoints;

public class HookErrorTests(NatremiaFactory factory) : IClassFixture<NatremiaFactory>
{
    private const string Service = "natremia-chart-review";

    private static JsonObject Valid() => HookCalls.Request(ScenarioLibrary.Find("01")!);

    [Fact]
    public async Task MalformedJson_400WithPosition()
    {
        var response = await HookCalls.PostRawAsync(factory.CreateClient(), Service, "{\"hook\": \"patient-view\", ");
        Assert.Equal(HttpStatusCode.BadRequest, response.StatusCode);
        Assert.Contains("not valid JSON", (await HookCalls.ProblemAsync(response)).GetProperty("detail").GetString(), StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("hook", "'hook' is required")]
    [InlineData("hookInstance", "'hookInstance' is required")]
    [InlineData("context", "'context' is required")]
    public async Task MissingRequiredField_400NamesTheField(string field, string message)
    {
        var body = Valid();
        body.Remove(field);
        var response = await HookCalls.PostAsync(factory.CreateClient(), Service, body);
        Assert.Equal(HttpStatusCode.BadRequest, response.StatusCode);
        Assert.Contains(message, await response.Content.ReadAsStringAsync(), StringComparison.Ordinal);
    }

    [Fact]
    public async Task HookDoesNotMatchService_400()
    {
        var body = Valid();
        body["hook"] = "order-sign";
        var response = await HookCalls.PostAsync(factory.CreateClient(), Service, body);
        Assert.Equal(HttpStatusCode.BadRequest, response.StatusCode);
        Assert.Contains("answers the 'patient-view' hook", await response.Content.ReadAsStringAsync(), StringComparison.Ordinal);
    }

    [Fact]
    public async Task ContextWithoutPatientId_400()
    {
        var body = Valid();
        body["context"]!.AsObject().Remove("patientId");
        var response = await HookCalls.PostAsync(factory.CreateClient(), Service, body);
        Assert.Equal(HttpStatusCode.BadRequest, response.StatusCode);
        Assert.Contains("'context.patientId' is required", await response.Content.ReadAsStringAsync(), StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("../../etc/passwd")]
    [InlineData("a b")]
    public async Task PatientIdNotAFhirId_400(string patientId)
    {
        var body = Valid();
        body["context"]!["patientId"] = patientId;
        var response = await HookCalls.PostAsync(factory.CreateClient(), Service, body);
        Assert.Equal(HttpStatusCode.BadRequest, response.StatusCode);
    }

    [Fact]
    public async Task HookInstanceNotUuid_400()
    {
        var body = Valid();
        body["hookInstance"] = "not-a-uuid";
        Assert.Equal(HttpStatusCode.BadRequest, (await HookCalls.PostAsync(factory.CreateClient(), Service, body)).StatusCode);
    }

    [Fact]
    public async Task FhirAuthorizationWithoutFhirServer_400()
    {
        var body = Valid();
        body["fhirAuthorization"] = new JsonObject { ["access_token"] = "t", ["token_type"] = "Bearer", ["expires_in"] = 300, ["scope"] = "patient/*.read", ["subject"] = "ehr" };
        var response = await HookCalls.PostAsync(factory.CreateClient(), Service, body);
        Assert.Equal(HttpStatusCode.BadRequest, response.StatusCode);
        Assert.Contains("'fhirServer' is required", await response.Content.ReadAsStringAsync(), StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("hookInstance")]
    [InlineData("hook")]
    public async Task LoneSurrogateEscapeInAString_400NotA500(string field)
    {
        // "\ud800" is valid JSON syntax but decodes to no valid text; found by fuzzing (it used to surface as a 500).
        var text = Valid().ToJsonString();
        text = text.Replace($"\"{field}\":\"", $"\"{field}\":\"\\ud800", StringComparison.Ordinal);
        var response = await HookCalls.PostRawAsync(factory.CreateClient(), Service, text);
        Assert.Equal(HttpStatusCode.BadRequest, response.StatusCode);
        Assert.Contains("lone UTF-16 surrogate", await response.Content.ReadAsStringAsync(), StringComparison.Ordinal);
    }

    [Fact]
    public async Task UnknownService_404()
        => Assert.Equal(HttpStatusCode.NotFound, (await HookCalls.PostAsync(factory.CreateClient(), "no-such-service", Valid())).StatusCode);

    [Fact]
    public async Task NotJsonContentType_415()
        => Assert.Equal(HttpStatusCode.UnsupportedMediaType, (await HookCalls.PostRawAsync(factory.CreateClient(), Service, "hello", "text/plain")).StatusCode);

    // CDS Hooks 2.0: no prefetch and no reachable FHIR server → 412 Precondition Failed.
    [Fact]
    public async Task RequiredPrefetchAbsentAndNoFhirServer_412NamesTheData()
    {
        var body = Valid();
        body["prefetch"]!.AsObject().Remove("sodium");
        var response = await HookCalls.PostAsync(factory.CreateClient(), Service, body);
        Assert.Equal(HttpStatusCode.PreconditionFailed, response.StatusCode);
        Assert.Contains("prefetch 'sodium'", await response.Content.ReadAsStringAsync(), StringComparison.Ordinal);
    }

    [Fact]
    public async Task OptionalPrefetchAbsent_CardSaysWhatItCouldNotUse()
    {
        var body = Valid();
        body["prefetch"]!.AsObject().Remove("patient");
        var cards = await HookCalls.CardsAsync(await HookCalls.PostAsync(factory.CreateClient(), Service, body));
        var detail = (string)cards.First()!.CardText();
        Assert.Contains("Data the service could not use", detail, StringComparison.Ordinal);
        Assert.Contains("prefetch 'patient'", detail, StringComparison.Ordinal);
    }

    [Fact]
    public async Task RequiredPrefetchNull_MeansNoData_NoCard()
    {
        var body = Valid();
        body["prefetch"]!["sodium"] = null;
        var cards = await HookCalls.CardsAsync(await HookCalls.PostAsync(factory.CreateClient(), Service, body));
        Assert.Empty(cards);
    }

    [Theory]
    [InlineData("[1,2,3]")]
    [InlineData("\"text\"")]
    [InlineData("{\"resourceType\":\"Bundle\",\"entry\":[{\"resource\":{\"resourceType\":\"Observation\",\"status\":\"final\",\"valueQuantity\":{\"value\":\"abc\"}}}]}")]
    [InlineData("{\"resourceType\":\"Bundle\",\"entry\":\"oops\"}")]
    [InlineData("{\"resourceType\":\"NoSuchType\"}")]
    // a null inside code.coding (found by fuzzing)
    [InlineData("{\"resourceType\":\"Bundle\",\"entry\":[{\"resource\":{\"resourceType\":\"Observation\",\"id\":\"n1\",\"status\":\"final\",\"code\":{\"coding\":[null,{\"system\":\"http://loinc.org\",\"code\":\"2951-2\"}]},\"subject\":{\"reference\":\"Patient/s01-pt\"},\"effectiveDateTime\":\"2026-03-10T07:40:00Z\",\"valueQuantity\":{\"value\":124,\"unit\":\"mmol/L\"}}}]}")]
    // an id of the wrong JSON type (found by fuzzing)
    [InlineData("{\"resourceType\":\"Bundle\",\"entry\":[{\"resource\":{\"resourceType\":\"Observation\",\"id\":[],\"status\":\"final\",\"code\":{\"coding\":[{\"system\":\"http://loinc.org\",\"code\":\"2951-2\"}]},\"subject\":{\"reference\":\"Patient/s01-pt\"},\"effectiveDateTime\":\"2026-03-10T07:40:00Z\",\"valueQuantity\":{\"value\":124,\"unit\":\"mmol/L\"}}}]}")]
    // a time finer than .NET ticks on the latest of two results (found by fuzzing)
    [InlineData("{\"resourceType\":\"Bundle\",\"entry\":[{\"resource\":{\"resourceType\":\"Observation\",\"id\":\"t1\",\"status\":\"final\",\"code\":{\"coding\":[{\"system\":\"http://loinc.org\",\"code\":\"2951-2\"}]},\"subject\":{\"reference\":\"Patient/s01-pt\"},\"effectiveDateTime\":\"2026-03-09T07:40:00Z\",\"valueQuantity\":{\"value\":112,\"unit\":\"mmol/L\"}}},{\"resource\":{\"resourceType\":\"Observation\",\"id\":\"t2\",\"status\":\"final\",\"code\":{\"coding\":[{\"system\":\"http://loinc.org\",\"code\":\"2951-2\"}]},\"subject\":{\"reference\":\"Patient/s01-pt\"},\"effectiveDateTime\":\"2026-03-10T07:40:00.000000001Z\",\"valueQuantity\":{\"value\":124,\"unit\":\"mmol/L\"}}}]}")]
    public async Task WrongShapesInPrefetch_NeverA500(string sodiumJson)
    {
        var body = Valid();
        body["prefetch"]!["sodium"] = JsonNode.Parse(sodiumJson);
        var response = await HookCalls.PostAsync(factory.CreateClient(), Service, body);
        Assert.True((int)response.StatusCode < 500, $"HTTP {(int)response.StatusCode}");
    }

    [Fact]
    public async Task OperationOutcomeForRequiredKeyWithoutFhirServer_412()
    {
        var body = Valid();
        body["prefetch"]!["sodium"] = JsonNode.Parse("{\"resourceType\":\"OperationOutcome\",\"issue\":[{\"severity\":\"error\",\"code\":\"timeout\",\"diagnostics\":\"query timed out\"}]}");
        var response = await HookCalls.PostAsync(factory.CreateClient(), Service, body);
        Assert.Equal(HttpStatusCode.PreconditionFailed, response.StatusCode);
    }
}
