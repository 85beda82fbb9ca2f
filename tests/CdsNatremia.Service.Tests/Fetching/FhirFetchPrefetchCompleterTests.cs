using System.Text.Json.Nodes;
using CdsNatremia.Core.Engine;
using CdsNatremia.Core.Facts;
using CdsNatremia.Fhir.Reading;
using CdsNatremia.Service.Hooks;
using CdsNatremia.Service.Tests.Support;
using Patient = Hl7.Fhir.Model.Patient;
using Microsoft.Extensions.Time.Testing;
using WireMock.ResponseBuilders;

namespace CdsNatremia.Service.Tests.Fetching;

// The HTTP behaviour checked here follows RFC 9110 (status codes, Retry-After, redirects) and the FHIR R4 RESTful API
// (search returns a searchset Bundle; paging through Bundle.link "next"; media type application/fhir+json).
public sealed class FhirFetchPrefetchCompleterTests : IDisposable
{
    private static readonly DateTimeOffset At = new(2026, 3, 10, 6, 0, 0, TimeSpan.Zero);
    private readonly FhirServerFake _fhir = FhirServerFake.Start();

    public void Dispose() => _fhir.Dispose();

    private FetchHarness Harness(Dictionary<string, string?>? settings = null, TimeProvider? clock = null)
        => new([_fhir.BaseUrl], settings, clock);

    private static JsonObject SodiumBundle(int count, int from = 0, string? next = null)
        => FhirServerFake.Bundle(Enumerable.Range(from, count).Select(i => FhirServerFake.Sodium($"na-{i}", FetchHarness.PatientId, 130 - i, At.AddHours(-i))), next);

    [Fact]
    public async Task CompleteAsync_NormalSearch_ReturnsFetchedDataWithTokenAndFhirAccept()
    {
        _fhir.Server.Given(FhirServerFake.Search("Observation")).RespondWith(FhirServerFake.Fhir(SodiumBundle(2)));
        using var harness = Harness();

        var value = await harness.FetchAsync(_fhir.BaseUrl, PrefetchKeys.Sodium);

        Assert.Equal(PrefetchValueKind.Data, value.Kind);
        Assert.Equal(2, value.Resources.Count);
        Assert.All(value.Resources, r => Assert.Equal(DataOrigin.FhirServer, r.Origin));
        var request = Assert.Single(_fhir.Requests).RequestMessage;
        Assert.Equal("Bearer " + FetchHarness.Token, request.Headers!["Authorization"].Single());
        Assert.Contains("application/fhir+json", request.Headers["Accept"].Single(), StringComparison.Ordinal);
        Assert.Equal(FetchHarness.PatientId, request.Query!["patient"].Single());
        Assert.Contains("-date", request.Query["_sort"].Single(), StringComparison.Ordinal);
    }

    [Fact]
    public async Task CompleteAsync_PatientRead_ReturnsThePatient()
    {
        var patient = new JsonObject { ["resourceType"] = "Patient", ["id"] = FetchHarness.PatientId, ["gender"] = "female", ["birthDate"] = "1950-04-02" };
        _fhir.Server.Given(FhirServerFake.Search("Patient/" + FetchHarness.PatientId)).RespondWith(FhirServerFake.Fhir(patient));
        using var harness = Harness();

        var value = await harness.FetchAsync(_fhir.BaseUrl, PrefetchKeys.Patient);

        Assert.Equal(PrefetchValueKind.Data, value.Kind);
        Assert.IsType<Patient>(Assert.Single(value.Resources).Resource);
    }

