using System.Net;
using System.Net.Sockets;
using CdsNatremia.Cli.Conformance;
using CdsNatremia.Cli.Tests.Support;
using WireMock.Matchers;
using WireMock.RequestBuilders;
using WireMock.ResponseBuilders;
using WireMock.Server;
using WireMock.Settings;

namespace CdsNatremia.Cli.Tests.Conformance;

/// <summary>The conformance checker against the real service (passes) and a deliberately broken one (each planted violation found).</summary>
public class ConformanceCheckerTests(NatremiaFactory factory) : IClassFixture<NatremiaFactory>
{
    // Discovery with one service missing its description and a duplicated id (CDS Hooks 2.0 "Discovery").
    private const string BrokenDiscovery = """
        {"services":[
          {"hook":"patient-view","id":"broken","title":"Broken","prefetch":{"patient":"Patient/{{context.patientId}}"}},
          {"hook":"order-sign","id":"broken","description":"Same id again","prefetch":{"patient":"Patient/{{context.patientId}}"}}
        ]}
        """;

    // Cards that each break rules of CDS Hooks 2.0 "CDS Service Response" (Card, Suggestion, Action, Coding).
    private const string BrokenCards = """
        {"cards":[
          {"uuid":"dup","summary":"This summary is far too long for a card: the standard asks for fewer than one hundred and forty characters, and this sentence keeps going well past that.",
           "indicator":"urgent","source":{"label":"Broken","topic":{"code":"no-system"}},
           "suggestions":[
             {"label":"Do it","actions":[{"type":"create","description":"no resource"},{"type":"delete","description":"no id"},{"type":"remove","description":"bad type"},{"type":"update","resource":{"resourceType":"Task"}}]},
             {"uuid":"s1","actions":[]}
           ]},
          {"uuid":"dup","indicator":"info","detail":"","selectionBehavior":"any",
           "overrideReasons":[{"system":"urn:x","code":"r1"}],
           "links":[{"label":"l","url":"not a url","type":"absolute"}]}
        ]}
        """;

    [Fact]
    public async Task Run_AgainstTheService_NoViolation()
    {
        var report = await ConformanceChecker.RunAsync(factory.CreateClient(), Inputs.AllScenarios(), null, CancellationToken.None);
        Assert.True(report.Passed, string.Join("\n", report.Violations.Select(v => $"{v.Rule} {v.Where} {v.Found}")));
        Assert.Equal(4, report.ServicesChecked);
        Assert.True(report.RequestsSent >= 24 + 4);
        // The evidence: every rule listed with what was checked; the scenario set exercises all but links.
        Assert.Equal(ConformanceRules.Text.Keys, report.Rules.Select(r => r.Rule));
        Assert.All(report.Rules.Where(r => r.Rule != "link.fields"), r => Assert.True(r.Result == "pass" && r.Checks > 0, $"{r.Rule}: {r.Result}, {r.Checks} checks"));
        Assert.Equal(report.RequestsSent, report.Rules.Single(r => r.Rule == "response.status").Checks + report.Rules.Single(r => r.Rule == "prefetch.412").Checks);
    }

    [Fact]
    public async Task Run_AgainstABrokenService_FindsEveryPlantedViolation()
    {
        var port = FreePort();
        using var server = WireMockServer.Start(new WireMockServerSettings { Urls = [$"http://127.0.0.1:{port}"] });
        server.Given(Request.Create().WithPath("/cds-services").UsingGet())
            .RespondWith(Response.Create().WithStatusCode(200).WithHeader("Content-Type", "application/json").WithBody(BrokenDiscovery));
        server.Given(Request.Create().WithPath("/cds-services/broken").UsingPost().WithBody(new JsonPathMatcher("$.prefetch")))
            .AtPriority(1)
            .RespondWith(Response.Create().WithStatusCode(200).WithHeader("Content-Type", "application/json").WithBody(BrokenCards));
        // Without prefetch and without fhirServer it answers 200 instead of 412.
        server.Given(Request.Create().WithPath("/cds-services/broken").UsingPost())
            .AtPriority(10)
            .RespondWith(Response.Create().WithStatusCode(200).WithHeader("Content-Type", "application/json").WithBody("""{"cards":[]}"""));

        using var client = new HttpClient { BaseAddress = new Uri(server.Url! + "/") };
        var inputs = new[] { Inputs.Scenario("01"), Inputs.Scenario("16") };
        var report = await ConformanceChecker.RunAsync(client, inputs, null, CancellationToken.None);

        var rules = report.Violations.Select(v => v.Rule).ToHashSet();
        string[] planted =
        [
            "discovery.service.required", "discovery.service.id-unique",
            "card.summary.length", "card.summary.required", "card.indicator.value", "card.source.label", "coding.system-code",
            "card.uuid.unique", "card.selectionBehavior", "suggestion.label", "action.resource", "action.resourceId",
            "action.type", "action.description", "overrideReason.display", "link.fields", "response.empty-values", "prefetch.412",
        ];
        Assert.All(planted, rule => Assert.Contains(rule, rules));
        Assert.All(report.Rules.Where(r => planted.Contains(r.Rule)), r => Assert.Equal("fail", r.Result));
        Assert.All(report.Rules, r => Assert.True(r.Violations <= r.Checks, $"{r.Rule}: {r.Violations} violations in {r.Checks} checks"));
        Assert.False(report.Passed);
        Assert.All(report.Violations, v => Assert.Equal(ConformanceRules.Text[v.Rule], v.Requirement));
    }

    private static int FreePort()
    {
        using var probe = new TcpListener(IPAddress.Loopback, 0);
        probe.Start();
        return ((IPEndPoint)probe.LocalEndpoint).Port;
    }
}
