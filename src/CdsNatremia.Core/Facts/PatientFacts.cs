namespace CdsNatremia.Core.Facts;

/// <summary>
/// Everything the rules know about one patient, as the FHIR layer read it. Immutable once built.
/// Lists are in no particular order; rules sort what they need.
/// </summary>
public sealed record PatientFacts
{
    /// <summary>The patient's logical id from the hook context.</summary>
    public required string PatientId { get; init; }

    /// <summary>Administrative sex, when the Patient resource was available.</summary>
    public PatientSex Sex { get; init; } = PatientSex.Unknown;

    /// <summary>Birth date, when the Patient resource was available.</summary>
    public DateOnly? BirthDate { get; init; }

    /// <summary>Usable laboratory results and weights, converted to canonical units.</summary>
    public IReadOnlyList<LabResult> Labs { get; init; } = [];

    /// <summary>Data received but not used, with reasons.</summary>
    public IReadOnlyList<SetAsideItem> SetAside { get; init; } = [];

    /// <summary>Active, not-refuted conditions.</summary>
    public IReadOnlyList<ConditionFact> Conditions { get; init; } = [];

    /// <summary>Medications the patient takes or will take (statements and active orders).</summary>
    public IReadOnlyList<MedicationFact> Medications { get; init; } = [];

    /// <summary>Notes about data gathering a clinician should read, e.g. "conditions came from the FHIR server".</summary>
    public IReadOnlyList<string> DataNotes { get; init; } = [];

    /// <summary>Categories of data that could not be obtained at all (e.g. "conditions"), with the reason.</summary>
    public IReadOnlyDictionary<string, string> Unavailable { get; init; } = new Dictionary<string, string>();

    /// <summary>Age in whole years at <paramref name="at"/>, or null when the birth date is unknown.</summary>
    public int? AgeAt(DateTimeOffset at)
    {
        if (BirthDate is not { } birth)
        {
            return null;
        }

        var today = DateOnly.FromDateTime(at.UtcDateTime);
        var age = today.Year - birth.Year;
        if (today < birth.AddYears(age))
        {
            age--;
        }

        return age < 0 ? null : age;
    }

    /// <summary>Usable results of one analyte, newest first.</summary>
    public IEnumerable<LabResult> Results(Analyte analyte)
        => Labs.Where(l => l.Analyte == analyte).OrderByDescending(l => l.EffectiveAt).ThenBy(l => l.ResourceId, StringComparer.Ordinal);

    /// <summary>The newest usable result of one analyte, or null.</summary>
    public LabResult? Latest(Analyte analyte) => Results(analyte).FirstOrDefault();
}