    [Fact]
    public async Task CompleteAsync_ThreePages_FollowsNextLinksAndReadsAll()
    {
        _fhir.Server.Given(FhirServerFake.Search("Observation").WithParam("page", "2")).AtPriority(1)
            .RespondWith(FhirServerFake.Fhir(SodiumBundle(2, 2, _fhir.BaseUrl + "/Observation?page=3")));
        _fhir.Server.Given(FhirServerFake.Search("Observation").WithParam("page", "3")).AtPriority(1)
            .RespondWith(FhirServerFake.Fhir(SodiumBundle(2, 4)));
        _fhir.Server.Given(FhirServerFake.Search("Observation")).AtPriority(5)
            .RespondWith(FhirServerFake.Fhir(SodiumBundle(2, 0, _fhir.BaseUrl + "/Observation?page=2")));
        using var harness = Harness();

        var value = await harness.FetchAsync(_fhir.BaseUrl, PrefetchKeys.Sodium);

        Assert.Equal(PrefetchValueKind.Data, value.Kind);
        Assert.Equal(6, value.Resources.Count);
        Assert.Equal(3, _fhir.CountOf("Observation"));
        Assert.All(_fhir.Requests, r => Assert.Equal("Bearer " + FetchHarness.Token, r.RequestMessage.Headers!["Authorization"].Single()));
    }

    [Fact]
    public async Task CompleteAsync_MorePagesThanTheCap_StopsAtTheCapWithANote()
    {
        _fhir.Server.Given(FhirServerFake.Search("Observation"))
            .RespondWith(FhirServerFake.Fhir(SodiumBundle(2, 0, _fhir.BaseUrl + "/Observation?page=again")));
        using var harness = Harness(new() { ["Natremia:Fetching:MaxPages"] = "2" });

        var value = await harness.FetchAsync(_fhir.BaseUrl, PrefetchKeys.Sodium);

        Assert.Equal(2, _fhir.CountOf("Observation"));
        Assert.Equal(PrefetchValueKind.Data, value.Kind);
        Assert.Contains(value.Problems, p => p.Contains("first 2 pages", StringComparison.Ordinal));
    }

    [Fact]
    public async Task CompleteAsync_MoreEntriesThanTheCap_KeepsOnlyTheCap()
    {
        _fhir.Server.Given(FhirServerFake.Search("Observation")).RespondWith(FhirServerFake.Fhir(SodiumBundle(5)));
        using var harness = Harness(new() { ["Natremia:Fetching:MaxEntries"] = "3" });

        var value = await harness.FetchAsync(_fhir.BaseUrl, PrefetchKeys.Sodium);

        Assert.Equal(3, value.Resources.Count);
        Assert.Contains(value.Problems, p => p.Contains("first 3 resources", StringComparison.Ordinal));
    }

    [Fact]
    public async Task CompleteAsync_NextLinkToAnotherServer_NotFollowedAndNoTokenSent()
    {
        using var other = FhirServerFake.Start();
        other.Server.Given(FhirServerFake.Search("Observation")).RespondWith(FhirServerFake.Fhir(SodiumBundle(1, 9)));
        _fhir.Server.Given(FhirServerFake.Search("Observation")).RespondWith(FhirServerFake.Fhir(SodiumBundle(2, 0, other.BaseUrl + "/Observation?page=2")));
        using var harness = Harness();

        var value = await harness.FetchAsync(_fhir.BaseUrl, PrefetchKeys.Sodium);

        Assert.Equal(2, value.Resources.Count);
        Assert.Empty(other.Requests);
        Assert.Contains(value.Problems, p => p.Contains("not followed", StringComparison.Ordinal));
    }

    [Fact]
    public async Task CompleteAsync_500Then200_RetriedAndSucceeds()
    {
        _fhir.Server.Given(FhirServerFake.Search("Observation")).InScenario("flaky").WillSetStateTo("recovered")
            .RespondWith(FhirServerFake.Status(500));
        _fhir.Server.Given(FhirServerFake.Search("Observation")).InScenario("flaky").WhenStateIs("recovered")
            .RespondWith(FhirServerFake.Fhir(SodiumBundle(1)));
        using var harness = Harness();

        var value = await harness.FetchAsync(_fhir.BaseUrl, PrefetchKeys.Sodium);

        Assert.Equal(PrefetchValueKind.Data, value.Kind);
        Assert.Equal(2, _fhir.CountOf("Observation"));
    }

