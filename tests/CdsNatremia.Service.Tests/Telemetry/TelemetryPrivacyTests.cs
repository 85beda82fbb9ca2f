using System.Diagnostics;
using System.Globalization;
using System.Net;
using System.Net.Http.Headers;
using System.Text;
using System.Text.Json.Nodes;
using CdsNatremia.Core.Cards;
using CdsNatremia.Fhir.Knowledge;
using CdsNatremia.Scenarios;
using CdsNatremia.Service.Telemetry;
using CdsNatremia.Service.Tests.Support;
using Microsoft.AspNetCore.Hosting;
using Microsoft.AspNetCore.Mvc.Testing;
using Microsoft.Extensions.DependencyInjection;
using OpenTelemetry;
using OpenTelemetry.Metrics;
using OpenTelemetry.Trace;

namespace CdsNatremia.Service.Tests.Telemetry;

/// <summary>
/// Captures everything the service exports (every span with its attributes and events, every metric with its labels)
/// over every scenario, a FHIR fetch, refusals and feedback, with OpenTelemetry's in-memory exporter, and looks for
/// patient identifiers, names, sodium values and tokens in it.
/// </summary>
[Collection(TelemetryCollection.Name)]
public sealed class TelemetryPrivacyTests : IDisposable
{
    private const string SentinelPatient = "sentinel-pt-4b8e21";
    private const string SentinelFamily = "Marrowgate";
    private const string SentinelSodium = "117.3579";
    private const string SentinelFhirToken = "fhir-access-sentinel-93c0";
    private const string AdminKey = "an-admin-key-for-telemetry-tests-0123456789";

    private readonly TestClientKeys _keys = new();
    private readonly FhirServerFake _fhir = FhirServerFake.Start();
    private readonly List<Activity> _spans = [];
    private readonly List<Metric> _metrics = [];
    private readonly List<string> _tokens = [];
    private readonly NatremiaFactory _factory;
    private readonly WebApplicationFactory<Program> _host;

    public TelemetryPrivacyTests()
    {
        var settings = _keys.InlineSettings();
        settings["Natremia:Fetching:AllowedServers:0"] = _fhir.BaseUrl;
        settings["Natremia:Fetching:AllowedServers:1"] = "http://127.0.0.1:9/fhir";
        settings["Natremia:Fetching:Budget"] = "00:00:10";
        settings["Natremia:Fetching:AttemptTimeout"] = "00:00:05";
        settings["Natremia:Audit:AdminApiKey"] = AdminKey;
        _factory = NatremiaFactory.With(settings);
        _host = _factory.WithWebHostBuilder(b => b.ConfigureServices(services =>
        {
            services.ConfigureOpenTelemetryTracerProvider(t => t.AddInMemoryExporter(_spans));
            services.ConfigureOpenTelemetryMeterProvider(m => m.AddInMemoryExporter(_metrics));
        }));
    }

