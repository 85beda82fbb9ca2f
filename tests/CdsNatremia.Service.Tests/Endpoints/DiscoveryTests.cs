using System.Text.Json.Nodes;
using CdsNatremia.Service.Tests.Support;

namespace CdsNatremia.Service.Tests.Endpoints;

public class DiscoveryTests(NatremiaFactory factory) : IClassFixture<NatremiaFactory>
{
    // CDS Hooks 2.0 discovery: each service has hook, description and id (required), title (recommended),
    // prefetch (optional map of key → template).
    [Fact]
    public async Task Discovery_EveryServiceHasTheRequiredFields()
    {
        var body = JsonNode.Parse(await factory.CreateClient().GetStringAsync("/cds-services"))!;
        var services = body["services"]!.AsArray();
        Assert.NotEmpty(services);
        foreach (var service in services)
        {
            Assert.False(string.IsNullOrWhiteSpace((string?)service!["hook"]));
            Assert.False(string.IsNullOrWhiteSpace((string?)service["description"]));
            Assert.False(string.IsNullOrWhiteSpace((string?)service["id"]));
            Assert.False(string.IsNullOrWhiteSpace((string?)service["title"]));
            foreach (var (_, template) in service["prefetch"]!.AsObject())
            {
                Assert.Contains("{{context.patientId}}", (string)template!, StringComparison.Ordinal);
            }
        }
    }

    [Fact]
    public async Task Discovery_OffersPatientViewAndTheResultHook()
    {
        var body = JsonNode.Parse(await factory.CreateClient().GetStringAsync("/cds-services"))!;
        var hooks = body["services"]!.AsArray().Select(s => (string)s!["hook"]!).ToList();
        Assert.Contains("patient-view", hooks);
        Assert.Contains(HookCalls.ResultHook, hooks); // reverse-domain noun-verb, placeholder domain
    }

    [Fact]
    public async Task Discovery_ResultHookDomainIsConfigurable()
    {
        using var custom = NatremiaFactory.With(new() { ["Natremia:ResultHookDomain"] = "org.hospital-a" });
        var body = JsonNode.Parse(await custom.CreateClient().GetStringAsync("/cds-services"))!;
        Assert.Contains(body["services"]!.AsArray(), s => (string?)s!["hook"] == "org.hospital-a.lab-result-arrive");
    }

    [Fact]
    public async Task Health_LiveAndReady()
    {
        var client = factory.CreateClient();
        Assert.True((await client.GetAsync("/healthz")).IsSuccessStatusCode);
        var ready = JsonNode.Parse(await client.GetStringAsync("/readyz"))!;
        Assert.Equal("ready", (string?)ready["status"]);
        Assert.True((int)ready["codeSets"]! > 0);
    }
}
