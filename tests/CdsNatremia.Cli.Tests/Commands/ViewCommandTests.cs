using System.Text.RegularExpressions;
using CdsNatremia.Cli.Commands;
using CdsNatremia.Cli.Replay;
using CdsNatremia.Scenarios;

namespace CdsNatremia.Cli.Tests.Commands;

public class ViewCommandTests
{
    [Fact]
    public async Task RenderAsync_ScenarioOneAtItsAnchor_PageWithItsSodiumLimitAndDrug()
    {
        var input = ReplayInput.FromScenario(ScenarioLibrary.Find("01")!, TimeSpan.Zero);
        var html = await ViewCommand.RenderAsync(input, ScenarioLibrary.Anchor, "UTC", CancellationToken.None);

        var values = Regex.Matches(html, "<tr data-kind=\"measured\" data-value=\"([0-9.]+)\"").Select(m => m.Groups[1].Value).ToList();
        Assert.Equal(["138", "124"], values);
        // 2014 European guideline (Spasovski et al. 2014; reference sheet, secondary): first-24-h limit nadir + 10 = 134.
        Assert.Contains("data-kind=\"first-day-limit\" data-value=\"134\"", html, StringComparison.Ordinal);
        Assert.Contains("data-name=\"hydrochlorothiazide\" data-start=\"2026-02-17T00:00:00.0000000+00:00\"", html, StringComparison.Ordinal);
        Assert.Contains("<style>", html, StringComparison.Ordinal);
        Assert.DoesNotContain("<script", html, StringComparison.OrdinalIgnoreCase);
        Assert.Contains("Full report", html, StringComparison.Ordinal);
    }

    [Fact]
    public async Task RenderAsync_DisplayZoneBerlin_TimesShownWithTheirOffset()
    {
        var input = ReplayInput.FromScenario(ScenarioLibrary.Find("01")!, TimeSpan.Zero);
        var html = await ViewCommand.RenderAsync(input, ScenarioLibrary.Anchor, "Europe/Berlin", CancellationToken.None);
        // Scenario 01's latest sodium was taken 2026-03-10 07:40 UTC, which is 08:40 in Berlin (UTC+01:00 in March).
        Assert.Contains("2026-03-10 08:40 (UTC+01:00)", html, StringComparison.Ordinal);
        Assert.Contains("times in Europe/Berlin", html, StringComparison.Ordinal);
    }
}
