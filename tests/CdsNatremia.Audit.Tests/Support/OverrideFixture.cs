using CdsNatremia.Audit.Records;

namespace CdsNatremia.Audit.Tests.Support;

/// <summary>
/// The hand-counted fixture of the override report: nine invented cards around 1–7 March 2026 and their feedback.
/// The expected numbers are counted by hand in ReportExpectations, not computed.
/// </summary>
public static class OverrideFixture
{
    public static readonly DateTimeOffset From = new(2026, 3, 1, 0, 0, 0, TimeSpan.Zero);
    public static readonly DateTimeOffset To = new(2026, 3, 8, 0, 0, 0, TimeSpan.Zero);

    public const string Benefit = "benefit-outweighs-risk";
    public const string Monitored = "sodium-being-monitored";
    public const string NotRelevant = "not-relevant-to-patient";

    public static (IReadOnlyList<IssuedCardRecord> Cards, IReadOnlyList<(string ServiceId, FeedbackEntry Entry)> Feedback) Build()
    {
        static DateTimeOffset At(int month, int day, int hour, int minute = 0) => new(2026, month, day, hour, minute, 0, TimeSpan.Zero);
        var c1 = Some.Card(issuedAt: At(3, 1, 10), rules: ["sodium.severity", "workup.tonicity"]);
        var c2 = Some.Card(issuedAt: At(3, 1, 11), rules: ["sodium.severity"]);
        var c3 = Some.Card(issuedAt: At(3, 2, 9), rules: ["sodium.severity"]);
        var c4 = Some.Card(issuedAt: At(3, 2, 10), rules: ["drug.thiazide"]);
        var c5 = Some.Card(issuedAt: At(3, 3, 10), rules: ["drug.thiazide"]);
        var c6 = Some.Card(issuedAt: At(3, 3, 12), rules: ["sodium.severity"]);
        var c7 = Some.Card(issuedAt: At(2, 28, 23, 59), rules: ["sodium.severity"]); // before the range
        var c8 = Some.Card(issuedAt: At(3, 8, 0), rules: ["sodium.severity"]); // the range's end is exclusive
        var c9 = Some.Card(issuedAt: At(3, 4, 8), rules: ["workup.tonicity"], serviceId: "natremia-order-sign");
        var chart = Some.ServiceId;
        var feedback = new List<(string, FeedbackEntry)>
        {
            (chart, Some.Accepted(c1)),
            (chart, Some.Overridden(c2, Benefit)),
            (chart, Some.Overridden(c3, Monitored, at: c3.IssuedAt.AddMinutes(1))),
            (chart, Some.Overridden(c3, Monitored, at: c3.IssuedAt.AddMinutes(9))), // same card, same reason again: counts once
            (chart, Some.Overridden(c4)), // no reason given
            (chart, Some.Overridden(c5, Benefit)),
            (chart, Some.Accepted(c5, at: c5.IssuedAt.AddHours(2))), // later accepted after all: counts in both
            (chart, Some.Overridden(c7, Benefit)),
            (chart, Some.Overridden(c8, Benefit)),
            ("natremia-order-sign", Some.Overridden(c9, NotRelevant)),
        };
        return ([c1, c2, c3, c4, c5, c6, c7, c8, c9], feedback);
    }
}
