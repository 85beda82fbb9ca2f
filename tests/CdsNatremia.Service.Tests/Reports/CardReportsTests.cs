using CdsNatremia.Service.Reports;
using Microsoft.Extensions.Options;
using Microsoft.Extensions.Time.Testing;

namespace CdsNatremia.Service.Tests.Reports;

/// <summary>The in-memory store of full reports: kept compressed, given back exactly, gone after its hours.</summary>
public class CardReportsTests
{
    private static readonly DateTimeOffset Start = new(2026, 3, 10, 8, 0, 0, TimeSpan.Zero);

    [Theory]
    [InlineData("")]
    [InlineData("# Sodium 124 mmol/L — profound\n\n- Correction ≤ 8 mmol/L in 24 h; µmol/L and “quotes” kept\n")]
    public void Keep_ThenFind_ExactlyTheTextKept(string markdown)
    {
        var clock = new FakeTimeProvider(Start);
        using var reports = new CardReports(Options.Create(new ReportOptions()), clock);
        var id = CardReports.NewId();

        reports.Keep(id, markdown);

        Assert.Equal(markdown, reports.Find(id));
        Assert.Null(reports.Find(CardReports.NewId()));
    }

    [Fact]
    public void Keep_ALongReport_SameTextBackAfterItsHoursGone()
    {
        var clock = new FakeTimeProvider(Start);
        using var reports = new CardReports(Options.Create(new ReportOptions { KeepHours = 2 }), clock);
        var markdown = string.Concat(Enumerable.Range(0, 400).Select(i => $"- Serum sodium {120 + (i % 15)} mmol/L at day {i / 24} hour {i % 24} (Observation/na-{i})\n"));
        var id = CardReports.NewId();

        reports.Keep(id, markdown);
        Assert.Equal(markdown, reports.Find(id));

        clock.Advance(TimeSpan.FromHours(2) + TimeSpan.FromSeconds(1));
        Assert.Null(reports.Find(id));
    }
}
