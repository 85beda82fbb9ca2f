using System.Net;
using System.Net.Http.Headers;
using System.Text.Json.Nodes;
using CdsNatremia.Service.Tests.Support;
using Microsoft.AspNetCore.Hosting;

namespace CdsNatremia.Service.Tests.Security;

/// <summary>Which configurations may start, and what the service says about running without authentication.</summary>
public sealed class StartupModeTests
{
    // Outside Development the audit trail also needs its pseudonym key; it is set here so that the only thing missing
    // is what each test is about.
    private const string PseudonymKeySetting = "Natremia:Audit:PseudonymKey";
    private static readonly string PseudonymKey = new('k', 48);

    [Fact]
    public void Production_WithoutTrustedClients_RefusesToStartWithAClearMessage()
    {
        using var factory = NatremiaFactory.With(new() { [PseudonymKeySetting] = PseudonymKey });
        using var production = factory.WithWebHostBuilder(b => b.UseEnvironment("Production"));
        var message = Exceptions.AllMessages(Assert.ThrowsAny<Exception>(() => production.CreateClient()));
        Assert.Contains("TrustedClients is empty", message, StringComparison.Ordinal);
        Assert.Contains("only in the Development environment, not in 'Production'", message, StringComparison.Ordinal);
    }

    [Fact]
    public void Staging_WithoutTrustedClients_RefusesToStartToo()
    {
        using var factory = NatremiaFactory.With(new() { [PseudonymKeySetting] = PseudonymKey });
        using var staging = factory.WithWebHostBuilder(b => b.UseEnvironment("Staging"));
        Assert.Contains("TrustedClients is empty", Exceptions.AllMessages(Assert.ThrowsAny<Exception>(() => staging.CreateClient())), StringComparison.Ordinal);
    }

    [Fact]
    public async Task Production_WithATrustedClient_StartsAndDemandsTokens()
    {
        using var keys = new TestClientKeys();
        var settings = keys.InlineSettings();
        settings[PseudonymKeySetting] = PseudonymKey;
        using var factory = NatremiaFactory.With(settings);
        using var production = factory.WithWebHostBuilder(b => b.UseEnvironment("Production"));
        var client = production.CreateClient();
        Assert.Equal(HttpStatusCode.Unauthorized, (await client.GetAsync("/cds-services")).StatusCode);
        var request = new HttpRequestMessage(HttpMethod.Get, "/cds-services");
        request.Headers.Authorization = new AuthenticationHeaderValue("Bearer", keys.Token("/cds-services", factory.Clock.GetUtcNow()));
        Assert.Equal(HttpStatusCode.OK, (await client.SendAsync(request)).StatusCode);
    }

    [Theory]
    [InlineData("none")]
    [InlineData("HS256")]
    [InlineData("HS384")]
    public void SymmetricOrNoAlgorithmConfigured_RefusesToStart(string algorithm)
    {
        using var keys = new TestClientKeys();
        var settings = keys.InlineSettings();
        settings["Natremia:Authentication:Algorithms:0"] = "ES384";
        settings["Natremia:Authentication:Algorithms:1"] = algorithm;
        using var factory = NatremiaFactory.With(settings);
        var message = Exceptions.AllMessages(Assert.ThrowsAny<Exception>(() => factory.CreateClient()));
        Assert.Contains($"'{algorithm}' is not allowed", message, StringComparison.Ordinal);
    }

    [Fact]
    public void PrivateKeyInConfiguration_RefusesToStart()
    {
        using var keys = new TestClientKeys();
        var settings = keys.InlineSettings();
        var jwks = JsonNode.Parse(settings["Natremia:Authentication:TrustedClients:0:Jwks"]!)!;
        jwks["keys"]![0]!["d"] = "c2VjcmV0LXBhcnQ"; // a private member where only public keys belong
        settings["Natremia:Authentication:TrustedClients:0:Jwks"] = jwks.ToJsonString();
        using var factory = NatremiaFactory.With(settings);
        Assert.Contains("holds private key material", Exceptions.AllMessages(Assert.ThrowsAny<Exception>(() => factory.CreateClient())), StringComparison.Ordinal);
    }

    [Fact]
    public void TrustedClientWithoutPublicBaseUrl_RefusesToStart()
    {
        using var keys = new TestClientKeys();
        var settings = keys.InlineSettings();
        settings.Remove("Natremia:Authentication:PublicBaseUrl");
        using var factory = NatremiaFactory.With(settings);
        Assert.Contains("PublicBaseUrl must be an absolute URL", Exceptions.AllMessages(Assert.ThrowsAny<Exception>(() => factory.CreateClient())), StringComparison.Ordinal);
    }

    [Fact]
    public async Task JwksWrittenAsANestedObject_IsRead()
    {
        // appsettings.json may hold the JWK Set as a plain object instead of JSON text.
        using var keys = new TestClientKeys();
        var settings = keys.InlineSettings();
        settings.Remove("Natremia:Authentication:TrustedClients:0:Jwks");
        var jwk = JsonNode.Parse(keys.PublicJwks(TestClientKeys.EcKid))!["keys"]![0]!.AsObject();
        foreach (var (name, value) in jwk)
        {
            settings[$"Natremia:Authentication:TrustedClients:0:Jwks:keys:0:{name}"] = (string?)value;
        }

        using var factory = NatremiaFactory.With(settings);
        var request = new HttpRequestMessage(HttpMethod.Get, "/cds-services");
        request.Headers.Authorization = new AuthenticationHeaderValue("Bearer", keys.Token("/cds-services", factory.Clock.GetUtcNow()));
        Assert.Equal(HttpStatusCode.OK, (await factory.CreateClient().SendAsync(request)).StatusCode);
    }

    [Fact]
    public async Task OpenMode_DiscoveryWarnsInEveryServicesUsageRequirements()
    {
        using var factory = NatremiaFactory.With(new());
        var services = JsonNode.Parse(await factory.CreateClient().GetStringAsync("/cds-services"))!["services"]!.AsArray();
        Assert.All(services, s => Assert.Contains("client authentication is OFF", (string)s!["usageRequirements"]!, StringComparison.Ordinal));
    }

    [Fact]
    public async Task OpenMode_StartUpLogWarnsLoudly()
    {
        using var host = new SecuredHost(new());
        _ = await host.CreateClient().GetAsync("/healthz");
        Assert.Contains(host.Logs.Lines, l => l.StartsWith("Warning", StringComparison.Ordinal) && l.Contains("client authentication is OFF", StringComparison.Ordinal));
    }

    [Fact]
    public async Task Enforced_DiscoveryCarriesNoWarning()
    {
        using var keys = new TestClientKeys();
        using var factory = NatremiaFactory.With(keys.InlineSettings());
        var request = new HttpRequestMessage(HttpMethod.Get, "/cds-services");
        request.Headers.Authorization = new AuthenticationHeaderValue("Bearer", keys.Token("/cds-services", factory.Clock.GetUtcNow()));
        var body = await (await factory.CreateClient().SendAsync(request)).Content.ReadAsStringAsync();
        Assert.Contains("\"services\"", body, StringComparison.Ordinal);
        Assert.DoesNotContain("authentication is OFF", body, StringComparison.Ordinal);
    }
}
