namespace CdsNatremia.Core.Workup;

/// <summary>One SIADH essential criterion with its state and the data behind it (card Markdown, already escaped).</summary>
/// <param name="Name">The criterion, e.g. "Effective serum osmolality &lt; 275 mOsm/kg".</param>
/// <param name="Status">Met, not met, unknown or for the clinician.</param>
/// <param name="Data">The data it rests on.</param>
public sealed record SiadhCriterion(string Name, CriterionStatus Status, string Data)
{
    /// <summary>The state as cards print it.</summary>
    public string StatusText => Status switch
    {
        CriterionStatus.Met => "met",
        CriterionStatus.NotMet => "not met",
        CriterionStatus.Unknown => "unknown",
        CriterionStatus.CouldNotBeRead => "unknown (could not be read)",
        _ => "for the clinician to assess",
    };

    /// <summary>The data as printed after the state: a criterion that could not be read does not say so twice.</summary>
    public string DataText => Status == CriterionStatus.CouldNotBeRead && Data.StartsWith(CouldNotBeReadPrefix, StringComparison.Ordinal)
        ? Data[CouldNotBeReadPrefix.Length..]
        : Data;

    private const string CouldNotBeReadPrefix = "could not be read: ";
}