    [Fact]
    public async Task CompleteAsync_Always500_FailsAfterTheRetriesWithTheStatus()
    {
        _fhir.Server.Given(FhirServerFake.Search("Observation")).RespondWith(FhirServerFake.Status(503));
        using var harness = Harness(new() { ["Natremia:Fetching:MaxRetries"] = "2" });

        var value = await harness.FetchAsync(_fhir.BaseUrl, PrefetchKeys.Sodium);

        Assert.Equal(PrefetchValueKind.Failed, value.Kind);
        Assert.Equal(3, _fhir.CountOf("Observation"));
        Assert.Contains("HTTP 503 (3 attempts)", Assert.Single(value.Problems), StringComparison.Ordinal);
    }

    [Fact]
    public async Task CompleteAsync_429WithRetryAfter_WaitsTheAskedTimeThenRetries()
    {
        // The fake clock shows the wait is the server's Retry-After (10 s), not the back-off (about 10 ms here).
        var clock = new FakeTimeProvider(DateTimeOffset.UnixEpoch);
        _fhir.Server.Given(FhirServerFake.Search("Observation")).InScenario("busy").WillSetStateTo("free")
            .RespondWith(Response.Create().WithStatusCode(429).WithHeader("Retry-After", "10"));
        _fhir.Server.Given(FhirServerFake.Search("Observation")).InScenario("busy").WhenStateIs("free")
            .RespondWith(FhirServerFake.Fhir(SodiumBundle(1)));
        using var harness = Harness(new() { ["Natremia:Fetching:Budget"] = "00:01:00", ["Natremia:Fetching:AttemptTimeout"] = "00:00:30" }, clock);

        var fetch = harness.FetchAsync(_fhir.BaseUrl, PrefetchKeys.Sodium);
        await Eventually(() => _fhir.CountOf("Observation") == 1);
        // Move the fake clock one second at a time until the retry arrives: it must take at least the 10 s asked for.
        var advanced = TimeSpan.Zero;
        while (_fhir.CountOf("Observation") < 2 && advanced < TimeSpan.FromSeconds(50))
        {
            clock.Advance(TimeSpan.FromSeconds(1));
            advanced += TimeSpan.FromSeconds(1);
            await Task.Delay(100);
        }

        var value = await fetch.WaitAsync(TimeSpan.FromSeconds(30));

        Assert.True(advanced >= TimeSpan.FromSeconds(10), $"retried after {advanced.TotalSeconds} s of fake time");
        Assert.Equal(PrefetchValueKind.Data, value.Kind);
        Assert.Equal(2, _fhir.CountOf("Observation"));
    }

    [Fact]
    public async Task CompleteAsync_429WithRetryAfterPastTheBudget_GivesUpAtOnce()
    {
        _fhir.Server.Given(FhirServerFake.Search("Observation")).RespondWith(Response.Create().WithStatusCode(429).WithHeader("Retry-After", "30"));
        using var harness = Harness(new() { ["Natremia:Fetching:Budget"] = "00:00:02" });

        var value = await harness.FetchAsync(_fhir.BaseUrl, PrefetchKeys.Sodium);

        Assert.Equal(PrefetchValueKind.Failed, value.Kind);
        Assert.Equal(1, _fhir.CountOf("Observation"));
        Assert.Contains("asked for a wait of 30 s", Assert.Single(value.Problems), StringComparison.Ordinal);
    }

