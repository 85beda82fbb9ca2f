namespace CdsNatremia.Cli.Replay;

/// <summary>One service as a CDS Hooks discovery document lists it.</summary>
/// <param name="Id">The service id (URL segment).</param>
/// <param name="Hook">The hook it answers.</param>
/// <param name="Title">Its title, when given.</param>
/// <param name="Prefetch">Prefetch templates by key (empty when none).</param>
internal sealed record DiscoveredService(string Id, string Hook, string? Title, IReadOnlyDictionary<string, string> Prefetch)
{
    /// <summary>True for an organisation-specific hook named in reverse-domain notation (e.g. org.example.lab-result-arrive).</summary>
    public bool IsResultHook => Hook.EndsWith(".lab-result-arrive", StringComparison.Ordinal);
}
