using System.Net;
using System.Net.Sockets;
using System.Text.Json;
using CdsNatremia.Cli.Replay;
using CdsNatremia.Cli.Tests.Support;
using CdsNatremia.Scenarios;
using WireMock.RequestBuilders;
using WireMock.ResponseBuilders;
using WireMock.Server;
using WireMock.Settings;

namespace CdsNatremia.Cli.Tests.Replay;

/// <summary>
/// Replay compares every field of the manifest: a fake service that states every field as the manifest expects passes,
/// and the same fake with any one field wrong is reported on that field.
/// </summary>
public class ManifestComparisonTests
{
    /// <summary>Every (scenario, field) the manifest holds that can be compared (prose and card content of no-card scenarios cannot).</summary>
    public static TheoryData<string, string> ComparableFields()
    {
        var data = new TheoryData<string, string>();
        foreach (var scenario in ScenarioLibrary.All)
        {
            foreach (var field in scenario.Expect.EnumerateObject().Select(p => p.Name))
            {
                if (field != ManifestFields.ClinicianExpects && (scenario.ExpectsCard || field == ManifestFields.Card))
                {
                    data.Add(scenario.Id, field);
                }
            }
        }

        return data;
    }

    [Fact]
    public void Compare_FakeStatingEveryFieldAsExpected_EveryScenarioPasses()
    {
        foreach (var scenario in ScenarioLibrary.All)
        {
            var rows = ScenarioExpectation.Compare(scenario, Result(scenario, ManifestAnswers.Answer(scenario)));
            Assert.All(rows, r => Assert.True(r.Result != FieldResult.Fail, $"{r.Scenario} {r.Field}: expected {r.Expected}, seen {r.Seen}"));
            // One row per manifest field: none is passed over.
            Assert.Equal(scenario.Expect.EnumerateObject().Select(p => p.Name), rows.Select(r => r.Field));
        }
    }

    [Theory]
    [MemberData(nameof(ComparableFields))]
    public void Compare_OneFieldWrong_ThatFieldFails(string scenarioId, string field)
    {
        var scenario = ScenarioLibrary.Find(scenarioId)!;
        var rows = ScenarioExpectation.Compare(scenario, Result(scenario, ManifestAnswers.Answer(scenario, wrongField: field)));
        var failed = rows.Where(r => r.Result == FieldResult.Fail).Select(r => r.Field).ToList();
        Assert.Contains(field, failed);
        if (field is not (ManifestFields.Card or "mentions"))
        {
            // The others still read as expected (a missing mention may also remove words another field is stated in).
            Assert.Equal([field], failed);
        }
    }

    [Fact]
    public void Compare_FieldsNoComparisonNames_ComparedByTheirValue()
    {
        var scenario = Synthetic("""{"card": true, "indicator": "info", "newWord": "zebra", "newNumber": 42.5, "newList": ["a1", "b2"], "newFlag": true}""");
        var answer = JsonSerializer.SerializeToNode(new
        {
            cards = new[] { new { summary = "s", indicator = "info", detail = "zebra seen; 42.5 mmol/L; a1 and b2.", source = new { label = "x", topic = new { system = "s", code = "sodium-assessment" } } } },
        })!.AsObject();

        var rows = ScenarioExpectation.Compare(scenario, Result(scenario, answer)).ToDictionary(r => r.Field);

        Assert.Equal(FieldResult.Pass, rows["newWord"].Result);
        Assert.Equal(FieldResult.Pass, rows["newNumber"].Result);
        Assert.Equal(FieldResult.Pass, rows["newList"].Result);
        Assert.Equal(FieldResult.Fail, rows["newFlag"].Result); // a yes/no field needs a comparison of its own
        Assert.Contains("no comparison", rows["newFlag"].Seen, StringComparison.Ordinal);

        answer["cards"]![0]!["detail"] = "42.25 and 142.5, a1 only";
        rows = ScenarioExpectation.Compare(scenario, Result(scenario, answer)).ToDictionary(r => r.Field);
        Assert.Equal("not in the cards: zebra", rows["newWord"].Seen);
        Assert.Equal("not in the cards: 42.5", rows["newNumber"].Seen); // 42.5 is not in 42.25 or 142.5
        Assert.Equal("not in the cards: b2", rows["newList"].Seen);
    }

    [Fact]
    public void Compare_Http412_EveryFieldFails()
    {
        var scenario = ScenarioLibrary.Find("01")!;
        var rows = ScenarioExpectation.Compare(scenario, new ReplayResult(scenario.Id, "svc", 412, null, []));
        Assert.All(rows.Where(r => r.Field != ManifestFields.ClinicianExpects), r => Assert.Equal(FieldResult.Fail, r.Result));
    }

    [Theory]
    [InlineData(null, ExitCodes.Ok)]
    [InlineData("mentions", ExitCodes.Failure)]
    [InlineData("latestValidSodium", ExitCodes.Failure)]
    [InlineData("tonicity", ExitCodes.Failure)]
    public async Task ReplayCommand_FakeServiceOverHttp_ExitCodeFollowsTheComparison(string? wrongField, int expected)
    {
        var scenario = ScenarioLibrary.Find("07")!;
        using var server = WireMockServer.Start(new WireMockServerSettings { Urls = [$"http://127.0.0.1:{FreePort()}"] });
        server.Given(Request.Create().WithPath("/cds-services").UsingGet())
            .RespondWith(Response.Create().WithStatusCode(200).WithHeader("Content-Type", "application/json")
                .WithBody("""{"services":[{"id":"fake","hook":"patient-view","description":"d"}]}"""));
        server.Given(Request.Create().WithPath("/cds-services/fake").UsingPost())
            .RespondWith(Response.Create().WithStatusCode(200).WithHeader("Content-Type", "application/json")
                .WithBody(ManifestAnswers.Answer(scenario, wrongField).ToJsonString()));

        Assert.Equal(expected, await Program.Main(["replay", "07", "--url", server.Url!, "--as-of", "anchor", "--json"]));
    }

    private static ReplayResult Result(Scenario scenario, System.Text.Json.Nodes.JsonObject answer) => new(scenario.Id, "fake", 200, answer, []);

    private static Scenario Synthetic(string expect) => new()
    {
        Id = "99-synthetic",
        Title = "t",
        Story = "s",
        PatientId = "p",
        Hook = "patient-view",
        BundleJson = """{"resourceType":"Bundle","type":"collection"}""",
        Expect = JsonDocument.Parse(expect).RootElement.Clone(),
    };

    private static int FreePort()
    {
        using var probe = new TcpListener(IPAddress.Loopback, 0);
        probe.Start();
        return ((IPEndPoint)probe.LocalEndpoint).Port;
    }
}
