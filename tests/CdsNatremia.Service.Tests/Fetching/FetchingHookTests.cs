using System.Diagnostics;
using System.Net;
using System.Text.Json.Nodes;
using CdsNatremia.Scenarios;
using CdsNatremia.Service.Tests.Support;
using Xunit.Abstractions;

namespace CdsNatremia.Service.Tests.Fetching;

// CDS Hooks 2.0 (Prefetch): a service fetches what the client did not prefetch from fhirServer with the token in
// fhirAuthorization, answers 412 when it cannot obtain required data, and should answer in about 500 ms.
public sealed class FetchingHookTests(ITestOutputHelper output) : IDisposable
{
    private const string Token = "hook-token-51c2e0";
    private const string ServiceId = "natremia-chart-review";
    private static readonly Scenario Thiazide = ScenarioLibrary.Find("01")!;
    private readonly FhirServerFake _fhir = FhirServerFake.Start();

    public void Dispose() => _fhir.Dispose();

    // Tests not about time get a generous budget so a busy machine cannot fail them; the time tests keep the defaults.
    private static NatremiaFactory Factory(string allowed, bool defaultBudget = false)
        => NatremiaFactory.With(defaultBudget
            ? new() { ["Natremia:Fetching:AllowedServers:0"] = allowed }
            : new() { ["Natremia:Fetching:AllowedServers:0"] = allowed, ["Natremia:Fetching:Budget"] = "00:00:10", ["Natremia:Fetching:AttemptTimeout"] = "00:00:05" });

    private static JsonObject Request(Scenario scenario, string fhirServer, bool includePrefetch)
    {
        var body = HookCalls.Request(scenario, includePrefetch);
        body["fhirServer"] = fhirServer;
        body["fhirAuthorization"] = new JsonObject
        {
            ["access_token"] = Token, ["token_type"] = "Bearer", ["expires_in"] = 300, ["scope"] = "patient/*.read", ["subject"] = "ehr-client",
        };
        return body;
    }

    [Fact]
    public async Task Hook_NoPrefetch_FetchesFromTheFhirServerAndCardsSaySo()
    {
        _fhir.ServeScenario(Thiazide);
        using var factory = Factory(_fhir.BaseUrl);

        var cards = await HookCalls.CardsAsync(await HookCalls.PostAsync(factory.CreateClient(), ServiceId, Request(Thiazide, _fhir.BaseUrl, includePrefetch: false)));

        // Scenario 01 (scenarios.json): sodium 124 mmol/L, a profound low sodium, so an assessment card is expected.
        var card = cards.Single(c => (string?)c!["source"]!["topic"]!["code"] == "sodium-assessment")!;
        var detail = (string)card.CardText();
        Assert.Contains("124", (string)card["summary"]!, StringComparison.Ordinal);
        Assert.Contains("fetched from the FHIR server", detail, StringComparison.Ordinal);
        Assert.Contains("fetched from the EHR's FHIR server", detail, StringComparison.Ordinal);
        Assert.Equal(7, _fhir.Requests.Count); // one request per prefetch key
        Assert.All(_fhir.Requests, r => Assert.Equal("Bearer " + Token, r.RequestMessage.Headers!["Authorization"].Single()));
    }

    [Fact]
    public async Task Hook_PrefetchPartlyPresent_FetchesOnlyTheMissingKeys()
    {
        _fhir.ServeScenario(Thiazide);
        using var factory = Factory(_fhir.BaseUrl);
        var body = Request(Thiazide, _fhir.BaseUrl, includePrefetch: true);
        body["prefetch"]!.AsObject().Remove("sodium");
        body["prefetch"]!.AsObject().Remove("conditions");
        body["prefetch"]!["weight"] = null; // null means "no data": never fetched

        var cards = await HookCalls.CardsAsync(await HookCalls.PostAsync(factory.CreateClient(), ServiceId, body));

        Assert.NotEmpty(cards);
        Assert.Equal(2, _fhir.Requests.Count);
        Assert.Equal(1, _fhir.CountOfObservations("2951-2"));
        Assert.Equal(1, _fhir.CountOf("Condition"));
        Assert.Equal(0, _fhir.CountOf("Patient"));
        Assert.Equal(0, _fhir.CountOfObservations("29463-7"));
    }

    [Fact]
    public async Task Hook_PrefetchHoldsOperationOutcome_FetchesThatKey()
    {
        _fhir.ServeScenario(Thiazide);
        using var factory = Factory(_fhir.BaseUrl);
        var body = Request(Thiazide, _fhir.BaseUrl, includePrefetch: true);
        body["prefetch"]!["sodium"] = JsonNode.Parse("""{"resourceType":"OperationOutcome","issue":[{"severity":"error","code":"timeout","diagnostics":"query timed out"}]}""");

        var cards = await HookCalls.CardsAsync(await HookCalls.PostAsync(factory.CreateClient(), ServiceId, body));

        Assert.Contains("124", (string)cards.Single(c => (string?)c!["source"]!["topic"]!["code"] == "sodium-assessment")!["summary"]!, StringComparison.Ordinal);
        Assert.Equal(1, _fhir.CountOfObservations("2951-2"));
        Assert.Single(_fhir.Requests);
    }

