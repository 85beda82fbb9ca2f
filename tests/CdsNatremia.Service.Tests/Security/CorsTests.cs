using System.Net;
using CdsNatremia.Service.Tests.Support;

namespace CdsNatremia.Service.Tests.Security;

/// <summary>CORS: only configured origins, none by default; preflights need no token (browsers send none).</summary>
public sealed class CorsTests
{
    private const string Allowed = "https://ehr-ui.test.example";

    [Fact]
    public async Task ConfiguredOrigin_PreflightAllowedWithoutToken()
    {
        using var keys = new TestClientKeys();
        var settings = keys.InlineSettings();
        settings["Natremia:Cors:AllowedOrigins:0"] = Allowed;
        using var factory = NatremiaFactory.With(settings);
        var response = await factory.CreateClient().SendAsync(Preflight(Allowed));
        Assert.True(response.IsSuccessStatusCode, $"HTTP {(int)response.StatusCode}");
        Assert.Equal(Allowed, response.Headers.GetValues("Access-Control-Allow-Origin").Single());
        Assert.Contains("authorization", string.Join(",", response.Headers.GetValues("Access-Control-Allow-Headers")), StringComparison.OrdinalIgnoreCase);
    }

    [Fact]
    public async Task OtherOrigin_NoCorsHeaders()
    {
        using var factory = NatremiaFactory.With(new() { ["Natremia:Cors:AllowedOrigins:0"] = Allowed });
        var response = await factory.CreateClient().SendAsync(Preflight("https://elsewhere.test.example"));
        Assert.False(response.Headers.Contains("Access-Control-Allow-Origin"));
    }

    [Fact]
    public async Task NothingConfigured_NoCorsHeaders()
    {
        using var factory = NatremiaFactory.With(new());
        var request = new HttpRequestMessage(HttpMethod.Get, "/cds-services");
        request.Headers.Add("Origin", Allowed);
        var response = await factory.CreateClient().SendAsync(request);
        Assert.Equal(HttpStatusCode.OK, response.StatusCode);
        Assert.False(response.Headers.Contains("Access-Control-Allow-Origin"));
    }

    [Theory]
    [InlineData("*")]
    [InlineData("https://ehr.test.example/path")]
    [InlineData("not a url")]
    public void WildcardOrPathOrigin_RefusesToStart(string origin)
    {
        using var factory = NatremiaFactory.With(new() { ["Natremia:Cors:AllowedOrigins:0"] = origin });
        var ex = Assert.ThrowsAny<Exception>(() => factory.CreateClient());
        Assert.Contains("AllowedOrigins", ex.ToString(), StringComparison.Ordinal);
    }

    private static HttpRequestMessage Preflight(string origin)
    {
        var request = new HttpRequestMessage(HttpMethod.Options, "/cds-services/natremia-chart-review");
        request.Headers.Add("Origin", origin);
        request.Headers.Add("Access-Control-Request-Method", "POST");
        request.Headers.Add("Access-Control-Request-Headers", "authorization,content-type");
        return request;
    }
}
