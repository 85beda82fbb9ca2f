using CdsNatremia.Audit.Reports;

namespace CdsNatremia.Audit.Tests.Support;

/// <summary>The override report's numbers for <see cref="OverrideFixture"/>, counted by hand from its cards.</summary>
public static class ReportExpectations
{
    public static void AllServices(OverrideReport report)
    {
        Assert.Equal(1, report.BucketDays); // 7 days → daily points
        Assert.Equal(["drug.thiazide", "sodium.severity", "workup.tonicity"], report.Rules.Select(r => r.RuleId));

        // drug.thiazide: c4 (overridden, no reason), c5 (overridden for benefit, later accepted).
        var thiazide = report.Rules[0];
        Assert.Equal((2, 1, 2), (thiazide.Shown, thiazide.Accepted, thiazide.Overridden));
        Assert.Equal(1.0, thiazide.OverrideRate);
        Assert.Equal(2, thiazide.Reasons.Count);
        Assert.Contains(thiazide.Reasons, r => r.Code == OverrideFixture.Benefit && r.Cards == 1);
        Assert.Contains(thiazide.Reasons, r => r.Code is null && r.System is null && r.Cards == 1);

        // sodium.severity: c1 (accepted), c2 (benefit), c3 (monitored, twice), c6 (no feedback); c7 and c8 outside.
        var severity = report.Rules[1];
        Assert.Equal((4, 1, 2), (severity.Shown, severity.Accepted, severity.Overridden));
        Assert.Equal(0.5, severity.OverrideRate);
        Assert.Equal(0.25, severity.AcceptanceRate);
        Assert.Equal(2, severity.Reasons.Count);
        Assert.All(severity.Reasons, r => Assert.Equal(1, r.Cards));
        Assert.Equal(7, severity.Series.Count);
        Assert.Equal((2, 1), (severity.Series[0].Shown, severity.Series[0].Overridden)); // 1 March: c1, c2
        Assert.Equal((1, 1), (severity.Series[1].Shown, severity.Series[1].Overridden)); // 2 March: c3
        Assert.Equal((1, 0), (severity.Series[2].Shown, severity.Series[2].Overridden)); // 3 March: c6
        Assert.All(severity.Series.Skip(3), p => Assert.Equal(0, p.Shown));
        Assert.Equal(new DateTimeOffset(2026, 3, 2, 0, 0, 0, TimeSpan.Zero), severity.Series[1].Start);

        // workup.tonicity: c1 (accepted) and c9 (other service, not relevant).
        var tonicity = report.Rules[2];
        Assert.Equal((2, 1, 1), (tonicity.Shown, tonicity.Accepted, tonicity.Overridden));
        Assert.Equal(OverrideFixture.NotRelevant, Assert.Single(tonicity.Reasons).Code);
    }

    public static void ChartReviewOnly(OverrideReport report)
    {
        Assert.Equal(Some.ServiceId, report.ServiceId);
        var tonicity = Assert.Single(report.Rules, r => r.RuleId == "workup.tonicity");
        Assert.Equal((1, 1, 0), (tonicity.Shown, tonicity.Accepted, tonicity.Overridden)); // c9 belongs to order-sign
        Assert.Empty(tonicity.Reasons);
        Assert.Null(new RuleOverrides("none", 0, 0, 0, [], []).OverrideRate);
    }
}