    [Fact]
    public async Task Hook_OptionalKeyFails_CardsSayWhatTheyCouldNotUse()
    {
        _fhir.Server.Given(FhirServerFake.Search("MedicationStatement")).RespondWith(FhirServerFake.Status(403));
        using var factory = Factory(_fhir.BaseUrl);
        var body = Request(Thiazide, _fhir.BaseUrl, includePrefetch: true);
        body["prefetch"]!.AsObject().Remove("medicationStatements");

        var cards = await HookCalls.CardsAsync(await HookCalls.PostAsync(factory.CreateClient(), ServiceId, body));

        var detail = (string)cards.Single(c => (string?)c!["source"]!["topic"]!["code"] == "sodium-assessment")!.CardText();
        Assert.Contains("Data the service could not use", detail, StringComparison.Ordinal);
        Assert.Contains("medicationStatements", detail, StringComparison.Ordinal);
        Assert.Contains("HTTP 403", detail, StringComparison.Ordinal);
        Assert.DoesNotContain(Token, detail, StringComparison.Ordinal);
    }

    [Fact]
    public async Task Hook_FhirServerDown_412WithinTheBudgetAndNoToken()
    {
        var down = FhirServerFake.DownBaseUrl();
        var warmUp = down + "-warm-up"; // same dead port, another base URL: its own circuit
        using var factory = NatremiaFactory.With(new() { ["Natremia:Fetching:AllowedServers:0"] = down, ["Natremia:Fetching:AllowedServers:1"] = warmUp });
        var client = factory.CreateClient();
        // A first call on another (also dead) server compiles the fetch path, so the timed call measures fetching, not start-up;
        // it is another server because the circuit breaker is per server and would otherwise answer the timed call.
        await HookCalls.PostAsync(client, ServiceId, Request(Thiazide, warmUp, includePrefetch: false));

        var watch = Stopwatch.StartNew();
        var response = await HookCalls.PostAsync(client, ServiceId, Request(Thiazide, down, includePrefetch: false));
        watch.Stop();

        Assert.Equal(HttpStatusCode.PreconditionFailed, response.StatusCode);
        var text = await response.Content.ReadAsStringAsync();
        Assert.Contains("FHIR server query 'sodium'", text, StringComparison.Ordinal);
        // Refused connections are reported as such until the server's circuit opens (7 keys x 3 attempts can open it within
        // this one request); on a saturated machine the deadline may come first. All three are true reasons.
        Assert.True(new[] { "could not be reached", "circuit open", "time budget" }.Any(r => text.Contains(r, StringComparison.Ordinal)), text);
        Assert.DoesNotContain(Token, text, StringComparison.Ordinal);
        // Generous bound (default budget 400 ms): the answer must not hang on the dead server; exact speed is for benchmarks.
        output.WriteLine($"412 with the FHIR server down after {watch.ElapsedMilliseconds} ms");
        Assert.True(watch.Elapsed < TimeSpan.FromSeconds(3), $"answered after {watch.ElapsedMilliseconds} ms");
    }

    [Fact]
    public async Task Hook_FhirServerSlowerThanTheBudget_412WellBeforeTheServerAnswers()
    {
        _fhir.Server.Given(FhirServerFake.Search("*")).RespondWith(FhirServerFake.Status(200).WithDelay(TimeSpan.FromSeconds(8)));
        var warmUp = _fhir.Origin + "/warm-up"; // answers 404 at once: compiles the fetch path before the timed call
        using var factory = NatremiaFactory.With(new() { ["Natremia:Fetching:AllowedServers:0"] = _fhir.BaseUrl, ["Natremia:Fetching:AllowedServers:1"] = warmUp });
        var client = factory.CreateClient();
        await HookCalls.PostAsync(client, ServiceId, Request(Thiazide, warmUp, includePrefetch: false));

        var watch = Stopwatch.StartNew();
        var response = await HookCalls.PostAsync(client, ServiceId, Request(Thiazide, _fhir.BaseUrl, includePrefetch: false));
        watch.Stop();

        Assert.Equal(HttpStatusCode.PreconditionFailed, response.StatusCode);
        Assert.Contains("FHIR server query 'sodium'", await response.Content.ReadAsStringAsync(), StringComparison.Ordinal);
        output.WriteLine($"412 with the FHIR server slower than the budget after {watch.ElapsedMilliseconds} ms");
        Assert.True(watch.Elapsed < TimeSpan.FromSeconds(4), $"answered after {watch.ElapsedMilliseconds} ms; the server takes 8 s");
    }

    [Fact]
    public async Task Hook_FhirServerNotAllowlisted_412AndNoRequest()
    {
        _fhir.ServeScenario(Thiazide);
        using var factory = Factory("https://ehr.example.org/fhir");

        var response = await HookCalls.PostAsync(factory.CreateClient(), ServiceId, Request(Thiazide, _fhir.BaseUrl, includePrefetch: false));

        Assert.Equal(HttpStatusCode.PreconditionFailed, response.StatusCode);
        Assert.Contains("not on this service's allowlist", await response.Content.ReadAsStringAsync(), StringComparison.Ordinal);
        Assert.Empty(_fhir.Requests);
    }
}
