using CdsNatremia.Audit.Records;

namespace CdsNatremia.Audit.Tests.Records;

/// <summary>The feedback identity: card + outcome + outcome time (ms, UTC) + accepted suggestions (order ignored).</summary>
public sealed class FeedbackEntryTests
{
    private static readonly Guid Card = Guid.Parse("4e0a3a1e-3283-4575-ab82-028d55fe2719");
    private static readonly Guid S1 = Guid.Parse("e56e1945-20b3-4393-8503-a1a20fd73152");
    private static readonly Guid S2 = Guid.Parse("0b7c2f3d-9a41-4e1e-8b2d-5f6a7c8d9e01");
    private static readonly DateTimeOffset At = new(2026, 3, 10, 11, 58, 0, TimeSpan.Zero);

    private static FeedbackEntry Entry(params Guid[] suggestions) => new()
    {
        Card = Card, Outcome = FeedbackOutcome.Accepted, AcceptedSuggestions = suggestions, OutcomeTimestamp = At,
    };

    [Fact]
    public void IdentityKey_SameFeedbackResent_SameKey()
    {
        Assert.Equal(Entry(S1, S2).IdentityKey(), Entry(S2, S1).IdentityKey());
        Assert.Equal(Entry(S1).IdentityKey(), (Entry(S1) with { OutcomeTimestamp = At.ToOffset(TimeSpan.FromHours(2)) }).IdentityKey());
        Assert.Equal(64, Entry(S1).IdentityKey().Length); // SHA-256 as hex
    }

    [Fact]
    public void IdentityKey_AnyIdentityPartDiffers_DifferentKey()
    {
        var key = Entry(S1).IdentityKey();
        Assert.NotEqual(key, Entry(S2).IdentityKey());
        Assert.NotEqual(key, Entry(S1, S2).IdentityKey());
        Assert.NotEqual(key, (Entry(S1) with { OutcomeTimestamp = At.AddMilliseconds(1) }).IdentityKey());
        Assert.NotEqual(key, (Entry(S1) with { Card = Guid.NewGuid() }).IdentityKey());
        Assert.NotEqual(Entry().IdentityKey(), (Entry() with { Outcome = FeedbackOutcome.Overridden }).IdentityKey());
    }

    [Fact]
    public void IdentityKey_CommentOrReasonDiffers_SameKey()
        => Assert.Equal(
            (Entry() with { Outcome = FeedbackOutcome.Overridden, UserComment = "a" }).IdentityKey(),
            (Entry() with { Outcome = FeedbackOutcome.Overridden, UserComment = "b", OverrideReason = new ReasonCoding("https://x.example", "c", null) }).IdentityKey());
}
