using System.Net;
using System.Net.Http.Headers;
using System.Text.Json.Nodes;
using CdsNatremia.Scenarios;
using CdsNatremia.Service.Tests.Support;
using Microsoft.AspNetCore.Server.Kestrel.Core;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Options;

namespace CdsNatremia.Service.Tests.Security;

/// <summary>Body size, JSON depth, Bundle entry count and server timeouts: every bound answers with a clear 4xx.</summary>
public sealed class InputBoundsTests : IDisposable
{
    private const string Service = "natremia-chart-review";
    private const int MaxBody = 16_384;
    private const int MaxEntries = 50;

    private readonly NatremiaFactory _factory = NatremiaFactory.With(new()
    {
        ["Natremia:Limits:MaxRequestBodyBytes"] = MaxBody.ToString(System.Globalization.CultureInfo.InvariantCulture),
        ["Natremia:Limits:MaxBundleEntries"] = MaxEntries.ToString(System.Globalization.CultureInfo.InvariantCulture),
        ["Natremia:Limits:RequestHeadersTimeoutSeconds"] = "7",
        ["Natremia:Limits:MinRequestBodyBytesPerSecond"] = "500",
        ["Natremia:Limits:MinRequestBodyGraceSeconds"] = "3",
    });

    private static JsonObject Padded(int totalBytes)
    {
        var body = HookCalls.Request(ScenarioLibrary.Find("01")!);
        var size = body.ToJsonString().Length;
        body["padding"] = new string('x', Math.Max(0, totalBytes - size - 14));
        return body;
    }

    [Fact]
    public async Task BodyOverTheLimitWithContentLength_413()
    {
        var response = await HookCalls.PostRawAsync(_factory.CreateClient(), Service, Padded(MaxBody + 1000).ToJsonString());
        Assert.Equal(HttpStatusCode.RequestEntityTooLarge, response.StatusCode);
        Assert.Contains("larger than this service accepts", await response.Content.ReadAsStringAsync(), StringComparison.Ordinal);
    }

    [Fact]
    public async Task ChunkedBodyOverTheLimit_413()
    {
        using var content = new UnsizedContent(Padded(MaxBody * 3).ToJsonString());
        content.Headers.ContentType = new MediaTypeHeaderValue("application/json");
        var response = await _factory.CreateClient().PostAsync($"/cds-services/{Service}", content);
        Assert.Equal(HttpStatusCode.RequestEntityTooLarge, response.StatusCode);
    }

    [Fact]
    public async Task ChunkedBodyUnderTheLimit_Served()
    {
        // The control for the test above: the same path without a length is accepted when small enough.
        var text = HookCalls.Request(ScenarioLibrary.Find("01")!).ToJsonString();
        Assert.True(text.Length < MaxBody, $"scenario request is {text.Length} bytes");
        using var content = new UnsizedContent(text);
        content.Headers.ContentType = new MediaTypeHeaderValue("application/json");
        Assert.Equal(HttpStatusCode.OK, (await _factory.CreateClient().PostAsync($"/cds-services/{Service}", content)).StatusCode);
    }

    [Fact]
    public async Task JsonDeeperThanTheLimit_400()
    {
        var deep = new string('[', 100) + new string(']', 100);
        var response = await HookCalls.PostRawAsync(_factory.CreateClient(), Service, $"{{\"hook\":\"patient-view\",\"context\":{deep}}}");
        Assert.Equal(HttpStatusCode.BadRequest, response.StatusCode);
        Assert.Contains("deeper than 64 levels", await response.Content.ReadAsStringAsync(), StringComparison.Ordinal);
    }

    [Fact]
    public async Task BundleEntriesOverTheLimit_413WithAClearMessage()
    {
        var response = await HookCalls.PostAsync(_factory.CreateClient(), Service, WithEntries(MaxEntries + 1));
        Assert.Equal(HttpStatusCode.RequestEntityTooLarge, response.StatusCode);
        var detail = (await HookCalls.ProblemAsync(response)).GetProperty("detail").GetString();
        Assert.Contains($"more than {MaxEntries} Bundle entries", detail, StringComparison.Ordinal);
    }

    [Fact]
    public async Task BundleEntriesAtTheLimit_Served()
        => Assert.Equal(HttpStatusCode.OK, (await HookCalls.PostAsync(_factory.CreateClient(), Service, WithEntries(MaxEntries))).StatusCode);

    [Fact]
    public async Task BundleEntriesInContextCount_NestedToo()
    {
        var order = ScenarioLibrary.All.First(s => s.Hook == "order-sign");
        var body = HookCalls.Request(order);
        var drafts = body["context"]!["draftOrders"]!.AsObject();
        var nested = new JsonObject { ["resourceType"] = "Bundle", ["type"] = "collection", ["entry"] = Entries(MaxEntries + 1) };
        drafts["entry"]!.AsArray().Add(new JsonObject { ["resource"] = nested });
        var response = await HookCalls.PostAsync(_factory.CreateClient(), HookCalls.ServiceFor(order.Hook), body);
        Assert.Equal(HttpStatusCode.RequestEntityTooLarge, response.StatusCode);
    }

    [Fact]
    public void KestrelLimits_TakenFromConfiguration()
    {
        _ = _factory.CreateClient();
        var limits = _factory.Services.GetRequiredService<IOptions<KestrelServerOptions>>().Value.Limits;
        Assert.Equal(MaxBody, limits.MaxRequestBodySize);
        Assert.Equal(TimeSpan.FromSeconds(7), limits.RequestHeadersTimeout);
        Assert.Equal(500, limits.MinRequestBodyDataRate!.BytesPerSecond);
        Assert.Equal(TimeSpan.FromSeconds(3), limits.MinRequestBodyDataRate.GracePeriod);
    }

    /// <summary>Scenario 01 with its prefetch Bundles topped up to exactly <paramref name="total"/> entries.</summary>
    private static JsonObject WithEntries(int total)
    {
        var body = HookCalls.Request(ScenarioLibrary.Find("01")!);
        var prefetch = body["prefetch"]!.AsObject();
        var present = prefetch.Select(p => p.Value).OfType<JsonObject>()
            .Where(b => (string?)b["resourceType"] == "Bundle")
            .Sum(b => b["entry"]?.AsArray().Count ?? 0);
        Assert.True(present < total, $"scenario already has {present} entries");
        prefetch["conditions"] = new JsonObject { ["resourceType"] = "Bundle", ["type"] = "searchset", ["entry"] = Entries(total - present + (CountIn(prefetch["conditions"]))) };
        return body;
    }

    private static int CountIn(JsonNode? bundle) => bundle is JsonObject b && b["entry"] is JsonArray a ? a.Count : 0;

    private static JsonArray Entries(int count)
    {
        var entries = new JsonArray();
        for (var i = 0; i < count; i++)
        {
            entries.Add(new JsonObject
            {
                ["resource"] = new JsonObject
                {
                    ["resourceType"] = "Condition",
                    ["id"] = $"pad-{i}",
                    ["subject"] = new JsonObject { ["reference"] = "Patient/s01-pt" },
                    ["code"] = new JsonObject { ["text"] = "padding" },
                },
            });
        }

        return entries;
    }

    public void Dispose() => _factory.Dispose();
}
