using CdsNatremia.Service.Security;

namespace CdsNatremia.Service.Tests.Security;

public class TokenReplayCacheTests
{
    private static readonly DateTimeOffset Now = new(2026, 3, 10, 12, 0, 0, TimeSpan.Zero);

    [Fact]
    public void TryUse_SecondUseBeforeExpiry_Replayed()
    {
        var cache = new TokenReplayCache(10);
        Assert.Equal(ReplayCheck.FirstUse, cache.TryUse("iss", "a", Now.AddMinutes(5), Now));
        Assert.Equal(ReplayCheck.Replayed, cache.TryUse("iss", "a", Now.AddMinutes(5), Now.AddMinutes(4)));
    }

    [Fact]
    public void TryUse_SameJtiOtherIssuer_FirstUse()
    {
        var cache = new TokenReplayCache(10);
        Assert.Equal(ReplayCheck.FirstUse, cache.TryUse("ehr-a", "a", Now.AddMinutes(5), Now));
        Assert.Equal(ReplayCheck.FirstUse, cache.TryUse("ehr-b", "a", Now.AddMinutes(5), Now));
    }

    [Fact]
    public void TryUse_AfterExpiry_ForgottenAndMemoryReturned()
    {
        var cache = new TokenReplayCache(10);
        cache.TryUse("iss", "a", Now.AddMinutes(5), Now);
        cache.TryUse("iss", "b", Now.AddMinutes(6), Now);
        Assert.Equal(ReplayCheck.FirstUse, cache.TryUse("iss", "c", Now.AddMinutes(7), Now.AddMinutes(5)));
        Assert.Equal(2, cache.Count); // a dropped at its expiry; b and c held
    }

    [Fact]
    public void TryUse_FullOfUnexpiredIds_RefusesRatherThanForgets()
    {
        var cache = new TokenReplayCache(3);
        for (var i = 0; i < 3; i++)
        {
            Assert.Equal(ReplayCheck.FirstUse, cache.TryUse("iss", $"id-{i}", Now.AddMinutes(5), Now));
        }

        Assert.Equal(ReplayCheck.Full, cache.TryUse("iss", "id-3", Now.AddMinutes(5), Now));
        Assert.Equal(ReplayCheck.Replayed, cache.TryUse("iss", "id-0", Now.AddMinutes(5), Now)); // still remembered
        Assert.Equal(ReplayCheck.FirstUse, cache.TryUse("iss", "id-3", Now.AddMinutes(10), Now.AddMinutes(5)));
    }

    [Fact]
    public void TryUse_ManyThreadsSameJti_ExactlyOneFirstUse()
    {
        var cache = new TokenReplayCache(1000);
        var outcomes = new System.Collections.Concurrent.ConcurrentBag<ReplayCheck>();
        Parallel.For(0, 200, _ => outcomes.Add(cache.TryUse("iss", "same", Now.AddMinutes(5), Now)));
        Assert.Equal(1, outcomes.Count(o => o == ReplayCheck.FirstUse));
        Assert.Equal(199, outcomes.Count(o => o == ReplayCheck.Replayed));
    }
}
