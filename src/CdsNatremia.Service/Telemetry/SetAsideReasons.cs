namespace CdsNatremia.Service.Telemetry;

/// <summary>
/// Folds the FHIR layer's set-aside reasons (plain sentences, which may name a unit or a status) onto a small fixed
/// set of classes for the <c>natremia.set_aside</c> metric. The sentence itself never becomes a label.
/// </summary>
public static class SetAsideReasons
{
    /// <summary>Every class <see cref="Classify"/> returns.</summary>
    public static IReadOnlyList<string> Classes { get; } =
    [
        "other-patient", "no-subject", "status", "absent", "no-value", "comparator", "no-time", "future-time",
        "no-unit", "unit", "implausible", "rate-not-concentration", "unreadable", "no-id", "unresolved-medication", NatremiaTelemetry.Other,
    ];

    /// <summary>The class of one reason sentence; <see cref="NatremiaTelemetry.Other"/> when none fits.</summary>
    public static string Classify(string? reason)
    {
        if (string.IsNullOrEmpty(reason))
        {
            return NatremiaTelemetry.Other;
        }

        bool Has(string text) => reason.Contains(text, StringComparison.OrdinalIgnoreCase);
        return reason switch
        {
            _ when Has("not the patient") => "other-patient",
            _ when Has("no subject") => "no-subject",
            _ when reason.StartsWith("status ", StringComparison.Ordinal) => "status",
            _ when Has("dataAbsentReason") => "absent",
            _ when Has("no numeric quantity") => "no-value",
            _ when Has("comparator") => "comparator",
            _ when Has("no time") => "no-time",
            _ when Has("in the future") => "future-time",
            _ when Has("no unit") => "no-unit",
            _ when Has("plausible range") => "implausible",
            _ when Has("unit '") => "unit",
            _ when Has("is a rate") => "rate-not-concentration",
            _ when Has("could not be interpreted") => "unreadable",
            _ when Has("has no id") => "no-id",
            _ when Has("Medication resource was not") => "unresolved-medication",
            _ => NatremiaTelemetry.Other,
        };
    }
}
