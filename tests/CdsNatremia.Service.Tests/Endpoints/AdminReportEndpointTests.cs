using System.Net;
using System.Text.Json;
using CdsNatremia.Service.Tests.Support;

namespace CdsNatremia.Service.Tests.Endpoints;

/// <summary>GET /admin/reports/overrides: protected by the admin key header; numbers from real issued cards.</summary>
public sealed class AdminReportEndpointTests
{
    private const string Key = "an-admin-key-for-tests-only-0123456789";
    private const string Header = "X-Natremia-Admin-Key";
    private const string Url = "/admin/reports/overrides?from=2026-03-01&to=2026-03-10";

    private static NatremiaFactory WithKey() => NatremiaFactory.With(new() { ["Natremia:Audit:AdminApiKey"] = Key });

    private static HttpRequestMessage Get(string url, string? key)
    {
        var request = new HttpRequestMessage(HttpMethod.Get, url);
        if (key is not null)
        {
            request.Headers.Add(Header, key);
        }

        return request;
    }

    [Fact]
    public async Task NoKeyConfigured_403ForEveryone()
    {
        await using var factory = new NatremiaFactory();
        var response = await factory.CreateClient().SendAsync(Get(Url, "anything-at-all-anything-at-all-0000"));
        Assert.Equal(HttpStatusCode.Forbidden, response.StatusCode);
    }

    [Theory]
    [InlineData(null)]
    [InlineData("")]
    [InlineData("an-admin-key-for-tests-only-0123456788")]
    public async Task MissingOrWrongKey_401(string? key)
    {
        await using var factory = WithKey();
        var response = await factory.CreateClient().SendAsync(Get(Url, key));
        Assert.Equal(HttpStatusCode.Unauthorized, response.StatusCode);
        Assert.Equal(Header, response.Headers.WwwAuthenticate.ToString());
    }

    [Fact]
    public async Task RightKey_CountsFromIssuedCardsAndFeedback()
    {
        await using var factory = WithKey();
        var client = factory.CreateClient();
        var now = factory.Clock.GetUtcNow();
        var cards = new[] { await FeedbackCalls.IssueAsync(client), await FeedbackCalls.IssueAsync(client), await FeedbackCalls.IssueAsync(client) };
        await FeedbackCalls.PostAsync(client, FeedbackCalls.Body(FeedbackCalls.Overridden((string)cards[0][0]!["uuid"]!, now)));
        await FeedbackCalls.PostAsync(client, FeedbackCalls.Body(FeedbackCalls.Overridden((string)cards[1][0]!["uuid"]!, now, reason: null)));
        await FeedbackCalls.PostAsync(client, FeedbackCalls.Body(FeedbackCalls.Accepted(cards[2][0]!, now)));

        var response = await client.SendAsync(Get(Url, Key));

        Assert.Equal(HttpStatusCode.OK, response.StatusCode);
        var report = JsonDocument.Parse(await response.Content.ReadAsStringAsync()).RootElement;
        var severity = report.GetProperty("rules").EnumerateArray().Single(r => r.GetProperty("ruleId").GetString() == "sodium.severity");
        Assert.Equal(3, severity.GetProperty("shown").GetInt32());
        Assert.Equal(1, severity.GetProperty("accepted").GetInt32());
        Assert.Equal(2, severity.GetProperty("overridden").GetInt32());
        Assert.Equal(2.0 / 3, severity.GetProperty("overrideRate").GetDouble(), 6);
        Assert.Equal(2, severity.GetProperty("reasons").GetArrayLength()); // benefit-outweighs-risk, and no reason given
        Assert.Equal(10, severity.GetProperty("series").GetArrayLength()); // 1 to 10 March, both days included
    }

    [Theory]
    [InlineData("/admin/reports/overrides?to=2026-03-10", "'from' is required")]
    [InlineData("/admin/reports/overrides?from=2026-03-01", "'to' is required")]
    [InlineData("/admin/reports/overrides?from=01/03/2026&to=2026-03-10", "must be a date as YYYY-MM-DD")]
    [InlineData("/admin/reports/overrides?from=2026-03-10&to=2026-03-01", "must not be before")]
    [InlineData("/admin/reports/overrides?from=2020-01-01&to=2026-03-01", "more than 731 days")]
    [InlineData("/admin/reports/overrides?from=2026-03-01&to=2026-03-10&service=nope", "no CDS service has the id 'nope'")]
    public async Task BadQuery_400(string url, string message)
    {
        await using var factory = WithKey();
        var response = await factory.CreateClient().SendAsync(Get(url, Key));
        Assert.Equal(HttpStatusCode.BadRequest, response.StatusCode);
        Assert.Contains(message, await response.Content.ReadAsStringAsync(), StringComparison.Ordinal);
    }
}
