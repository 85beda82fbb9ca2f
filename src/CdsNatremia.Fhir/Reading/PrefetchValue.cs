namespace CdsNatremia.Fhir.Reading;

/// <summary>The outcome of reading one prefetch key (or one fetched query).</summary>
/// <param name="Key">The prefetch key.</param>
/// <param name="Kind">What it held.</param>
/// <param name="Resources">The resources read from it.</param>
/// <param name="Problems">Entries or the whole value that could not be used, each with its reason.</param>
/// <param name="NextLink">The Bundle's "next" link, when it has one (paging).</param>
public sealed record PrefetchValue(
    string Key,
    PrefetchValueKind Kind,
    IReadOnlyList<ParsedResource> Resources,
    IReadOnlyList<string> Problems,
    string? NextLink = null)
{
    /// <summary>Observation entries that did not parse, with what their raw JSON still tells (code, time, subject).</summary>
    public IReadOnlyList<UnreadableObservation> UnreadableObservations { get; init; } = [];
}
