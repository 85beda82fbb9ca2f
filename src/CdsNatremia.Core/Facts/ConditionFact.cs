namespace CdsNatremia.Core.Facts;

/// <summary>An active, not-refuted Condition from the patient's record.</summary>
/// <param name="ResourceId">The Condition's logical id.</param>
/// <param name="Codes">Every coding of Condition.code.</param>
/// <param name="Text">Condition.code.text or the first display.</param>
/// <param name="OnsetAt">onsetDateTime or onsetPeriod.start, when sent.</param>
public sealed record ConditionFact(string ResourceId, IReadOnlyList<CodeRef> Codes, string? Text, DateTimeOffset? OnsetAt)
{
    /// <summary>"Condition/{id}".</summary>
    public string Reference => "Condition/" + ResourceId;
}
