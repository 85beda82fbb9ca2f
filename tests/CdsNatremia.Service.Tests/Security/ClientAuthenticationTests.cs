using System.Net;
using System.Net.Http.Headers;
using System.Text;
using CdsNatremia.Scenarios;
using CdsNatremia.Service.Tests.Support;

namespace CdsNatremia.Service.Tests.Security;

/// <summary>
/// The token matrix of CDS Hooks 2.0 client authentication, with real ES384 and RS384 signatures made in the test.
/// Each refusal must be a 401 with a Bearer challenge that names no reason, while the log names it.
/// </summary>
public sealed class ClientAuthenticationTests : IClassFixture<TrustedClientFixture>
{
    private const string Service = "natremia-chart-review";
    private const string ServicePath = "/cds-services/" + Service;

    private readonly TestClientKeys _keys;
    private readonly SecuredHost _host;

    public ClientAuthenticationTests(TrustedClientFixture fixture)
    {
        ArgumentNullException.ThrowIfNull(fixture);
        _keys = fixture.Keys;
        _host = fixture.Host;
        _host.Logs.Clear();
    }

    private DateTimeOffset Now => _host.Clock.GetUtcNow();

    [Theory]
    [InlineData("ES384")]
    [InlineData("RS384")]
    public async Task ValidToken_ServiceAnswersWithCards(string algorithm)
    {
        var response = await PostAsync(_keys.Token(ServicePath, Now, t => t.Algorithm = algorithm));
        Assert.Equal(HttpStatusCode.OK, response.StatusCode);
        Assert.NotEmpty(await HookCalls.CardsAsync(response));
    }

    [Fact]
    public async Task ValidToken_DiscoveryAnswers()
    {
        var request = new HttpRequestMessage(HttpMethod.Get, "/cds-services");
        request.Headers.Authorization = new AuthenticationHeaderValue("Bearer", _keys.Token("/cds-services", Now));
        Assert.Equal(HttpStatusCode.OK, (await _host.CreateClient().SendAsync(request)).StatusCode);
    }

    [Fact]
    public async Task NoToken_401WithChallengeWithoutErrorCode()
    {
        var response = await HookCalls.PostAsync(_host.CreateClient(), Service, HookCalls.Request(ScenarioLibrary.Find("01")!));
        Assert.Equal(HttpStatusCode.Unauthorized, response.StatusCode);
        var challenge = response.Headers.WwwAuthenticate.Single();
        Assert.Equal("Bearer", challenge.Scheme);
        Assert.DoesNotContain("error=", challenge.Parameter ?? string.Empty, StringComparison.Ordinal); // RFC 6750 §3.1
    }

    [Fact]
    public async Task NoToken_DiscoveryAndUnknownPathsUnderCdsServicesAreGuardedToo()
    {
        var client = _host.CreateClient();
        Assert.Equal(HttpStatusCode.Unauthorized, (await client.GetAsync("/cds-services")).StatusCode);
        Assert.Equal(HttpStatusCode.Unauthorized, (await client.PostAsync(ServicePath + "/feedback", new StringContent("{}", Encoding.UTF8, "application/json"))).StatusCode);
        Assert.Equal(HttpStatusCode.Unauthorized, (await client.PostAsync("/CDS-Services/" + Service, new StringContent("{}", Encoding.UTF8, "application/json"))).StatusCode); // routing ignores case; so does the guard
        Assert.Equal(HttpStatusCode.OK, (await client.GetAsync("/healthz")).StatusCode); // probes stay open
    }

    public static TheoryData<string> RefusedCases() =>
    [
        "expired", "not yet valid", "issued in the future", "wrong aud", "aud of another service", "wrong iss", "unknown kid",
        "alg none", "HS256 with public key", "missing jti", "missing iat", "missing exp", "lifetime too long", "tampered payload",
        "typ not JWT", "no kid", "alg not on allowlist", "garbage", "Basic scheme",
    ];

