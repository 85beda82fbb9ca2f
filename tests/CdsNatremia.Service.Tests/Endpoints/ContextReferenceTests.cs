using System.Net;
using System.Text.Json.Nodes;
using CdsNatremia.Scenarios;
using CdsNatremia.Service.Tests.Support;

namespace CdsNatremia.Service.Tests.Endpoints;

/// <summary>
/// Context references are checked against the FHIR relative reference form "[ResourceType]/[id]" (FHIR R4 §2.3.0
/// literal references; the id datatype is 1–64 of [A-Za-z0-9-.]) with a length cap, and refused with 400 naming
/// the field (CDS Hooks 2.0: userId is a Practitioner, PractitionerRole, Patient or RelatedPerson reference;
/// selections are references to the selected orders).
/// </summary>
public sealed class ContextReferenceTests(NatremiaFactory factory) : IClassFixture<NatremiaFactory>
{
    private const string ChartReview = "natremia-chart-review";

    [Theory]
    [InlineData("Practitioner/demo-clinician")]
    [InlineData("PractitionerRole/pr.1")]
    [InlineData("RelatedPerson/carer-2")]
    public async Task UserId_UserReference_200(string userId)
    {
        var response = await PostChartReviewAsync(userId);

        Assert.Equal(HttpStatusCode.OK, response.StatusCode);
    }

    [Theory]
    [InlineData("demo-clinician")]
    [InlineData("Practitioner/")]
    [InlineData("Practitioner/a b")]
    [InlineData("Observation/na-1")]
    [InlineData("https://ehr.test.example/fhir/Practitioner/1")]
    [InlineData("practitioner/1")]
    public async Task UserId_NotAUserReference_400NamingTheField(string userId)
    {
        var response = await PostChartReviewAsync(userId);

        Assert.Equal(HttpStatusCode.BadRequest, response.StatusCode);
        Assert.Contains("'context.userId' must be a FHIR reference to the user", await response.Content.ReadAsStringAsync(), StringComparison.Ordinal);
    }

    [Fact]
    public async Task UserId_ThreeMegabytes_400WithoutEchoingIt()
    {
        var huge = "Practitioner/" + new string('a', 3 * 1024 * 1024);

        var response = await PostChartReviewAsync(huge);
        var body = await response.Content.ReadAsStringAsync();

        Assert.Equal(HttpStatusCode.BadRequest, response.StatusCode);
        Assert.Contains("'context.userId'", body, StringComparison.Ordinal);
        Assert.True(body.Length < 2_000, $"the answer is {body.Length} characters long");
    }

    [Fact]
    public async Task UserId_IdOf64Characters_200_IdOf65_400()
    {
        Assert.Equal(HttpStatusCode.OK, (await PostChartReviewAsync("Practitioner/" + new string('p', 64))).StatusCode);
        Assert.Equal(HttpStatusCode.BadRequest, (await PostChartReviewAsync("Practitioner/" + new string('p', 65))).StatusCode);
    }

    [Theory]
    [InlineData("not a reference")]
    [InlineData("MedicationRequest/")]
    public async Task Selections_EntryNotAReference_400NamingTheField(string selection)
    {
        var scenario = ScenarioLibrary.All.First(s => s.Hook == "order-select");
        var body = HookCalls.Request(scenario);
        body["context"]!["selections"] = new JsonArray(JsonValue.Create("MedicationRequest/ok-1"), JsonValue.Create(selection));

        var response = await HookCalls.PostAsync(factory.CreateClient(), HookCalls.ServiceFor(scenario.Hook), body);

        Assert.Equal(HttpStatusCode.BadRequest, response.StatusCode);
        Assert.Contains("'context.selections' must be an array of 1–200 FHIR references", await response.Content.ReadAsStringAsync(), StringComparison.Ordinal);
    }

    private Task<HttpResponseMessage> PostChartReviewAsync(string userId)
    {
        var body = HookCalls.Request(ScenarioLibrary.Find("01")!);
        body["context"]!["userId"] = userId;
        return HookCalls.PostAsync(factory.CreateClient(), ChartReview, body);
    }
}
