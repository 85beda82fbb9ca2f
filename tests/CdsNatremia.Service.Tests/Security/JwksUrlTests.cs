using System.Net;
using System.Net.Http.Headers;
using System.Net.Sockets;
using System.Text;
using CdsNatremia.Scenarios;
using CdsNatremia.Service.Tests.Support;
using WireMock.RequestBuilders;
using WireMock.ResponseBuilders;
using WireMock.Server;
using WireMock.Settings;

namespace CdsNatremia.Service.Tests.Security;

/// <summary>
/// Keys fetched from a client's JWK Set URL (the jku header, or the configured URL): a stand-in key server on loopback
/// counts every request, so the tests can show what was fetched, and that nothing was fetched from a URL off the list.
/// </summary>
public sealed class JwksUrlTests : IDisposable
{
    private const string ServicePath = "/cds-services/natremia-chart-review";

    private readonly TestClientKeys _keys = new();
    private readonly string _keyServerUrl = $"http://127.0.0.1:{FreeLoopbackPort()}";
    private readonly WireMockServer _keyServer;

    public JwksUrlTests() => _keyServer = WireMockServer.Start(new WireMockServerSettings { Urls = [_keyServerUrl] });

    private string JwksUrl => _keyServerUrl + "/ehr/jwks.json";

    private int FetchCount(string path) => _keyServer.LogEntries.Count(e => e.RequestMessage.Path == path);

    [Fact]
    public async Task JkuOnTheAllowlist_KeysFetchedOnceAndCached()
    {
        Serve("/ehr/jwks.json", 200, _keys.PublicJwks());
        using var host = new SecuredHost(TestClientKeys.UrlSettings(JwksUrl));
        var now = host.Clock.GetUtcNow();

        Assert.Equal(HttpStatusCode.OK, (await PostAsync(host, _keys.Token(ServicePath, now, t => t.Jku = JwksUrl))).StatusCode);
        Assert.Equal(HttpStatusCode.OK, (await PostAsync(host, _keys.Token(ServicePath, now, t => { t.Jku = JwksUrl; t.Algorithm = "RS384"; }))).StatusCode);
        Assert.Equal(HttpStatusCode.OK, (await PostAsync(host, _keys.Token(ServicePath, now))).StatusCode); // no jku: the configured URL
        Assert.Equal(1, FetchCount("/ehr/jwks.json"));
    }

    [Fact]
    public async Task JkuNotOnTheAllowlist_RefusedWithoutAnyRequest()
    {
        Serve("/ehr/jwks.json", 200, _keys.PublicJwks());
        Serve("/attacker/jwks.json", 200, _keys.PublicJwks());
        using var host = new SecuredHost(TestClientKeys.UrlSettings(JwksUrl));
        var elsewhere = _keyServerUrl + "/attacker/jwks.json";

        var response = await PostAsync(host, _keys.Token(ServicePath, host.Clock.GetUtcNow(), t => t.Jku = elsewhere));

        Assert.Equal(HttpStatusCode.Unauthorized, response.StatusCode);
        Assert.Empty(_keyServer.LogEntries); // neither the attacker's URL nor any other was asked
        Assert.Contains(host.Logs.Lines, l => l.Contains("is not on this client's allowlist; nothing was fetched", StringComparison.Ordinal));
    }

    [Fact]
    public async Task JwksEndpointDown_401AndLogged()
    {
        Serve("/ehr/jwks.json", 503, "{}");
        using var host = new SecuredHost(TestClientKeys.UrlSettings(JwksUrl));

        var response = await PostAsync(host, _keys.Token(ServicePath, host.Clock.GetUtcNow(), t => t.Jku = JwksUrl));

        Assert.Equal(HttpStatusCode.Unauthorized, response.StatusCode);
        Assert.Contains(host.Logs.Lines, l => l.Contains("Could not fetch the JWK Set", StringComparison.Ordinal) && l.Contains("HTTP 503", StringComparison.Ordinal));
        Assert.Contains(host.Logs.Lines, l => l.Contains("could not be fetched", StringComparison.Ordinal));
    }

    [Fact]
    public async Task JwksEndpointNotListening_401()
    {
        var closed = $"http://127.0.0.1:{FreeLoopbackPort()}/jwks.json";
        using var host = new SecuredHost(TestClientKeys.UrlSettings(closed));
        var response = await PostAsync(host, _keys.Token(ServicePath, host.Clock.GetUtcNow(), t => t.Jku = closed));
        Assert.Equal(HttpStatusCode.Unauthorized, response.StatusCode);
    }

    [Fact]
    public async Task UnknownKid_RefreshesAtMostOncePerInterval_ThenFindsARotatedKey()
    {
        Serve("/ehr/jwks.json", 200, _keys.PublicJwks(TestClientKeys.EcKid));
        using var host = new SecuredHost(TestClientKeys.UrlSettings(JwksUrl));
        Assert.Equal(HttpStatusCode.OK, (await PostAsync(host, _keys.Token(ServicePath, host.Clock.GetUtcNow()))).StatusCode);
        Assert.Equal(1, FetchCount("/ehr/jwks.json"));

        // Within the 60 s minimum interval an unknown kid causes no fetch.
        Assert.Equal(HttpStatusCode.Unauthorized, (await PostAsync(host, _keys.Token(ServicePath, host.Clock.GetUtcNow(), t => t.Algorithm = "RS384"))).StatusCode);
        Assert.Equal(1, FetchCount("/ehr/jwks.json"));

        // After it, the client has published its RSA key too: one refresh finds it.
        host.Clock.Advance(TimeSpan.FromSeconds(61));
        _keyServer.ResetMappings();
        Serve("/ehr/jwks.json", 200, _keys.PublicJwks());
        Assert.Equal(HttpStatusCode.OK, (await PostAsync(host, _keys.Token(ServicePath, host.Clock.GetUtcNow(), t => t.Algorithm = "RS384"))).StatusCode);
        Assert.Equal(2, FetchCount("/ehr/jwks.json"));

        // A stream of invented kids right after does not make the service ask again.
        for (var i = 0; i < 5; i++)
        {
            Assert.Equal(HttpStatusCode.Unauthorized, (await PostAsync(host, _keys.Token(ServicePath, host.Clock.GetUtcNow(), t => t.Kid = $"invented-{i}"))).StatusCode);
        }

        Assert.Equal(2, FetchCount("/ehr/jwks.json"));
    }

    private void Serve(string path, int status, string body)
        => _keyServer.Given(Request.Create().WithPath(path).UsingGet())
            .RespondWith(Response.Create().WithStatusCode(status).WithHeader("Content-Type", "application/json").WithBody(body));

    private static Task<HttpResponseMessage> PostAsync(SecuredHost host, string token)
    {
        var request = new HttpRequestMessage(HttpMethod.Post, ServicePath)
        {
            Content = new StringContent(HookCalls.Request(ScenarioLibrary.Find("01")!).ToJsonString(), Encoding.UTF8, "application/json"),
        };
        request.Headers.Authorization = new AuthenticationHeaderValue("Bearer", token);
        return host.CreateClient().SendAsync(request);
    }

    private static int FreeLoopbackPort()
    {
        using var listener = new TcpListener(IPAddress.Loopback, 0);
        listener.Start();
        return ((IPEndPoint)listener.LocalEndpoint).Port;
    }

    public void Dispose()
    {
        _keyServer.Stop();
        _keyServer.Dispose();
        _keys.Dispose();
    }
}
