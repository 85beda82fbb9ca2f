using WireMock.RequestBuilders;
using WireMock.ResponseBuilders;
using WireMock.Server;

namespace CdsNatremia.Cli.Tests.Commands;

/// <summary>The report command against a stand-in for the service's admin report endpoint (loopback WireMock).</summary>
public sealed class ReportCommandTests : IDisposable
{
    // A hand-made report in the endpoint's JSON shape: one rule shown 4 times, 1 accepted, 2 overridden.
    private const string ReportJson = """
        {"from":"2026-03-01T00:00:00+00:00","to":"2026-04-01T00:00:00+00:00","serviceId":null,"bucketDays":7,
         "rules":[{"ruleId":"drug.order-warning","shown":4,"accepted":1,"overridden":2,
           "reasons":[{"system":"https://cdsnatremia.example.org/fhir/CodeSystem/override-reason","code":"sodium-being-monitored","display":"Sodium is being monitored","cards":2}],
           "series":[{"start":"2026-03-01T00:00:00+00:00","shown":3,"overridden":2},{"start":"2026-03-08T00:00:00+00:00","shown":1,"overridden":0}],
           "overrideRate":0.5,"acceptanceRate":0.25}]}
        """;

    private readonly WireMockServer _server = WireMockServer.Start();
    private readonly string _chart = Path.Combine(Path.GetTempPath(), $"natremia-report-{Guid.NewGuid():N}.svg");

    public ReportCommandTests()
    {
        _server.Given(Request.Create().WithPath("/admin/reports/overrides").WithHeader("X-Natremia-Admin-Key", "right-key").UsingGet())
            .AtPriority(1)
            .RespondWith(Response.Create().WithStatusCode(200).WithHeader("Content-Type", "application/json").WithBody(ReportJson));
        _server.Given(Request.Create().WithPath("/admin/reports/overrides").UsingGet())
            .AtPriority(10)
            .RespondWith(Response.Create().WithStatusCode(401));
    }

    [Fact]
    public async Task Report_WithTheKey_ReadsTheReportAndDrawsTheChart()
    {
        var code = await Program.Main(["report", "--url", _server.Url!, "--admin-key", "right-key", "--from", "2026-03-01", "--to", "2026-03-31", "--chart", _chart]);

        Assert.Equal(ExitCodes.Ok, code);
        var sent = Assert.Single(_server.LogEntries);
        Assert.Contains("from=2026-03-01", sent.RequestMessage.Url, StringComparison.Ordinal);
        Assert.Contains("to=2026-03-31", sent.RequestMessage.Url, StringComparison.Ordinal);
        var svg = await File.ReadAllTextAsync(_chart);
        Assert.StartsWith("<svg", svg.TrimStart().Replace("<?xml version=\"1.0\" encoding=\"utf-8\"?>", string.Empty, StringComparison.Ordinal).TrimStart(), StringComparison.Ordinal);
        Assert.Contains("drug.order-warning", svg, StringComparison.Ordinal);
    }

    [Fact]
    public async Task Report_WrongKey_ServiceErrorExitCode()
        => Assert.Equal(ExitCodes.ServiceError, await Program.Main(["report", "--url", _server.Url!, "--admin-key", "wrong"]));

    [Fact]
    public async Task Report_BadDate_UsageExitCode()
        => Assert.Equal(ExitCodes.Usage, await Program.Main(["report", "--url", _server.Url!, "--admin-key", "k", "--from", "1 March"]));

    [Fact]
    public async Task Report_FromAfterTo_UsageErrorWithoutAsking()
    {
        Assert.Equal(ExitCodes.Usage, await Program.Main(["report", "--url", _server.Url!, "--admin-key", "right-key", "--from", "2026-03-31", "--to", "2026-03-01"]));
        Assert.Empty(_server.LogEntries); // refused locally, no problem JSON from the service
    }

    [Theory]
    [InlineData(false)]
    [InlineData(true)]
    public async Task Report_IncludeTest_AsksForTestTrafficOnlyWhenGiven(bool include)
    {
        string[] args = ["report", "--url", _server.Url!, "--admin-key", "right-key", "--from", "2026-03-01", "--to", "2026-03-31"];
        Assert.Equal(ExitCodes.Ok, await Program.Main(include ? [.. args, "--include-test"] : args));
        Assert.Equal(include, Assert.Single(_server.LogEntries).RequestMessage.Url.Contains("includeTest=true", StringComparison.Ordinal));
    }

    [Fact]
    public async Task Report_NonLoopbackHostWithoutAllowHost_Refused()
        => Assert.Equal(ExitCodes.Unreachable, await Program.Main(["report", "--url", "http://192.0.2.10:5080", "--admin-key", "k"]));

    public void Dispose()
    {
        _server.Stop();
        _server.Dispose();
        File.Delete(_chart);
    }
}
