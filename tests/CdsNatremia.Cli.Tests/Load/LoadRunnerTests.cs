using CdsNatremia.Cli.Hosting;
using CdsNatremia.Cli.Load;
using CdsNatremia.Cli.Replay;
using CdsNatremia.Cli.Tests.Support;
using CdsNatremia.Scenarios;

namespace CdsNatremia.Cli.Tests.Load;

public class LoadRunnerTests(NatremiaFactory factory) : IClassFixture<NatremiaFactory>
{
    [Fact]
    public async Task Run_ScenarioSetForThreeSeconds_NoErrorAndOrderedPercentiles()
    {
        var client = factory.CreateClient();
        var services = await Discovery.GetAsync(client, CancellationToken.None);
        var requests = LoadRequests.FromInputs(services, Inputs.AllScenarios());
        var plan = new LoadPlan { Concurrency = 4, Duration = TimeSpan.FromSeconds(3) };

        var report = await LoadRunner.RunAsync(client, requests, plan, null, CancellationToken.None);

        Assert.Equal(0, report.Errors);
        Assert.Empty(report.ErrorsByKind);
        Assert.True(report.Requests > 0);
        Assert.Equal(report.Requests, report.Succeeded);
        var l = report.Latency;
        Assert.True(l.P50 <= l.P90 && l.P90 <= l.P99 && l.P99 <= l.Max);
    }

    [Fact]
    public async Task Run_RequestCount_StopsAtTheCount()
    {
        var client = factory.CreateClient();
        var services = await Discovery.GetAsync(client, CancellationToken.None);
        var requests = LoadRequests.FromPopulation(services, seed: 3, count: 5, ScenarioLibrary.Anchor);
        var report = await LoadRunner.RunAsync(client, requests, new LoadPlan { Concurrency = 3, Requests = 17, Duration = TimeSpan.FromSeconds(60) }, null, CancellationToken.None);
        Assert.Equal(17, report.Requests);
        Assert.Equal(0, report.Errors);
    }

    [Theory]
    [InlineData(0, 30, null)]
    [InlineData(257, 30, null)]
    [InlineData(4, 601, null)]
    [InlineData(4, 30, 0)]
    public void Validate_OutOfBounds_Refused(int concurrency, int seconds, int? requests)
        => Assert.Throws<ToolException>(() => new LoadPlan { Concurrency = concurrency, Duration = TimeSpan.FromSeconds(seconds), Requests = requests }.Validate());

    [Fact]
    public void LatencySummary_NearestRank_WorkedExample()
    {
        // Nearest-rank percentiles of {15, 20, 35, 40, 50}: 30th → 20, 40th → 20, 50th → 35, 100th → 50
        // (the worked example of the nearest-rank method, "Percentile" in standard statistics references; from memory).
        double[] sorted = [15, 20, 35, 40, 50];
        Assert.Equal(20, LatencySummary.Rank(sorted, 30));
        Assert.Equal(20, LatencySummary.Rank(sorted, 40));
        Assert.Equal(35, LatencySummary.Rank(sorted, 50));
        Assert.Equal(50, LatencySummary.Rank(sorted, 100));
    }

    [Theory]
    [InlineData("http://127.0.0.1:5080/", true)]
    [InlineData("http://localhost:5080/", true)]
    [InlineData("http://[::1]:5080/", true)]
    [InlineData("http://127.8.0.1/", true)]
    [InlineData("https://cds.example.org/", false)]
    [InlineData("http://10.0.0.5/", false)]
    public void HostPolicy_OnlyLoopbackWithoutAllowHost(string url, bool allowed)
        => Assert.Equal(allowed, HostPolicy.IsAllowed(new Uri(url), []));

    [Fact]
    public void HostPolicy_NamedHost_Allowed()
    {
        Assert.True(HostPolicy.IsAllowed(new Uri("https://cds.example.org/"), ["CDS.example.org"]));
        Assert.Throws<ToolException>(() => HostPolicy.Require(new Uri("https://cds.example.org/"), ["other.example.org"]));
    }
}