    [Fact]
    public async Task CompleteAsync_RepeatedFailures_CircuitOpensThenHalfOpensAfterTheBreak()
    {
        var clock = new FakeTimeProvider(DateTimeOffset.UnixEpoch);
        _fhir.Server.Given(FhirServerFake.Search("Observation")).RespondWith(FhirServerFake.Status(500));
        using var harness = Harness(
            new()
            {
                ["Natremia:Fetching:MaxRetries"] = "0",
                ["Natremia:Fetching:BreakerMinimumThroughput"] = "2",
                ["Natremia:Fetching:BreakerFailureRatio"] = "0.5",
                ["Natremia:Fetching:BreakDuration"] = "00:00:15",
            },
            clock);

        Assert.Equal(PrefetchValueKind.Failed, (await harness.FetchAsync(_fhir.BaseUrl, PrefetchKeys.Sodium)).Kind);
        Assert.Equal(PrefetchValueKind.Failed, (await harness.FetchAsync(_fhir.BaseUrl, PrefetchKeys.Sodium)).Kind);
        Assert.Equal(2, _fhir.CountOf("Observation"));

        _fhir.Server.ResetMappings();
        _fhir.Server.Given(FhirServerFake.Search("Observation")).RespondWith(FhirServerFake.Fhir(SodiumBundle(1)));
        var open = await harness.FetchAsync(_fhir.BaseUrl, PrefetchKeys.Sodium);
        Assert.Equal(PrefetchValueKind.Failed, open.Kind);
        Assert.Contains("circuit open", Assert.Single(open.Problems), StringComparison.Ordinal);
        Assert.Equal(2, _fhir.CountOf("Observation")); // open: no request reached the server

        clock.Advance(TimeSpan.FromSeconds(16));
        var trial = await harness.FetchAsync(_fhir.BaseUrl, PrefetchKeys.Sodium);
        Assert.Equal(PrefetchValueKind.Data, trial.Kind); // half-open: one trial call went through and closed the circuit
        Assert.Equal(3, _fhir.CountOf("Observation"));
        Assert.Equal(PrefetchValueKind.Data, (await harness.FetchAsync(_fhir.BaseUrl, PrefetchKeys.Sodium)).Kind);
        Assert.Equal(4, _fhir.CountOf("Observation"));
    }

    [Fact]
    public async Task CompleteAsync_CircuitIsPerServer_AnotherServerStillCalled()
    {
        var clock = new FakeTimeProvider(DateTimeOffset.UnixEpoch);
        using var healthy = FhirServerFake.Start();
        healthy.Server.Given(FhirServerFake.Search("Observation")).RespondWith(FhirServerFake.Fhir(SodiumBundle(1)));
        _fhir.Server.Given(FhirServerFake.Search("Observation")).RespondWith(FhirServerFake.Status(500));
        using var harness = new FetchHarness(
            [_fhir.BaseUrl, healthy.BaseUrl],
            new() { ["Natremia:Fetching:MaxRetries"] = "0", ["Natremia:Fetching:BreakerMinimumThroughput"] = "2" },
            clock);

        for (var i = 0; i < 3; i++)
        {
            await harness.FetchAsync(_fhir.BaseUrl, PrefetchKeys.Sodium);
        }

        Assert.Equal(2, _fhir.CountOf("Observation"));
        Assert.Equal(PrefetchValueKind.Data, (await harness.FetchAsync(healthy.BaseUrl, PrefetchKeys.Sodium)).Kind);
    }

    [Theory]
    [InlineData("{\"resourceType\":\"Bundle\",\"entry\":[", "application/fhir+json", "not valid JSON")]
    [InlineData("<html><body>Sign in</body></html>", "text/html", "content type 'text/html', not FHIR JSON")]
    [InlineData("{\"resourceType\":\"Bundle\",\"type\":\"searchset\",\"entry\":[{\"resource\":{\"resourceType\":\"Condition\",\"id\":\"c1\"}}]}", "application/fhir+json", "a Bundle of Condition where Observation was asked for")]
    [InlineData("{\"resourceType\":\"Patient\",\"id\":\"p\"}", "application/fhir+json", "a Patient where a Bundle of Observation was asked for")]
    public async Task CompleteAsync_AnswerThatIsNotTheData_FailsWithTheReason(string body, string contentType, string reason)
    {
        _fhir.Server.Given(FhirServerFake.Search("Observation")).RespondWith(FhirServerFake.Raw(body, contentType));
        using var harness = Harness();

        var value = await harness.FetchAsync(_fhir.BaseUrl, PrefetchKeys.Sodium);

        Assert.Equal(PrefetchValueKind.Failed, value.Kind);
        Assert.Contains(reason, Assert.Single(value.Problems), StringComparison.Ordinal);
        Assert.Equal(1, _fhir.CountOf("Observation")); // an answer that is not the data is not retried
    }

