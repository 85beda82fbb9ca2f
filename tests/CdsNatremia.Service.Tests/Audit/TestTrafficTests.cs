using System.Net;
using System.Text;
using System.Text.Json;
using CdsNatremia.Service.Audit;
using CdsNatremia.Service.Tests.Support;

namespace CdsNatremia.Service.Tests.Audit;

/// <summary>Requests marked as test traffic are answered alike, recorded with the flag, and left out of reports unless asked.</summary>
public sealed class TestTrafficTests
{
    private const string Key = "an-admin-key-for-tests-only-0123456789";
    private static CancellationToken None => CancellationToken.None;

    [Theory]
    [InlineData("true", true)]
    [InlineData("TRUE", true)]
    [InlineData(null, false)]
    [InlineData("false", false)]
    [InlineData("yes", false)] // only the documented value marks test traffic
    public async Task HookCall_MarkerHeader_CardsFlaggedOnlyWithTheDocumentedValue(string? header, bool flagged)
    {
        await using var factory = new NatremiaFactory();
        var card = (await PostAsync(factory.CreateClient(), header))[0];

        var record = await FeedbackCalls.Store(factory).FindCardAsync(Guid.Parse(card.GetProperty("uuid").GetString()!), None);

        Assert.Equal(flagged, record!.TestTraffic);
    }

    [Fact]
    public async Task HookCall_Marked_SameCardsAsUnmarked()
    {
        await using var factory = new NatremiaFactory();
        var client = factory.CreateClient();
        var marked = await PostAsync(client, TestTraffic.Value);
        var plain = await PostAsync(client, null);
        Assert.Equal(plain.Select(c => c.GetProperty("summary").GetString()), marked.Select(c => c.GetProperty("summary").GetString()));
    }

    [Fact]
    public async Task AdminReport_TestCards_LeftOutAndCountedUnlessIncludeTest()
    {
        await using var factory = NatremiaFactory.With(new() { ["Natremia:Audit:AdminApiKey"] = Key });
        var client = factory.CreateClient();
        await PostAsync(client, null);
        await PostAsync(client, TestTraffic.Value);
        await PostAsync(client, TestTraffic.Value);

        var plain = await ReportAsync(client, string.Empty);
        var included = await ReportAsync(client, "&includeTest=true");

        Assert.Equal(1, Severity(plain).GetProperty("shown").GetInt32());
        Assert.Equal(2, plain.GetProperty("testCardsExcluded").GetInt64());
        Assert.False(plain.GetProperty("testTrafficIncluded").GetBoolean());
        Assert.Equal(3, Severity(included).GetProperty("shown").GetInt32());
        Assert.True(included.GetProperty("testTrafficIncluded").GetBoolean());
    }

    [Fact]
    public async Task AdminReport_IncludeTestNotABoolean_400()
    {
        await using var factory = NatremiaFactory.With(new() { ["Natremia:Audit:AdminApiKey"] = Key });
        using var request = new HttpRequestMessage(HttpMethod.Get, "/admin/reports/overrides?from=2026-03-01&to=2026-03-10&includeTest=maybe");
        request.Headers.Add("X-Natremia-Admin-Key", Key);
        var response = await factory.CreateClient().SendAsync(request);
        Assert.Equal(HttpStatusCode.BadRequest, response.StatusCode);
        Assert.Contains("'includeTest' must be true or false", await response.Content.ReadAsStringAsync(), StringComparison.Ordinal);
    }

    private static async Task<List<JsonElement>> PostAsync(HttpClient client, string? marker)
    {
        using var request = new HttpRequestMessage(HttpMethod.Post, "/cds-services/" + FeedbackCalls.ChartReview)
        {
            Content = new StringContent(FeedbackCalls.StaleRequest("01").ToJsonString(), Encoding.UTF8, "application/json"),
        };
        if (marker is not null)
        {
            request.Headers.Add(TestTraffic.Header, marker);
        }

        var response = await client.SendAsync(request);
        Assert.Equal(HttpStatusCode.OK, response.StatusCode);
        return [.. JsonDocument.Parse(await response.Content.ReadAsStringAsync()).RootElement.GetProperty("cards").EnumerateArray()];
    }

    private static async Task<JsonElement> ReportAsync(HttpClient client, string extra)
    {
        using var request = new HttpRequestMessage(HttpMethod.Get, "/admin/reports/overrides?from=2026-03-01&to=2026-03-10" + extra);
        request.Headers.Add("X-Natremia-Admin-Key", Key);
        var response = await client.SendAsync(request);
        Assert.Equal(HttpStatusCode.OK, response.StatusCode);
        return JsonDocument.Parse(await response.Content.ReadAsStringAsync()).RootElement;
    }

    private static JsonElement Severity(JsonElement report)
        => report.GetProperty("rules").EnumerateArray().Single(r => r.GetProperty("ruleId").GetString() == "sodium.severity");
}
