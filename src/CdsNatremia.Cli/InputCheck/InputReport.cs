namespace CdsNatremia.Cli.InputCheck;

/// <summary>The outcome of checking one Bundle.</summary>
/// <param name="PatientId">The patient the service would be asked about.</param>
/// <param name="Resources">One verdict per entry, in Bundle order.</param>
/// <param name="Problems">Structural problems of the Bundle itself.</param>
internal sealed record InputReport(string? PatientId, IReadOnlyList<ResourceVerdict> Resources, IReadOnlyList<string> Problems)
{
    /// <summary>True when the Bundle is readable and every entry is valid FHIR R4 the service can read.</summary>
    public bool Readable => Unusable is null && Problems.Count == 0 && Resources.All(r => r.Verdict != "unreadable" && r.FhirIssues.Count == 0);

    /// <summary>Why the file cannot be checked at all (not JSON, not a Bundle), with the line and column; null when it can.</summary>
    public string? Unusable { get; init; }
}
