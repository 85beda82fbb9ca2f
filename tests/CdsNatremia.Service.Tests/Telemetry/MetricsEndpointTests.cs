using System.Net;
using System.Net.Http.Headers;
using CdsNatremia.Scenarios;
using CdsNatremia.Service.Tests.Support;

namespace CdsNatremia.Service.Tests.Telemetry;

/// <summary>The Prometheus scrape endpoint: guarded by the admin key like the admin report, and showing the service's metrics.</summary>
[Collection(TelemetryCollection.Name)]
public sealed class MetricsEndpointTests
{
    private const string Key = "an-admin-key-for-metrics-tests-0123456789";

    [Fact]
    public async Task Scrape_AfterReplayingEveryScenario_ShowsAnswersCardsRulesAndAuditMetrics()
    {
        await using var factory = NatremiaFactory.With(new() { ["Natremia:Audit:AdminApiKey"] = Key });
        var client = factory.CreateClient();
        foreach (var scenario in ScenarioLibrary.All)
        {
            await HookCalls.RunAsync(client, scenario);
        }

        var request = new HttpRequestMessage(HttpMethod.Get, "/metrics");
        request.Headers.Add("X-Natremia-Admin-Key", Key);
        var response = await client.SendAsync(request);
        var text = await response.Content.ReadAsStringAsync();

        Assert.Equal(HttpStatusCode.OK, response.StatusCode);
        Assert.StartsWith("text/plain", response.Content.Headers.ContentType?.MediaType, StringComparison.Ordinal);
        var lines = text.Split('\n');
        Assert.Contains(lines, l => l.StartsWith("natremia_answers_total{", StringComparison.Ordinal)
            && l.Contains("natremia_service=\"natremia-chart-review\"", StringComparison.Ordinal) && l.Contains("http_response_status_code=\"200\"", StringComparison.Ordinal));
        Assert.Contains(lines, l => l.StartsWith("natremia_cards_total{", StringComparison.Ordinal) && l.Contains("natremia_card_topic=\"sodium-assessment\"", StringComparison.Ordinal));
        Assert.Contains("natremia_rules_duration_seconds_bucket", text, StringComparison.Ordinal);
        Assert.Contains("natremia_audit_write_duration_seconds_bucket", text, StringComparison.Ordinal);
        Assert.Contains("http_server_request_duration_seconds", text, StringComparison.Ordinal);
    }

    [Fact]
    public async Task Scrape_BearerAdminKey_Answers200()
    {
        await using var factory = NatremiaFactory.With(new() { ["Natremia:Audit:AdminApiKey"] = Key });
        var request = new HttpRequestMessage(HttpMethod.Get, "/metrics");
        request.Headers.Authorization = new AuthenticationHeaderValue("Bearer", Key);
        Assert.Equal(HttpStatusCode.OK, (await factory.CreateClient().SendAsync(request)).StatusCode);
    }

    [Fact]
    public async Task Scrape_NoAdminKeyConfigured_403ForEveryone()
    {
        await using var factory = new NatremiaFactory();
        var request = new HttpRequestMessage(HttpMethod.Get, "/metrics");
        request.Headers.Add("X-Natremia-Admin-Key", Key);
        var response = await factory.CreateClient().SendAsync(request);
        Assert.Equal(HttpStatusCode.Forbidden, response.StatusCode);
        Assert.DoesNotContain("natremia_", await response.Content.ReadAsStringAsync(), StringComparison.Ordinal);
    }

    [Theory]
    [InlineData(null)]
    [InlineData("an-admin-key-for-metrics-tests-0123456788")]
    public async Task Scrape_MissingOrWrongKey_401WithChallenge(string? sent)
    {
        await using var factory = NatremiaFactory.With(new() { ["Natremia:Audit:AdminApiKey"] = Key });
        var request = new HttpRequestMessage(HttpMethod.Get, "/metrics");
        if (sent is not null)
        {
            request.Headers.Add("X-Natremia-Admin-Key", sent);
        }

        var response = await factory.CreateClient().SendAsync(request);
        Assert.Equal(HttpStatusCode.Unauthorized, response.StatusCode);
        Assert.Equal("X-Natremia-Admin-Key", response.Headers.WwwAuthenticate.ToString());
    }

    [Fact]
    public async Task Scrape_ConfiguredPathAndOtherPort_NotServedOnTheServicePort()
    {
        // The in-memory server's connections have local port 0, never the configured metrics port.
        await using var factory = NatremiaFactory.With(new()
        {
            ["Natremia:Audit:AdminApiKey"] = Key, ["Natremia:Telemetry:MetricsPath"] = "/internal/metrics", ["Natremia:Telemetry:MetricsPort"] = "9464",
        });
        var request = new HttpRequestMessage(HttpMethod.Get, "/internal/metrics");
        request.Headers.Add("X-Natremia-Admin-Key", Key);
        Assert.Equal(HttpStatusCode.NotFound, (await factory.CreateClient().SendAsync(request)).StatusCode);
    }

    [Fact]
    public async Task Scrape_ConfiguredPath_ServedThereAndNotAtTheDefault()
    {
        await using var factory = NatremiaFactory.With(new() { ["Natremia:Audit:AdminApiKey"] = Key, ["Natremia:Telemetry:MetricsPath"] = "/internal/metrics" });
        var client = factory.CreateClient();
        var moved = new HttpRequestMessage(HttpMethod.Get, "/internal/metrics");
        moved.Headers.Add("X-Natremia-Admin-Key", Key);
        var old = new HttpRequestMessage(HttpMethod.Get, "/metrics");
        old.Headers.Add("X-Natremia-Admin-Key", Key);
        Assert.Equal(HttpStatusCode.OK, (await client.SendAsync(moved)).StatusCode);
        Assert.Equal(HttpStatusCode.NotFound, (await client.SendAsync(old)).StatusCode);
    }
}
