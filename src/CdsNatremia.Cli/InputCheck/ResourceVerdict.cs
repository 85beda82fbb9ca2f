namespace CdsNatremia.Cli.InputCheck;

/// <summary>What the service will do with one resource of a Bundle, and why.</summary>
/// <param name="Reference">"Observation/na-1", or "entry 3" when it has no type or id.</param>
/// <param name="Verdict">"used", "used-stale", "set-aside", "ignored" or "unreadable".</param>
/// <param name="Reason">Why, in plain words.</param>
/// <param name="PrefetchKeys">The prefetch keys whose templates select it (empty: an EHR filling prefetch would not send it).</param>
internal sealed record ResourceVerdict(string Reference, string Verdict, string Reason, IReadOnlyList<string> PrefetchKeys)
{
    /// <summary>Where the resource is not valid FHIR R4 JSON (strict Firely parse); empty when valid.</summary>
    public IReadOnlyList<string> FhirIssues { get; init; } = [];
}
