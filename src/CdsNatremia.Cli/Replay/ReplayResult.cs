using System.Text.Json.Nodes;

namespace CdsNatremia.Cli.Replay;

/// <summary>What the service answered to one replayed request.</summary>
/// <param name="Input">Name of the input (scenario id or file).</param>
/// <param name="ServiceId">The service called.</param>
/// <param name="Status">HTTP status code.</param>
/// <param name="Body">The parsed response body, or null when it was not JSON.</param>
/// <param name="Notes">How prefetch was filled: template parameters not applied, keys left out, and why.</param>
internal sealed record ReplayResult(string Input, string ServiceId, int Status, JsonNode? Body, IReadOnlyList<string> Notes)
{
    /// <summary>The prefetch sent (null when none was), as built from the service's templates.</summary>
    public JsonObject? Prefetch { get; init; }

    /// <summary>Each prefetch key's search, context filled in.</summary>
    public IReadOnlyDictionary<string, string> PrefetchQueries { get; init; } = new Dictionary<string, string>();

    /// <summary>With a loopback FHIR server (--no-prefetch): every request the service made to it, in order, with the status.</summary>
    public IReadOnlyList<string> FhirRequests { get; init; } = [];

    /// <summary>The cards, or an empty array when the answer had none.</summary>
    public JsonArray Cards => Body?["cards"] as JsonArray ?? [];

    /// <summary>The sodium assessment card (topic code "sodium-assessment"), or null.</summary>
    public JsonObject? AssessmentCard => Cards.OfType<JsonObject>().FirstOrDefault(c => (string?)c["source"]?["topic"]?["code"] == "sodium-assessment");
}
