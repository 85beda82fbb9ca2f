namespace CdsNatremia.Core.Facts;

/// <summary>
/// One usable or bounded laboratory result, already converted to the analyte's canonical unit.
/// Only results the FHIR layer accepted become a <see cref="LabResult"/>; the rest are <see cref="SetAsideItem"/>s.
/// A bounded result (<see cref="Comparator"/> set) is kept apart in <see cref="PatientFacts.BoundedLabs"/>, never in
/// <see cref="PatientFacts.Labs"/>, so no rule computes with a bound as if it were a measurement.
/// Immutable; equality is by value.
/// </summary>
/// <param name="ResourceId">The Observation's logical id, e.g. "na-3".</param>
/// <param name="Analyte">What was measured.</param>
/// <param name="Value">The value in <see cref="AnalyteUnits.CanonicalUnit"/>.</param>
/// <param name="EffectiveAt">When the specimen was taken (effective[x]); issued time when effective is absent.</param>
/// <param name="IsPreliminary">True when the Observation status is preliminary: counted, but labelled on the card.</param>
/// <param name="Specimen">Specimen, from the LOINC code.</param>
/// <param name="LoincCode">The LOINC code that identified the result.</param>
/// <param name="ReferenceLow">The laboratory's lower reference limit, in the canonical unit, when sent.</param>
/// <param name="ReferenceHigh">The laboratory's upper reference limit, in the canonical unit, when sent.</param>
/// <param name="OriginalValue">The value as reported, before conversion.</param>
/// <param name="OriginalUnit">The unit as reported, before conversion.</param>
/// <param name="Origin">How the result reached the service.</param>
public sealed record LabResult(
    string ResourceId,
    Analyte Analyte,
    double Value,
    DateTimeOffset EffectiveAt,
    bool IsPreliminary,
    SpecimenKind Specimen,
    string LoincCode,
    double? ReferenceLow = null,
    double? ReferenceHigh = null,
    double? OriginalValue = null,
    string? OriginalUnit = null,
    DataOrigin Origin = DataOrigin.Prefetch)
{
    /// <summary>
    /// Set when the value is a bound, not a measurement (FHIR Quantity.comparator): <see cref="Value"/> is then the bound.
    /// Null for a measurement.
    /// </summary>
    public ValueComparator? Comparator { get; init; }

    /// <summary>True when the value is a bound.</summary>
    public bool IsBounded => Comparator is not null;

    /// <summary>Identifiers of the Observation ("system|value"), used to find a correction of the same result.</summary>
    public IReadOnlyList<string> Identifiers { get; init; } = [];

    /// <summary>The canonical unit of <see cref="Value"/>.</summary>
    public string Unit => AnalyteUnits.CanonicalUnit(Analyte);

    /// <summary>"Observation/{id}", the reference a card cites.</summary>
    public string Reference => "Observation/" + ResourceId;

    /// <summary>True when the specimen is a blood-gas or point-of-care blood sample rather than laboratory serum or plasma.</summary>
    public bool IsWholeBlood => Specimen is SpecimenKind.Blood or SpecimenKind.ArterialBlood or SpecimenKind.VenousBlood or SpecimenKind.CapillaryBlood;
}