    [Fact]
    public async Task CompleteAsync_ReadAnsweredWithAnotherType_Fails()
    {
        _fhir.Server.Given(FhirServerFake.Search("Patient/" + FetchHarness.PatientId)).RespondWith(FhirServerFake.Fhir(SodiumBundle(1)));
        using var harness = Harness();

        var value = await harness.FetchAsync(_fhir.BaseUrl, PrefetchKeys.Patient);

        Assert.Equal(PrefetchValueKind.Failed, value.Kind);
        Assert.Contains("a Bundle where a Patient was asked for", Assert.Single(value.Problems), StringComparison.Ordinal);
    }

    [Theory]
    [InlineData(401, "refused the access token (HTTP 401)")]
    [InlineData(403, "refused access to Observation (HTTP 403)")]
    public async Task CompleteAsync_AuthRefused_NotRetried(int status, string reason)
    {
        _fhir.Server.Given(FhirServerFake.Search("Observation")).RespondWith(FhirServerFake.Status(status));
        using var harness = Harness(new() { ["Natremia:Fetching:MaxRetries"] = "3" });

        var value = await harness.FetchAsync(_fhir.BaseUrl, PrefetchKeys.Sodium);

        Assert.Equal(PrefetchValueKind.Failed, value.Kind);
        Assert.Contains(reason, Assert.Single(value.Problems), StringComparison.Ordinal);
        Assert.Equal(1, _fhir.CountOf("Observation"));
    }

    [Fact]
    public async Task CompleteAsync_OversizeAnswer_RefusedAtTheCap()
    {
        var big = SodiumBundle(40); // about 20 KB
        _fhir.Server.Given(FhirServerFake.Search("Observation")).RespondWith(FhirServerFake.Fhir(big));
        using var harness = Harness(new() { ["Natremia:Fetching:MaxResponseBytes"] = "4096" });

        var value = await harness.FetchAsync(_fhir.BaseUrl, PrefetchKeys.Sodium);

        Assert.True(big.ToJsonString().Length > 4096);
        Assert.Equal(PrefetchValueKind.Failed, value.Kind);
        Assert.Contains("larger than the 4096 byte cap", Assert.Single(value.Problems), StringComparison.Ordinal);
        Assert.Equal(1, _fhir.CountOf("Observation"));
    }

    [Fact]
    public async Task CompleteAsync_RedirectToAnotherHost_NotFollowedAndNoTokenSent()
    {
        using var other = FhirServerFake.Start();
        other.Server.Given(FhirServerFake.Search("Observation")).RespondWith(FhirServerFake.Fhir(SodiumBundle(1)));
        _fhir.Server.Given(FhirServerFake.Search("Observation"))
            .RespondWith(Response.Create().WithStatusCode(302).WithHeader("Location", other.BaseUrl + "/Observation?patient=" + FetchHarness.PatientId));
        using var harness = Harness();

        var value = await harness.FetchAsync(_fhir.BaseUrl, PrefetchKeys.Sodium);

        Assert.Equal(PrefetchValueKind.Failed, value.Kind);
        Assert.Contains("redirect (HTTP 302)", Assert.Single(value.Problems), StringComparison.Ordinal);
        Assert.Empty(other.Requests);
        Assert.Equal(1, _fhir.CountOf("Observation"));
    }

    [Fact]
    public async Task CompleteAsync_ServerNotOnTheAllowlist_NoRequestAtAll()
    {
        using var stranger = FhirServerFake.Start();
        stranger.Server.Given(FhirServerFake.Search("Observation")).RespondWith(FhirServerFake.Fhir(SodiumBundle(1)));
        using var harness = Harness();

        var values = await harness.FetchAsync(FetchHarness.Request(stranger.BaseUrl), PrefetchKeys.Sodium, PrefetchKeys.Patient);

        Assert.All(values, v => Assert.Equal(PrefetchValueKind.Failed, v.Kind));
        Assert.All(values, v => Assert.Contains("not on this service's allowlist", Assert.Single(v.Problems), StringComparison.Ordinal));
        Assert.Empty(stranger.Requests);
    }

