using System.Net.Http.Json;
using System.Text;
using System.Text.Json;
using System.Text.Json.Nodes;
using CdsNatremia.Scenarios;

namespace CdsNatremia.Service.Tests.Support;

/// <summary>Builds hook requests from scenarios and posts them.</summary>
public static class HookCalls
{
    public const string ResultHook = "org.example.lab-result-arrive";

    public static string ServiceFor(string scenarioHook) => scenarioHook switch
    {
        "patient-view" => "natremia-chart-review",
        "result" => "natremia-result-review",
        "order-select" => "natremia-order-select",
        "order-sign" => "natremia-order-sign",
        _ => throw new ArgumentOutOfRangeException(nameof(scenarioHook), scenarioHook, null),
    };

    public static string HookName(string scenarioHook) => scenarioHook == "result" ? ResultHook : scenarioHook;

    public static JsonObject Request(Scenario scenario, bool includePrefetch = true)
        => HookRequestBuilder.Build(scenario, HookName(scenario.Hook), TimeSpan.Zero, Guid.NewGuid(), includePrefetch);

    public static Task<HttpResponseMessage> PostAsync(HttpClient client, string serviceId, JsonNode body)
        => client.PostAsync($"/cds-services/{serviceId}", new StringContent(body.ToJsonString(), Encoding.UTF8, "application/json"));

    public static Task<HttpResponseMessage> PostRawAsync(HttpClient client, string serviceId, string body, string contentType = "application/json")
        => client.PostAsync($"/cds-services/{serviceId}", new StringContent(body, Encoding.UTF8, contentType));

    public static async Task<JsonArray> CardsAsync(HttpResponseMessage response)
    {
        var text = await response.Content.ReadAsStringAsync();
        if (!response.IsSuccessStatusCode)
        {
            throw new InvalidOperationException($"HTTP {(int)response.StatusCode}: {text}");
        }

        return JsonNode.Parse(text)!["cards"]!.AsArray();
    }

    public static async Task<JsonArray> RunAsync(HttpClient client, Scenario scenario)
        => await CardsAsync(await PostAsync(client, ServiceFor(scenario.Hook), Request(scenario)));

    public static async Task<JsonElement> ProblemAsync(HttpResponseMessage response)
        => (await response.Content.ReadFromJsonAsync<JsonElement>());
}
