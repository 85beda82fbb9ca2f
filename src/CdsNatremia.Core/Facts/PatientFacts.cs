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

    /// <summary>Usable laboratory results and weights, converted to canonical units. Measurements only: never a bound.</summary>
    public IReadOnlyList<LabResult> Labs { get; init; } = [];

    /// <summary>Results whose value is a bound (comparator &lt;, &lt;=, &gt;, &gt;=), in canonical units; never used for a rate.</summary>
    public IReadOnlyList<LabResult> BoundedLabs { get; init; } = [];

    /// <summary>Data received but not used, with reasons.</summary>
    public IReadOnlyList<SetAsideItem> SetAside { get; init; } = [];

    /// <summary>Active, not-refuted conditions.</summary>
    public IReadOnlyList<ConditionFact> Conditions { get; init; } = [];

    /// <summary>Medications the patient takes or will take (statements and active orders).</summary>
    public IReadOnlyList<MedicationFact> Medications { get; init; } = [];

    /// <summary>
    /// Medicines recorded as stopped or completed (any date). The rules filter by their own look-back, because prefetch
    /// tokens cannot express dates.
    /// </summary>
    public IReadOnlyList<MedicationFact> StoppedMedications { get; init; } = [];

    /// <summary>
    /// Set when the sodium history could not be had (no prefetch and no FHIR server), with the reason: the assessment then
    /// rests on the results that arrived with the request, and checks that need the history cannot be made.
    /// </summary>
    public string? SodiumHistoryUnavailable { get; init; }

    /// <summary>How many received items were about another patient (counted only; never shown, never used).</summary>
    public int AboutAnotherPatientCount => SetAside.Count(s => s.State == FactState.NotThisPatient);

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

    /// <summary>
    /// The newest result of one analyte taken no earlier than <paramref name="from"/>, with its state: the newest
    /// measurement or bound (usable or bounded); otherwise an item of that analyte set aside as unreadable (at that time or
    /// with no time), or only another patient's (not this patient's); otherwise absent. Superseded and withdrawn results
    /// never count: their correction, or nothing, stands.
    /// </summary>
    /// <param name="analyte">The analyte.</param>
    /// <param name="from">The earliest time that counts; null for any time.</param>
    public Observed<LabResult> Observe(Analyte analyte, DateTimeOffset? from = null)
    {
        bool InWindow(DateTimeOffset? at) => from is not { } f || at is not { } a || a >= f;
        var newest = Labs.Concat(BoundedLabs)
            .Where(l => l.Analyte == analyte && InWindow(l.EffectiveAt))
            .OrderByDescending(l => l.EffectiveAt)
            .ThenBy(l => l.IsBounded)
            .ThenBy(l => l.ResourceId, StringComparer.Ordinal)
            .FirstOrDefault();
        if (newest is not null)
        {
            return newest.IsBounded ? Observed<LabResult>.Bounded(newest) : Observed<LabResult>.Usable(newest);
        }

        var name = AnalyteUnits.DisplayName(analyte).ToLowerInvariant();
        var unreadable = SetAside
            .Where(s => s.Analyte == analyte && s.State == FactState.Unreadable && InWindow(s.At))
            .OrderByDescending(s => s.At ?? DateTimeOffset.MaxValue)
            .FirstOrDefault();
        if (unreadable is not null)
        {
            return Observed<LabResult>.Unreadable(Rendering.PhraseCatalogue.Default.Render(Findings.Finding.Of("cite.observed.set-aside", Findings.Slot.Verbatim("name", name), Findings.Slot.Verbatim("reference", unreadable.Reference), Findings.Slot.Verbatim("reason", unreadable.Reason)), Text.TimeDisplay.Utc(DateTimeOffset.UnixEpoch)));
        }

        return SetAside.Any(s => s.Analyte == analyte && s.State == FactState.NotThisPatient)
            ? Observed<LabResult>.NotThisPatient()
            : Observed<LabResult>.Absent(Rendering.PhraseCatalogue.Default.Render(Findings.Finding.Of("cite.observed.absent", Findings.Slot.Verbatim("name", name)), Text.TimeDisplay.Utc(DateTimeOffset.UnixEpoch)));
    }
}
