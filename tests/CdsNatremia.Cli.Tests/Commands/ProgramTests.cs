using System.Text.Json.Nodes;
using CdsNatremia.Scenarios;

namespace CdsNatremia.Cli.Tests.Commands;

/// <summary>The command line end to end: parsing, exit codes, files written, the in-process service.</summary>
public class ProgramTests
{
    [Fact]
    public async Task ScenariosWrite_EveryScenarioAndManifest()
    {
        var folder = Path.Combine(Path.GetTempPath(), "natremia-sc-" + Guid.NewGuid().ToString("N"));
        try
        {
            Assert.Equal(ExitCodes.Ok, await Program.Main(["scenarios", "write", folder, "--as-of", "2026-06-01T00:00:00Z"]));
            var manifest = JsonNode.Parse(await File.ReadAllTextAsync(Path.Combine(folder, "manifest.json")))!;
            var scenarios = (JsonArray)manifest["scenarios"]!;
            Assert.Equal(ScenarioLibrary.All.Count, scenarios.Count); // every scenario in the library, however many
            Assert.All(scenarios, s => Assert.True(File.Exists(Path.Combine(folder, (string)s!["bundleFile"]!))));
            Assert.All(scenarios, s => Assert.False(string.IsNullOrWhiteSpace((string?)s!["clinicianExpects"])));
            // Rebased: the thiazide patient's latest sodium, 4 h 20 min before the anchor, is now 4 h 20 min before 1 June.
            Assert.Contains("2026-05-31T19:40:00Z", await File.ReadAllTextAsync(Path.Combine(folder, "01-thiazide-three-weeks.bundle.json")), StringComparison.Ordinal);
        }
        finally
        {
            Directory.Delete(folder, true);
        }
    }

    [Theory]
    [InlineData(new[] { "replay", "no-such-scenario", "--in-process" }, ExitCodes.Usage)]
    [InlineData(new[] { "load", "--concurrency", "0", "--in-process" }, ExitCodes.Usage)]
    [InlineData(new[] { "load", "--url", "http://192.0.2.10:5080", "--duration", "1" }, ExitCodes.Unreachable)]
    [InlineData(new[] { "conform", "--url", "not a url" }, ExitCodes.Usage)]
    [InlineData(new[] { "no-such-command" }, ExitCodes.Usage)]
    public async Task Main_BadInput_DocumentedExitCode(string[] args, int expected)
        => Assert.Equal(expected, await Program.Main(args));

    [Fact]
    public void Defaults_ScenariosWriteAndReplay_SameAsOf()
    {
        // Files written with the defaults and replayed with the defaults read the same dates ("now").
        Assert.Equal("now", new Cli.Commands.ScenariosWriteCommand.Settings { Folder = "x" }.AsOf);
        Assert.Equal(new Cli.Commands.ScenariosWriteCommand.Settings { Folder = "x" }.AsOf, new Cli.Commands.ReplayCommand.Settings().AsOf);
    }

    [Fact]
    public async Task Replay_InProcessAtTheAnchor_EachHookAsExpected()
    {
        // Patient-view, the result hook, a normal sodium and order-select (the order-sign scenario has a known
        // difference from its manifest: see ScenarioReplayTests.KnownDifferences).
        foreach (var id in new[] { "01", "11", "13", "17" })
        {
            Assert.Equal(ExitCodes.Ok, await Program.Main(["replay", id, "--in-process", "--as-of", "anchor", "--json"]));
        }
    }
}
