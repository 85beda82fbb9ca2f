using System.Net;
using System.Net.Http.Headers;
using System.Text;
using System.Text.Json.Nodes;
using CdsNatremia.Scenarios;
using CdsNatremia.Service.Tests.Support;
using Microsoft.IdentityModel.JsonWebTokens;
using Microsoft.IdentityModel.Tokens;

namespace CdsNatremia.Service.Tests.Security;

/// <summary>
/// Two token rules beyond the usual claims: a JWS "crit" header naming extensions the service does not understand is
/// refused (RFC 7515 §4.1.11), and "aud" may be an array only when it holds exactly the URL called.
/// </summary>
public sealed class TokenHeaderAndAudienceTests : IClassFixture<TrustedClientFixture>
{
    private const string ServicePath = "/cds-services/natremia-chart-review";
    private const string OwnAudience = TestClientKeys.PublicBaseUrl + ServicePath;

    private readonly TestClientKeys _keys;
    private readonly SecuredHost _host;

    public TokenHeaderAndAudienceTests(TrustedClientFixture fixture)
    {
        ArgumentNullException.ThrowIfNull(fixture);
        _keys = fixture.Keys;
        _host = fixture.Host;
        _host.Logs.Clear();
    }

    [Fact]
    public async Task CritHeader_UnknownExtension_401AndLogNamesIt()
    {
        var token = Sign(Payload(OwnAudience), new Dictionary<string, object> { ["crit"] = new[] { "urn:example:must-understand" }, ["urn:example:must-understand"] = true });

        var response = await PostAsync(token);

        Assert.Equal(HttpStatusCode.Unauthorized, response.StatusCode);
        Assert.Contains(_host.Logs.Lines, l => l.Contains("header crit (urn:example:must-understand)", StringComparison.Ordinal) && l.Contains("RFC 7515", StringComparison.Ordinal));
    }

    [Fact]
    public async Task CritHeader_Empty_401()
    {
        var response = await PostAsync(Sign(Payload(OwnAudience), new Dictionary<string, object> { ["crit"] = Array.Empty<string>() }));

        Assert.Equal(HttpStatusCode.Unauthorized, response.StatusCode);
    }

    [Fact]
    public async Task NoCritHeader_SameTokenOtherwise_200()
    {
        // The control: the same construction without "crit" is accepted, so the refusals above are about "crit".
        var response = await PostAsync(Sign(Payload(OwnAudience), new Dictionary<string, object>()));

        Assert.Equal(HttpStatusCode.OK, response.StatusCode);
    }

    [Fact]
    public async Task AudArray_OnlyTheUrlCalled_200()
    {
        var response = await PostAsync(Sign(Payload(new JsonArray(OwnAudience)), new Dictionary<string, object>()));

        Assert.Equal(HttpStatusCode.OK, response.StatusCode);
    }

    [Theory]
    [InlineData("https://other-service.test.example/cds-services/x")]
    [InlineData(OwnAudience)]
    public async Task AudArray_UrlCalledPlusAnother_401(string second)
    {
        var response = await PostAsync(Sign(Payload(new JsonArray(OwnAudience, second)), new Dictionary<string, object>()));

        Assert.Equal(HttpStatusCode.Unauthorized, response.StatusCode);
        Assert.Contains(_host.Logs.Lines, l => l.Contains("aud is an array of 2 values", StringComparison.Ordinal));
    }

    private string Payload(JsonNode audience)
    {
        var now = _host.Clock.GetUtcNow();
        return new JsonObject
        {
            ["iss"] = TestClientKeys.Issuer,
            ["aud"] = audience,
            ["iat"] = now.ToUnixTimeSeconds(),
            ["exp"] = now.AddMinutes(5).ToUnixTimeSeconds(),
            ["jti"] = Guid.NewGuid().ToString(),
        }.ToJsonString();
    }

    private string Sign(string payload, Dictionary<string, object> extraHeaders)
    {
        extraHeaders["typ"] = "JWT";
        return new JsonWebTokenHandler().CreateToken(payload, new SigningCredentials(_keys.EcKey, SecurityAlgorithms.EcdsaSha384), extraHeaders);
    }

    private Task<HttpResponseMessage> PostAsync(string token)
    {
        var request = new HttpRequestMessage(HttpMethod.Post, ServicePath)
        {
            Content = new StringContent(HookCalls.Request(ScenarioLibrary.Find("01")!).ToJsonString(), Encoding.UTF8, "application/json"),
        };
        request.Headers.Authorization = new AuthenticationHeaderValue("Bearer", token);
        return _host.CreateClient().SendAsync(request);
    }
}
