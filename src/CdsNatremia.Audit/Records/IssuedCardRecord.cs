namespace CdsNatremia.Audit.Records;

/// <summary>
/// The audit record of one card as it was sent: what was shown, by which rules and knowledge, from which data. The
/// patient appears only as a keyed pseudonym.
/// </summary>
public sealed record IssuedCardRecord
{
    /// <summary>The card uuid sent to the EHR.</summary>
    public required Guid CardUuid { get; init; }

    /// <summary>The CDS service id that issued it, e.g. "natremia-chart-review".</summary>
    public required string ServiceId { get; init; }

    /// <summary>The hook name, e.g. "patient-view".</summary>
    public required string Hook { get; init; }

    /// <summary>The hookInstance of the request.</summary>
    public required Guid HookInstance { get; init; }

    /// <summary>HMAC-SHA256 of the patient id (lowercase hex); never the id itself.</summary>
    public required string PatientPseudonym { get; init; }

    /// <summary>The id of the key that made <see cref="PatientPseudonym"/> (empty for records made before key ids were kept).</summary>
    public string PseudonymKeyId { get; init; } = string.Empty;

    /// <summary>The rule ids that produced the card.</summary>
    public required IReadOnlyList<string> RuleIds { get; init; }

    /// <summary>The knowledge version (covers every knowledge file loaded).</summary>
    public required string KnowledgeVersion { get; init; }

    /// <summary>The service's software version.</summary>
    public required string SoftwareVersion { get; init; }

    /// <summary>info, warning or critical.</summary>
    public required string Indicator { get; init; }

    /// <summary>The card topic code.</summary>
    public required string Topic { get; init; }

    /// <summary>The summary as sent.</summary>
    public required string Summary { get; init; }

    /// <summary>Relative references of the FHIR resources the card used (the patient's own reference removed).</summary>
    public required IReadOnlyList<string> ResourcesUsed { get; init; }

    /// <summary>Suggestion uuid by suggestion key.</summary>
    public required IReadOnlyDictionary<string, Guid> SuggestionUuids { get; init; }

    /// <summary>The card's findings fingerprint (a hash of what it found, no patient data in clear), or null.</summary>
    public string? FindingsFingerprint { get; init; }

    /// <summary>When the card was issued (from the host's TimeProvider).</summary>
    public required DateTimeOffset IssuedAt { get; init; }

    /// <summary>
    /// True when the request was marked as test traffic (the toolkit's marker, docs/audit.md): the card is kept in the
    /// trail like any other but reports leave it out unless asked to include test traffic.
    /// </summary>
    public bool TestTraffic { get; init; }
}
