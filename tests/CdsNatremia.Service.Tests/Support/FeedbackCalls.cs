using System.Text;
using System.Text.Json.Nodes;
using CdsNatremia.Audit.Storage;
using CdsNatremia.Scenarios;
using Microsoft.Extensions.DependencyInjection;

namespace CdsNatremia.Service.Tests.Support;

/// <summary>Runs a scenario to get real issued cards, and posts CDS Hooks feedback about them.</summary>
public static class FeedbackCalls
{
    public const string ChartReview = "natremia-chart-review";

    /// <summary>
    /// Runs a scenario with its dates moved five days back, so its latest sodium is stale (older than the default
    /// 72 hours) and the card carries a "recheck sodium" suggestion that feedback can accept.
    /// </summary>
    public static async Task<JsonArray> IssueAsync(HttpClient client, string scenarioId = "01")
        => await HookCalls.CardsAsync(await HookCalls.PostAsync(client, HookCalls.ServiceFor(ScenarioLibrary.Find(scenarioId)!.Hook), StaleRequest(scenarioId)));

    /// <summary>The scenario's request with dates five days back (see <see cref="IssueAsync"/>).</summary>
    public static JsonObject StaleRequest(string scenarioId = "01")
    {
        var scenario = ScenarioLibrary.Find(scenarioId)!;
        return HookRequestBuilder.Build(scenario, HookCalls.HookName(scenario.Hook), TimeSpan.FromDays(-5), Guid.NewGuid());
    }

    public static JsonObject Accepted(JsonNode card, DateTimeOffset at) => new()
    {
        ["card"] = (string)card["uuid"]!,
        ["outcome"] = "accepted",
        ["acceptedSuggestions"] = new JsonArray(new JsonObject { ["id"] = (string)card["suggestions"]![0]!["uuid"]! }),
        ["outcomeTimestamp"] = at.UtcDateTime.ToString("yyyy-MM-dd'T'HH:mm:ss'Z'", System.Globalization.CultureInfo.InvariantCulture),
    };

    public static JsonObject Overridden(string cardUuid, DateTimeOffset at, string? reason = "benefit-outweighs-risk") => new JsonObject
    {
        ["card"] = cardUuid,
        ["outcome"] = "overridden",
        ["outcomeTimestamp"] = at.UtcDateTime.ToString("yyyy-MM-dd'T'HH:mm:ss'Z'", System.Globalization.CultureInfo.InvariantCulture),
    }.WithReason(reason);

    public static JsonObject Body(params JsonObject[] entries) => new() { ["feedback"] = new JsonArray(entries.Select(e => (JsonNode)e).ToArray()) };

    public static Task<HttpResponseMessage> PostAsync(HttpClient client, JsonNode body, string serviceId = ChartReview)
        => client.PostAsync($"/cds-services/{serviceId}/feedback", new StringContent(body.ToJsonString(), Encoding.UTF8, "application/json"));

    public static IAuditStore Store(NatremiaFactory factory) => factory.Services.GetRequiredService<IAuditStore>();

    private static JsonObject WithReason(this JsonObject entry, string? reason)
    {
        if (reason is not null)
        {
            entry["overrideReason"] = new JsonObject
            {
                ["reason"] = new JsonObject { ["system"] = "https://cdsnatremia.example.org/fhir/CodeSystem/override-reason", ["code"] = reason },
            };
        }

        return entry;
    }
}
