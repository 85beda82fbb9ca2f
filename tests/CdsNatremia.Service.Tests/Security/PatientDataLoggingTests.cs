using System.Globalization;
using System.Net;
using System.Net.Http.Headers;
using System.Text;
using System.Text.Json.Nodes;
using System.Text.RegularExpressions;
using CdsNatremia.Scenarios;
using CdsNatremia.Service.Tests.Support;

namespace CdsNatremia.Service.Tests.Security;

/// <summary>
/// Runs real requests (every scenario, plus refusals and bad input) through a service that authenticates its client,
/// captures every log line at every level and in every category, and looks for patient data and credentials in them.
/// </summary>
public sealed class PatientDataLoggingTests : IDisposable
{
    private const string SentinelPatient = "sentinel-pt-7f3a9c";
    private const string SentinelFamily = "Quillfeather";
    private const string SentinelSodium = "118.2468";
    private const string SentinelFhirToken = "fhir-access-sentinel-5e1d";

    private readonly TestClientKeys _keys = new();
    private readonly SecuredHost _host;
    private readonly List<string> _tokens = [];

    public PatientDataLoggingTests() => _host = new SecuredHost(_keys.InlineSettings());

    [Fact]
    public async Task RealRequests_NoPatientIdNameSodiumValueOrTokenInAnyLogLine()
    {
        var client = _host.CreateClient();
        var forbidden = new List<string> { SentinelPatient, SentinelFamily, SentinelFhirToken };
        var sodiumValues = new HashSet<string>(StringComparer.Ordinal) { SentinelSodium };

        await ScenarioPatientData.SendEveryScenarioAsync((service, body) => SendAsync(client, service, body), forbidden, sodiumValues);

        // A request whose patient, name, sodium and FHIR token are distinctive, so any leak is found without doubt.
        var sentinel = await SendAsync(client, "natremia-chart-review", SentinelRequest());
        Assert.Equal(HttpStatusCode.OK, sentinel.StatusCode);
        Assert.Contains("118", await sentinel.Content.ReadAsStringAsync(), StringComparison.Ordinal); // the value did reach the rules

        // Refusals and bad input log too: they must not carry the data or the token either.
        var replayed = _tokens[^1];
        Assert.Equal(HttpStatusCode.Unauthorized, (await SendAsync(client, "natremia-chart-review", SentinelRequest(), replayed)).StatusCode);
        var expired = _keys.Token("/cds-services/natremia-chart-review", _host.Clock.GetUtcNow(), t => { t.IssuedAt = _host.Clock.GetUtcNow().AddHours(-2); t.Expires = t.IssuedAt.Value.AddMinutes(5); });
        Assert.Equal(HttpStatusCode.Unauthorized, (await SendAsync(client, "natremia-chart-review", SentinelRequest(), expired)).StatusCode);
        _tokens.Add(expired);
        Assert.Equal(HttpStatusCode.BadRequest, (await SendAsync(client, "natremia-chart-review", SentinelRequest()[..^40])).StatusCode);
        Assert.Equal(HttpStatusCode.BadRequest, (await SendAsync(client, "natremia-chart-review", SentinelRequest().Replace("\"patient-view\"", "\"order-sign\"", StringComparison.Ordinal))).StatusCode);
        Assert.Equal(HttpStatusCode.NotFound, (await SendAsync(client, "no-such-service", SentinelRequest())).StatusCode);

        var lines = _host.Logs.Lines;
        Assert.Contains(lines, l => l.Contains("Request ", StringComparison.Ordinal) && l.Contains("natremia-chart-review", StringComparison.Ordinal)); // the request log ran
        foreach (var line in lines)
        {
            foreach (var text in forbidden.Distinct(StringComparer.Ordinal))
            {
                Assert.False(line.Contains(text, StringComparison.OrdinalIgnoreCase), $"log line carries '{text}': {line}");
            }

            foreach (var token in _tokens)
            {
                var signature = token.Split('.')[2];
                Assert.False(line.Contains(token, StringComparison.Ordinal) || line.Contains(signature, StringComparison.Ordinal), $"log line carries a bearer token: {line}");
            }

            foreach (var value in sodiumValues)
            {
                // A value as clinical data would show it: with its unit, or as a JSON/structured value.
                var pattern = $@"(?<![\d.]){Regex.Escape(value)}(\s*mmol|""?\s*[,}}]|\s*$)|""value""\s*:\s*{Regex.Escape(value)}(?![\d.])";
                Assert.False(Regex.IsMatch(line, pattern), $"log line carries sodium value {value}: {line}");
            }
        }

        Assert.DoesNotContain(lines, l => l.Contains(SentinelSodium, StringComparison.Ordinal));
    }

    [Fact]
    public async Task RequestLog_CarriesRequestIdServiceRulesAndClient()
    {
        var response = await SendAsync(_host.CreateClient(), "natremia-chart-review", HookCalls.Request(ScenarioLibrary.Find("01")!).ToJsonString());
        Assert.Equal(HttpStatusCode.OK, response.StatusCode);
        var line = Assert.Single(_host.Logs.Lines, l => l.Contains("RequestLogMiddleware", StringComparison.Ordinal));
        Assert.Contains("service natremia-chart-review", line, StringComparison.Ordinal);
        Assert.Contains($"client {TestClientKeys.Issuer}", line, StringComparison.Ordinal);
        Assert.Contains("200 in", line, StringComparison.Ordinal);
        Assert.Matches(@"rules \S*sodium\.assessment", line); // rule ids of the cards issued
        Assert.Matches(@"Request \S+ POST /cds-services/\{id\}", line);
    }

    private async Task<HttpResponseMessage> SendAsync(HttpClient client, string serviceId, string body, string? token = null)
    {
        var path = "/cds-services/" + serviceId;
        token ??= _keys.Token(path, _host.Clock.GetUtcNow());
        _tokens.Add(token);
        var request = new HttpRequestMessage(HttpMethod.Post, path) { Content = new StringContent(body, Encoding.UTF8, "application/json") };
        request.Headers.Authorization = new AuthenticationHeaderValue("Bearer", token);
        return await client.SendAsync(request);
    }

    /// <summary>Scenario 01 with a distinctive patient id, family name, latest sodium value and FHIR access token.</summary>
    private static string SentinelRequest()
    {
        var scenario = ScenarioLibrary.Find("01")!;
        var text = HookCalls.Request(scenario).ToJsonString()
            .Replace(scenario.PatientId, SentinelPatient, StringComparison.Ordinal)
            .Replace("Ellery", SentinelFamily, StringComparison.Ordinal);
        var body = JsonNode.Parse(text)!.AsObject();
        foreach (var entry in body["prefetch"]!["sodium"]!["entry"]!.AsArray())
        {
            var quantity = entry!["resource"]!["valueQuantity"]!;
            if ((double)quantity["value"]! == 124)
            {
                quantity["value"] = JsonValue.Create(decimal.Parse(SentinelSodium, CultureInfo.InvariantCulture));
            }
        }

        body["fhirServer"] = "http://127.0.0.1:9/fhir";
        body["fhirAuthorization"] = new JsonObject
        {
            ["access_token"] = SentinelFhirToken, ["token_type"] = "Bearer", ["expires_in"] = 300, ["scope"] = "patient/*.read", ["subject"] = "natremia",
        };
        return body.ToJsonString();
    }

    public void Dispose()
    {
        _host.Dispose();
        _keys.Dispose();
    }
}