    [Fact]
    public async Task EveryScenarioFetchAndRefusal_NoPatientIdNameValueOrTokenInAnySpanOrMetric()
    {
        var client = _host.CreateClient();
        var forbidden = new List<string> { SentinelPatient, SentinelFamily, SentinelFhirToken };
        var sodiumValues = new HashSet<string>(StringComparer.Ordinal) { SentinelSodium };
        await ScenarioPatientData.SendEveryScenarioAsync((service, body) => SendAsync(client, "/cds-services/" + service, body), forbidden, sodiumValues);

        // The sentinel patient, with its data fetched from the FHIR server (the query URLs name the patient).
        _fhir.ServeScenario(Sentinel());
        var fetched = await SendAsync(client, "/cds-services/natremia-chart-review", SentinelRequest(_fhir.BaseUrl, withPrefetch: false));
        var fetchedText = await fetched.Content.ReadAsStringAsync();
        Assert.Equal(HttpStatusCode.OK, fetched.StatusCode);
        Assert.Contains("117", fetchedText, StringComparison.Ordinal); // the value reached the rules
        Assert.Contains(_fhir.Requests, r => r.RequestMessage.Url.Contains(SentinelPatient, StringComparison.Ordinal)); // and the URL named the patient

        // A server that is down, one not allowlisted, a replayed token, bad input, feedback on a card.
        Assert.Equal(HttpStatusCode.PreconditionFailed, (await SendAsync(client, "/cds-services/natremia-chart-review", SentinelRequest("http://127.0.0.1:9/fhir", withPrefetch: false))).StatusCode);
        Assert.Equal(HttpStatusCode.PreconditionFailed, (await SendAsync(client, "/cds-services/natremia-chart-review", SentinelRequest("http://127.0.0.1:10/fhir", withPrefetch: false))).StatusCode);
        Assert.Equal(HttpStatusCode.Unauthorized, (await SendAsync(client, "/cds-services/natremia-chart-review", SentinelRequest(_fhir.BaseUrl, withPrefetch: true), _tokens[^1])).StatusCode);
        Assert.Equal(HttpStatusCode.BadRequest, (await SendAsync(client, "/cds-services/natremia-chart-review", SentinelRequest(_fhir.BaseUrl, withPrefetch: true)[..^30])).StatusCode);
        var card = JsonNode.Parse(fetchedText)!["cards"]![0]!;
        var feedback = FeedbackCalls.Body(FeedbackCalls.Overridden((string)card["uuid"]!, _factory.Clock.GetUtcNow()));
        Assert.Equal(HttpStatusCode.OK, (await SendAsync(client, "/cds-services/natremia-chart-review/feedback", feedback.ToJsonString())).StatusCode);

        Flush();
        var exported = Exported();

        // What was exported is there (so the search below searches something real).
        Assert.Contains(_spans, s => s.Kind == ActivityKind.Server && s.DisplayName.Contains("/cds-services/{id}", StringComparison.Ordinal));
        Assert.Contains(_spans, s => s.Kind == ActivityKind.Client && (s.GetTagItem("url.full") as string) == _fhir.Origin); // FHIR calls, URL cut to the origin
        Assert.Contains(_spans, s => s.Source.Name == NatremiaTelemetry.Name && s.DisplayName == "rules evaluate");
        Assert.Contains(_spans, s => s.Source.Name == NatremiaTelemetry.Name && s.DisplayName == "audit write");
        foreach (var name in new[] { "natremia.answers", "natremia.cards", "natremia.set_aside", "natremia.fhir.fetches", "natremia.audit.write.duration", "natremia.rules.duration", "natremia.replay.refusals", "http.server.request.duration", "http.client.request.duration" })
        {
            Assert.Contains(_metrics, m => m.Name == name);
        }

        Assert.True(exported.Count > 500, $"only {exported.Count} strings exported");
        foreach (var text in exported)
        {
            foreach (var value in forbidden.Distinct(StringComparer.Ordinal))
            {
                Assert.False(text.Contains(value, StringComparison.OrdinalIgnoreCase), $"telemetry carries '{value}': {text}");
            }

            foreach (var token in _tokens)
            {
                Assert.False(text.Contains(token.Split('.')[2], StringComparison.Ordinal), $"telemetry carries a bearer token: {text}");
            }

            foreach (var value in sodiumValues)
            {
                Assert.False(text == value || text.EndsWith("=" + value, StringComparison.Ordinal) || text.Contains(value + " mmol", StringComparison.Ordinal), $"telemetry carries sodium value {value}: {text}");
            }
        }

        Assert.DoesNotContain(exported, t => t.Contains(SentinelSodium, StringComparison.Ordinal));
    }

    [Fact]
    public async Task ServiceMetrics_AfterEveryScenario_LabelsOnlyFromTheirFixedSets()
    {
        var client = _host.CreateClient();
        foreach (var scenario in ScenarioLibrary.All)
        {
            Assert.Equal(HttpStatusCode.OK, (await SendAsync(client, "/cds-services/" + HookCalls.ServiceFor(scenario.Hook), HookCalls.Request(scenario).ToJsonString())).StatusCode);
        }

        Assert.Equal(HttpStatusCode.NotFound, (await SendAsync(client, "/cds-services/no-such-service-" + SentinelPatient, "{}")).StatusCode);
        Flush();

        var services = new HashSet<string>(StringComparer.Ordinal) { "natremia-chart-review", "natremia-result-review", "natremia-order-select", "natremia-order-sign", NatremiaTelemetry.Other };
        var allowed = new Dictionary<string, IReadOnlySet<string>>(StringComparer.Ordinal)
        {
            ["natremia.service"] = services,
            ["natremia.call"] = new HashSet<string>(StringComparer.Ordinal) { "hook", "feedback", NatremiaTelemetry.Other },
            ["natremia.card.topic"] = new HashSet<string>(CardTopics.All(_host.Services.GetRequiredService<LoadedKnowledge>().Base).Select(t => t.Code).Append(NatremiaTelemetry.Other), StringComparer.Ordinal),
            ["natremia.card.indicator"] = new HashSet<string>(StringComparer.Ordinal) { "info", "warning", "critical" },
            ["natremia.reason"] = new HashSet<string>(SetAsideReasons.Classes, StringComparer.Ordinal),
            ["outcome"] = new HashSet<string>(NatremiaTelemetry.FetchOutcomes.Append("ok").Append("failed"), StringComparer.Ordinal),
            ["natremia.audit.store"] = new HashSet<string>(StringComparer.Ordinal) { "sqlite", "postgresql", NatremiaTelemetry.Other },
            ["natremia.hook"] = new HashSet<string>(StringComparer.Ordinal) { "patient-view", HookCalls.ResultHook, "order-select", "order-sign" },
        };

        var seen = new HashSet<string>(StringComparer.Ordinal);
        foreach (var metric in _metrics.Where(m => m.MeterName == NatremiaTelemetry.Name))
        {
            foreach (ref readonly var point in metric.GetMetricPoints())
            {
                foreach (var tag in point.Tags)
                {
                    if (tag.Key == "http.response.status_code")
                    {
                        Assert.IsType<int>(tag.Value);
                        continue;
                    }

                    Assert.True(allowed.TryGetValue(tag.Key, out var values), $"{metric.Name}: unexpected label {tag.Key}");
                    Assert.True(values.Contains((string)tag.Value!), $"{metric.Name}: label {tag.Key}={tag.Value} is not in its fixed set");
                    seen.Add($"{metric.Name}|{tag.Key}={tag.Value}");
                }
            }
        }

        Assert.Contains("natremia.answers|natremia.service=natremia-chart-review", seen);
        Assert.Contains("natremia.answers|natremia.service=other", seen); // the unknown id was folded, not echoed
        Assert.Contains("natremia.cards|natremia.card.topic=sodium-assessment", seen);
        Assert.Contains("natremia.cards|natremia.card.indicator=critical", seen); // scenario 01: sodium 124, profound
        Assert.Contains(seen, s => s.StartsWith("natremia.set_aside|natremia.reason=", StringComparison.Ordinal) && !s.EndsWith("=other", StringComparison.Ordinal));
    }