    [Theory]
    [MemberData(nameof(RefusedCases))]
    public async Task RefusedToken_401InvalidTokenAndTheLogSaysWhy(string name)
    {
        var (authorization, logged) = Case(name);
        var response = await PostAsync(authorization, raw: name == "Basic scheme");

        Assert.Equal(HttpStatusCode.Unauthorized, response.StatusCode);
        Assert.Contains("invalid_token", response.Headers.WwwAuthenticate.Single().Parameter, StringComparison.Ordinal);
        var body = await response.Content.ReadAsStringAsync();
        Assert.Contains("The bearer token was not accepted.", body, StringComparison.Ordinal);
        Assert.DoesNotContain(logged, body, StringComparison.OrdinalIgnoreCase); // the reason is for the log only

        var refusal = Assert.Single(_host.Logs.Lines, l => l.Contains("Refused CDS client call", StringComparison.Ordinal));
        Assert.Contains(logged, refusal, StringComparison.OrdinalIgnoreCase);
        Assert.DoesNotContain(authorization.Split('.')[0], refusal, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("{\"alg\":123,\"typ\":\"JWT\",\"kid\":\"test-ec-1\"}", "{}")]
    [InlineData("{\"alg\":\"ES384\",\"typ\":\"JWT\",\"kid\":[1]}", "{}")]
    [InlineData("{\"alg\":\"ES384\",\"typ\":7,\"kid\":\"test-ec-1\"}", "{}")]
    [InlineData("{\"alg\":\"ES384\",\"typ\":\"JWT\",\"kid\":\"test-ec-1\",\"jku\":42}", "{\"iss\":\"https://ehr.test.example\"}")]
    [InlineData("{\"alg\":\"ES384\",\"typ\":\"JWT\",\"kid\":\"test-ec-1\"}", "{\"iss\":{\"x\":1}}")]
    [InlineData("{\"alg\":\"ES384\",\"typ\":\"JWT\",\"kid\":\"test-ec-1\"}", "{\"iss\":\"https://ehr.test.example\",\"exp\":\"soon\",\"iat\":1e400}")]
    [InlineData("[]", "[]")]
    [InlineData("not json", "not json")]
    public async Task MalformedTokenParts_401NeverA500(string header, string payload)
    {
        var token = Microsoft.IdentityModel.Tokens.Base64UrlEncoder.Encode(header) + "." + Microsoft.IdentityModel.Tokens.Base64UrlEncoder.Encode(payload) + ".c2ln";
        Assert.Equal(HttpStatusCode.Unauthorized, (await PostAsync(token)).StatusCode);
    }

    [Theory]
    [InlineData("..")]
    [InlineData("a.b")]
    [InlineData("a.b.c.d")]
    [InlineData("a.b.c.d.e")]
    [InlineData("Bearer")]
    public async Task MalformedTokenShapes_401NeverA500(string token)
        => Assert.Equal(HttpStatusCode.Unauthorized, (await PostAsync(token)).StatusCode);

    [Fact]
    public async Task ReplayedJti_SecondUseRefused()
    {
        var token = _keys.Token(ServicePath, Now);
        Assert.Equal(HttpStatusCode.OK, (await PostAsync(token)).StatusCode);
        var again = await PostAsync(token);
        Assert.Equal(HttpStatusCode.Unauthorized, again.StatusCode);
        Assert.Contains(_host.Logs.Lines, l => l.Contains("already used (replay)", StringComparison.Ordinal));
    }

    [Fact]
    public async Task SameJtiFreshToken_StillAReplay()
    {
        // A new signature does not make a used jti new again (CDS Hooks 2.0: jti identifies the token).
        Assert.Equal(HttpStatusCode.OK, (await PostAsync(_keys.Token(ServicePath, Now, t => t.Jti = "fixed-id"))).StatusCode);
        Assert.Equal(HttpStatusCode.Unauthorized, (await PostAsync(_keys.Token(ServicePath, Now, t => { t.Jti = "fixed-id"; t.Algorithm = "RS384"; }))).StatusCode);
    }

    [Fact]
    public async Task WithinClockSkew_Accepted()
    {
        // Expired 30 s ago, inside the default 60 s skew (common practice: allow small clock differences).
        var token = _keys.Token(ServicePath, Now, t => { t.IssuedAt = Now.AddMinutes(-4); t.Expires = Now.AddSeconds(-30); });
        Assert.Equal(HttpStatusCode.OK, (await PostAsync(token)).StatusCode);
    }

    [Fact]
    public async Task AudienceFollowsPublicBaseUrl_BehindAProxy()
    {
        var settings = _keys.InlineSettings();
        settings["Natremia:Authentication:PublicBaseUrl"] = "https://cds.hospital.example/natremia/";
        using var proxied = new SecuredHost(settings);
        var now = proxied.Clock.GetUtcNow();
        var ok = _keys.Token(ServicePath, now, t => t.Audience = "https://cds.hospital.example/natremia" + ServicePath);
        var asSeenInside = _keys.Token(ServicePath, now); // aud http://localhost/... : what the proxy's inside looks like
        Assert.Equal(HttpStatusCode.OK, (await Post(proxied.CreateClient(), ok)).StatusCode);
        Assert.Equal(HttpStatusCode.Unauthorized, (await Post(proxied.CreateClient(), asSeenInside)).StatusCode);
    }

    private (string Authorization, string Logged) Case(string name) => name switch
    {
        "expired" => (_keys.Token(ServicePath, Now, t => { t.IssuedAt = Now.AddMinutes(-10); t.Expires = Now.AddMinutes(-5); }), "expired"),
        "not yet valid" => (_keys.Token(ServicePath, Now, t => { t.NotBefore = Now.AddMinutes(5); t.Expires = Now.AddMinutes(6); }), "not yet valid"),
        "issued in the future" => (_keys.Token(ServicePath, Now, t => { t.IssuedAt = Now.AddMinutes(5); t.Expires = Now.AddMinutes(6); }), "iat is in the future"),
        "wrong aud" => (_keys.Token(ServicePath, Now, t => t.Audience = "https://elsewhere.example/cds-services/" + Service), "aud is not the URL called"),
        "aud of another service" => (_keys.Token(ServicePath, Now, t => t.Audience = TestClientKeys.PublicBaseUrl + "/cds-services/natremia-order-sign"), "aud is not the URL called"),
        "wrong iss" => (_keys.Token(ServicePath, Now, t => t.Issuer = "https://intruder.example"), "not a trusted client"),
        "unknown kid" => (_keys.Token(ServicePath, Now, t => t.Kid = "someone-elses-key"), "is not among the configured keys"),
        "alg none" => (TestClientKeys.UnsignedToken(ServicePath, Now), "alg 'none' is not on the allowlist"),
        "HS256 with public key" => (_keys.HmacWithPublicKeyToken(ServicePath, Now), "alg 'HS256' is not on the allowlist"),
        "missing jti" => (_keys.Token(ServicePath, Now, t => t.Jti = null), "jti is missing"),
        "missing iat" => (_keys.Token(ServicePath, Now, t => t.IssuedAt = null), "exp or iat is missing"),
        "missing exp" => (_keys.Token(ServicePath, Now, t => t.Expires = null), "exp or iat is missing"),
        "lifetime too long" => (_keys.Token(ServicePath, Now, t => t.Expires = Now.AddHours(1)), "exceeds 300 s"),
        "tampered payload" => (_keys.TamperedToken(ServicePath, Now), "signature does not verify"),
        "typ not JWT" => (_keys.Token(ServicePath, Now, t => t.Type = "at+jwt"), "not JWT"),
        "no kid" => (_keys.Token(ServicePath, Now, t => t.Kid = string.Empty), "kid is missing"),
        "alg not on allowlist" => (_keys.Token(ServicePath, Now, t => t.Algorithm = "PS384"), "alg 'PS384' is not on the allowlist"),
        "garbage" => ("qqgarbage1.qqgarbage2.qqgarbage3", "not a well-formed JWS"),
        "Basic scheme" => ("Basic dXNlcjpwYXNz", "not a single Bearer credential"),
        _ => throw new ArgumentOutOfRangeException(nameof(name)),
    };

    private Task<HttpResponseMessage> PostAsync(string token, bool raw = false) => Post(_host.CreateClient(), token, raw);

    private static Task<HttpResponseMessage> Post(HttpClient client, string token, bool raw = false)
    {
        var request = new HttpRequestMessage(HttpMethod.Post, ServicePath)
        {
            Content = new StringContent(HookCalls.Request(ScenarioLibrary.Find("01")!).ToJsonString(), Encoding.UTF8, "application/json"),
        };
        if (raw)
        {
            request.Headers.TryAddWithoutValidation("Authorization", token);
        }
        else
        {
            request.Headers.Authorization = new AuthenticationHeaderValue("Bearer", token);
        }

        return client.SendAsync(request);
    }
}