    [Fact]
    public async Task CompleteAsync_NoAccessToken_NoRequest()
    {
        _fhir.Server.Given(FhirServerFake.Search("Observation")).RespondWith(FhirServerFake.Fhir(SodiumBundle(1)));
        using var harness = Harness();

        var value = (await harness.FetchAsync(FetchHarness.Request(_fhir.BaseUrl, token: null), PrefetchKeys.Sodium)).Single();

        Assert.Equal(PrefetchValueKind.Failed, value.Kind);
        Assert.Contains("no fhirAuthorization", Assert.Single(value.Problems), StringComparison.Ordinal);
        Assert.Empty(_fhir.Requests);
    }

    [Fact]
    public async Task CompleteAsync_ServerDown_FailsAsUnreachable()
    {
        using var harness = Harness();
        var down = FhirServerFake.DownBaseUrl();
        using var harnessForDown = new FetchHarness([down]);

        var value = await harnessForDown.FetchAsync(down, PrefetchKeys.Sodium);

        Assert.Equal(PrefetchValueKind.Failed, value.Kind);
        Assert.Contains("could not be reached", Assert.Single(value.Problems), StringComparison.Ordinal);
    }

    [Fact]
    public async Task CompleteAsync_SlowerThanTheBudget_FailsWithTheDeadline()
    {
        _fhir.Server.Given(FhirServerFake.Search("Observation")).RespondWith(FhirServerFake.Fhir(SodiumBundle(1)).WithDelay(TimeSpan.FromSeconds(2)));
        using var harness = Harness(new() { ["Natremia:Fetching:Budget"] = "00:00:00.300", ["Natremia:Fetching:AttemptTimeout"] = "00:00:03" });

        var value = await harness.FetchAsync(_fhir.BaseUrl, PrefetchKeys.Sodium);

        Assert.Equal(PrefetchValueKind.Failed, value.Kind);
        Assert.Contains("within the 300 ms time budget", Assert.Single(value.Problems), StringComparison.Ordinal);
    }

    [Fact]
    public async Task CompleteAsync_SeveralKeys_EachLoggedWithoutTokenPatientOrQuery()
    {
        _fhir.Server.Given(FhirServerFake.Search("Observation")).RespondWith(FhirServerFake.Fhir(SodiumBundle(1)));
        _fhir.Server.Given(FhirServerFake.Search("Condition")).RespondWith(FhirServerFake.Status(401));
        using var harness = Harness();

        var values = await harness.FetchAsync(FetchHarness.Request(_fhir.BaseUrl), PrefetchKeys.Sodium, PrefetchKeys.Conditions);

        Assert.Equal([PrefetchValueKind.Data, PrefetchValueKind.Failed], values.Select(v => v.Kind));
        var lines = harness.Logs.Lines.Where(l => l.Contains("FHIR fetch of", StringComparison.Ordinal)).ToList();
        Assert.Equal(2, lines.Count);
        Assert.Contains(lines, l => l.Contains("'conditions'", StringComparison.Ordinal) && l.Contains("HTTP 401", StringComparison.Ordinal));
        Assert.All(harness.Logs.Lines, l =>
        {
            Assert.DoesNotContain(FetchHarness.Token, l, StringComparison.Ordinal);
            Assert.DoesNotContain(FetchHarness.PatientId, l, StringComparison.Ordinal);
            Assert.DoesNotContain("patient=", l, StringComparison.Ordinal);
        });
        Assert.All(values.SelectMany(v => v.Problems), p => Assert.DoesNotContain(FetchHarness.Token, p, StringComparison.Ordinal));
    }

    private static async Task Eventually(Func<bool> condition)
    {
        for (var i = 0; i < 200 && !condition(); i++)
        {
            await Task.Delay(50);
        }

        Assert.True(condition());
    }
}