    private void Flush()
    {
        Assert.True(_host.Services.GetRequiredService<TracerProvider>().ForceFlush(10_000));
        // The pull (Prometheus) reader reports false for a push flush; the in-memory reader is flushed all the same.
        _host.Services.GetRequiredService<MeterProvider>().ForceFlush(10_000);
        Assert.NotEmpty(_metrics);
    }

    /// <summary>Every string the exporters received: span names, attribute keys and values, events, status, metric names and labels.</summary>
    private List<string> Exported()
    {
        var texts = new List<string>();
        foreach (var span in _spans)
        {
            texts.Add(span.DisplayName);
            texts.Add(span.OperationName);
            texts.Add(span.StatusDescription ?? string.Empty);
            texts.Add(span.TraceStateString ?? string.Empty);
            texts.AddRange(span.TagObjects.Select(t => $"{t.Key}={Convert.ToString(t.Value, CultureInfo.InvariantCulture)}"));
            texts.AddRange(span.Baggage.Select(b => $"{b.Key}={b.Value}"));
            foreach (var e in span.Events)
            {
                texts.Add(e.Name);
                texts.AddRange(e.Tags.Select(t => $"{t.Key}={Convert.ToString(t.Value, CultureInfo.InvariantCulture)}"));
            }
        }

        foreach (var metric in _metrics)
        {
            texts.Add(metric.Name);
            texts.Add(metric.Description ?? string.Empty);
            foreach (ref readonly var point in metric.GetMetricPoints())
            {
                foreach (var tag in point.Tags)
                {
                    texts.Add($"{tag.Key}={Convert.ToString(tag.Value, CultureInfo.InvariantCulture)}");
                }
            }
        }

        return texts;
    }

    private async Task<HttpResponseMessage> SendAsync(HttpClient client, string path, string body, string? token = null)
    {
        token ??= _keys.Token(path, _factory.Clock.GetUtcNow());
        _tokens.Add(token);
        var request = new HttpRequestMessage(HttpMethod.Post, path) { Content = new StringContent(body, Encoding.UTF8, "application/json") };
        request.Headers.Authorization = new AuthenticationHeaderValue("Bearer", token);
        return await client.SendAsync(request);
    }

    /// <summary>Scenario 01 as the sentinel patient: distinctive id, family name and latest sodium value.</summary>
    private static Scenario Sentinel()
    {
        var scenario = ScenarioLibrary.Find("01")!;
        var bundle = scenario.BundleJson
            .Replace(scenario.PatientId, SentinelPatient, StringComparison.Ordinal)
            .Replace("Ellery", SentinelFamily, StringComparison.Ordinal)
            .Replace("\"value\":124", "\"value\":" + SentinelSodium, StringComparison.Ordinal)
            .Replace("\"value\": 124", "\"value\": " + SentinelSodium, StringComparison.Ordinal);
        Assert.Contains(SentinelSodium, bundle, StringComparison.Ordinal);
        return scenario with { PatientId = SentinelPatient, BundleJson = bundle };
    }

    private static string SentinelRequest(string fhirServer, bool withPrefetch)
    {
        var body = HookCalls.Request(Sentinel(), withPrefetch);
        body["fhirServer"] = fhirServer;
        body["fhirAuthorization"] = new JsonObject
        {
            ["access_token"] = SentinelFhirToken, ["token_type"] = "Bearer", ["expires_in"] = 300, ["scope"] = "patient/*.read", ["subject"] = "natremia",
        };
        return body.ToJsonString();
    }

    public void Dispose()
    {
        _host.Dispose();
        _factory.Dispose();
        _fhir.Dispose();
        _keys.Dispose();
    }
}
