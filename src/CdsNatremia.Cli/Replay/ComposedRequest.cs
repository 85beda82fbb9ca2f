using System.Text.Json.Nodes;

namespace CdsNatremia.Cli.Replay;

/// <summary>A hook request ready to send, with notes on how its prefetch was filled.</summary>
/// <param name="ServiceId">The service to send it to.</param>
/// <param name="Body">The request body.</param>
/// <param name="Notes">Template parameters that could not be applied, keys left out, and why.</param>
internal sealed record ComposedRequest(string ServiceId, JsonObject Body, IReadOnlyList<string> Notes)
{
    /// <summary>Each prefetch key's template with the context filled in (the search that selected its resources).</summary>
    public IReadOnlyDictionary<string, string> PrefetchQueries { get; init; } = new Dictionary<string, string>();
}
