namespace CdsNatremia.Core.Engine;

/// <summary>
/// The prefetch keys the services declare in discovery, and the FHIR query template of each. Tokens are CDS Hooks
/// prefetch tokens; queries use only what the standard allows (type search, reference and token parameters, _sort, _count).
/// </summary>
public static class PrefetchKeys
{
    /// <summary>The patient (age and sex).</summary>
    public const string Patient = "patient";

    /// <summary>Serum, plasma and blood sodium, newest first.</summary>
    public const string Sodium = "sodium";

    /// <summary>Other laboratory results the work-up reads (osmolality, glucose, urea, urine studies, potassium, lipids, protein, TSH, cortisol).</summary>
    public const string Labs = "labs";

    /// <summary>The latest body weight.</summary>
    public const string Weight = "weight";

    /// <summary>Active conditions.</summary>
    public const string Conditions = "conditions";

    /// <summary>Medication statements: in use, intended, on hold, and stopped or completed (the rules keep only those that stopped recently).</summary>
    public const string MedicationStatements = "medicationStatements";

    /// <summary>Medication orders: active, on hold, and stopped or completed (filtered by date in code: tokens cannot express dates).</summary>
    public const string MedicationRequests = "medicationRequests";

    private const string Loinc = "http://loinc.org|";

    private static readonly string SodiumCodes = string.Join(",", new[] { "2951-2", "2947-0", "32717-1", "39791-9", "39792-7", "77139-4" }.Select(c => Loinc + c));

    private static readonly string LabCodes = string.Join(",", new[]
    {
        "2692-2", "2695-5", "2955-3", "2345-7", "2339-0", "14749-6", "3094-0", "14937-7", "22664-7", "3091-6",
        "2823-3", "2828-2", "2160-0", "2571-8", "2885-2", "1751-7", "3016-3", "11579-0", "11580-8", "2143-6",
    }.Select(c => Loinc + c));

    /// <summary>Every template, by key.</summary>
    public static IReadOnlyDictionary<string, string> Templates { get; } = new Dictionary<string, string>(StringComparer.Ordinal)
    {
        [Patient] = "Patient/{{context.patientId}}",
        [Sodium] = $"Observation?patient={{{{context.patientId}}}}&code={SodiumCodes}&_sort=-date&_count=100",
        [Labs] = $"Observation?patient={{{{context.patientId}}}}&code={LabCodes}&_sort=-date&_count=200",
        [Weight] = "Observation?patient={{context.patientId}}&code=http://loinc.org|29463-7&_sort=-date&_count=1",
        [Conditions] = "Condition?patient={{context.patientId}}&clinical-status=active",
        [MedicationStatements] = "MedicationStatement?patient={{context.patientId}}&status=active,intended,on-hold,stopped,completed",
        [MedicationRequests] = "MedicationRequest?patient={{context.patientId}}&status=active,on-hold,stopped,completed",
    };
}
