using CdsNatremia.Audit.Reports;
using CdsNatremia.Audit.Tests.Support;

namespace CdsNatremia.Audit.Tests.Reports;

public sealed class OverrideReportBuilderTests
{
    private static OverrideReport Build(string? service)
    {
        var (cards, feedback) = OverrideFixture.Build();
        var inRange = cards.Where(c => c.IssuedAt >= OverrideFixture.From && c.IssuedAt < OverrideFixture.To && (service is null || c.ServiceId == service)).ToList();
        var ids = inRange.Select(c => c.CardUuid).ToHashSet();
        return OverrideReportBuilder.Build(
            OverrideFixture.From,
            OverrideFixture.To,
            service,
            inRange.SelectMany(c => c.RuleIds.Select(r => new CardRuleRow(c.CardUuid, c.IssuedAt, r))),
            feedback.Where(f => ids.Contains(f.Entry.Card)).Select(f => new CardFeedbackRow(f.Entry.Card, f.Entry.Outcome, f.Entry.OverrideReason)));
    }

    [Fact]
    public void Build_HandCountedFixture_CountsPerRule() => ReportExpectations.AllServices(Build(null));

    [Fact]
    public void Build_OneService_OtherServicesCardsLeftOut() => ReportExpectations.ChartReviewOnly(Build(Some.ServiceId));

    [Theory]
    [InlineData(7, 1)]
    [InlineData(62, 1)]
    [InlineData(63, 7)]
    [InlineData(366, 7)]
    [InlineData(367, 30)]
    public void BucketDays_RangeLength_PointLength(int days, int expected)
        => Assert.Equal(expected, OverrideReportBuilder.BucketDays(OverrideFixture.From, OverrideFixture.From.AddDays(days)));

    [Fact]
    public void Build_WeeklyBuckets_LastPartialWeekKept()
    {
        var from = OverrideFixture.From;
        var report = OverrideReportBuilder.Build(from, from.AddDays(100), null,
            [new CardRuleRow(Guid.NewGuid(), from.AddDays(99.5), "sodium.severity")], []);
        var series = Assert.Single(report.Rules).Series;
        Assert.Equal(15, series.Count); // ceil(100 / 7)
        Assert.Equal(1, series[^1].Shown);
    }

    [Fact]
    public void Build_EmptyOrReversedRange_Refused()
        => Assert.Throws<ArgumentException>(() => OverrideReportBuilder.Build(OverrideFixture.To, OverrideFixture.From, null, [], []));
}
