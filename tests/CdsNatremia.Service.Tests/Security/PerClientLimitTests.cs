using System.Net;
using System.Net.Http.Headers;
using CdsNatremia.Service.Security;
using CdsNatremia.Service.Tests.Support;

namespace CdsNatremia.Service.Tests.Security;

/// <summary>
/// One client cannot lock out the others: the replay cache is partitioned per client, and calls are rate limited per
/// authenticated client (429 with Retry-After, RFC 6585 §4) while other clients go on being served.
/// </summary>
public sealed class PerClientLimitTests
{
    private const string SecondIssuer = "https://second-ehr.test.example";
    private static readonly DateTimeOffset Now = new(2026, 3, 10, 12, 0, 0, TimeSpan.Zero);

    [Fact]
    public void ReplayCache_OneClientFillsItsPartition_OtherClientStillServed()
    {
        var cache = new PartitionedReplayCache(capacityPerClient: 2);
        Assert.Equal(ReplayCheck.FirstUse, cache.TryUse("ehr-a", "1", Now.AddMinutes(5), Now));
        Assert.Equal(ReplayCheck.FirstUse, cache.TryUse("ehr-a", "2", Now.AddMinutes(5), Now));

        Assert.Equal(ReplayCheck.Full, cache.TryUse("ehr-a", "3", Now.AddMinutes(5), Now));
        Assert.Equal(ReplayCheck.FirstUse, cache.TryUse("ehr-b", "1", Now.AddMinutes(5), Now));
        Assert.Equal(ReplayCheck.Replayed, cache.TryUse("ehr-a", "1", Now.AddMinutes(5), Now));
        Assert.Equal(2, cache.CountOf("ehr-a"));
        Assert.Equal(1, cache.CountOf("ehr-b"));
    }

    [Fact]
    public async Task RateLimit_ClientBeyondItsBurst_429WithRetryAfter_OtherClientServed()
    {
        using var first = new TestClientKeys();
        using var second = new TestClientKeys();
        var settings = first.InlineSettings();
        settings["Natremia:Authentication:TrustedClients:1:Issuer"] = SecondIssuer;
        settings["Natremia:Authentication:TrustedClients:1:Jwks"] = second.PublicJwks();
        settings["Natremia:RateLimiting:TokenLimit"] = "3";
        settings["Natremia:RateLimiting:TokensPerPeriod"] = "1";
        settings["Natremia:RateLimiting:ReplenishmentPeriodSeconds"] = "3600"; // no refill while the test runs
        using var host = new SecuredHost(settings);
        var client = host.CreateClient();
        var now = host.Clock.GetUtcNow();

        var firstFour = new List<HttpResponseMessage>();
        for (var i = 0; i < 4; i++)
        {
            firstFour.Add(await client.SendAsync(Discovery(first.Token("/cds-services", now))));
        }

        var secondClient = await client.SendAsync(Discovery(second.Token("/cds-services", now, t => t.Issuer = SecondIssuer)));

        Assert.Equal([HttpStatusCode.OK, HttpStatusCode.OK, HttpStatusCode.OK, HttpStatusCode.TooManyRequests], firstFour.Select(r => r.StatusCode));
        var retryAfter = firstFour[3].Headers.RetryAfter?.Delta;
        Assert.NotNull(retryAfter);
        Assert.InRange(retryAfter.Value.TotalSeconds, 1, 3600);
        Assert.Contains("Too many requests", await firstFour[3].Content.ReadAsStringAsync(), StringComparison.Ordinal);
        Assert.Equal(HttpStatusCode.OK, secondClient.StatusCode);
    }

    [Fact]
    public async Task RateLimit_RefusedToken_NotCountedAgainstTheClient()
    {
        // Unauthenticated or refused calls are answered 401 before the limiter: nobody can use up a client's calls.
        using var keys = new TestClientKeys();
        var settings = keys.InlineSettings();
        settings["Natremia:RateLimiting:TokenLimit"] = "2";
        settings["Natremia:RateLimiting:TokensPerPeriod"] = "1";
        settings["Natremia:RateLimiting:ReplenishmentPeriodSeconds"] = "3600";
        using var host = new SecuredHost(settings);
        var client = host.CreateClient();
        var now = host.Clock.GetUtcNow();
        for (var i = 0; i < 5; i++)
        {
            Assert.Equal(HttpStatusCode.Unauthorized, (await client.SendAsync(Discovery(keys.Token("/cds-services/other", now)))).StatusCode);
        }

        Assert.Equal(HttpStatusCode.OK, (await client.SendAsync(Discovery(keys.Token("/cds-services", now)))).StatusCode);
        Assert.Equal(HttpStatusCode.OK, (await client.SendAsync(Discovery(keys.Token("/cds-services", now)))).StatusCode);
        Assert.Equal(HttpStatusCode.TooManyRequests, (await client.SendAsync(Discovery(keys.Token("/cds-services", now)))).StatusCode);
    }

    private static HttpRequestMessage Discovery(string token)
    {
        var request = new HttpRequestMessage(HttpMethod.Get, "/cds-services");
        request.Headers.Authorization = new AuthenticationHeaderValue("Bearer", token);
        return request;
    }
}
