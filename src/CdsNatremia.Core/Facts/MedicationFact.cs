namespace CdsNatremia.Core.Facts;

/// <summary>
/// A medication the patient takes, will take, or is being ordered, from a MedicationStatement or MedicationRequest
/// (with its Medication resolved when the Medication was available).
/// </summary>
/// <param name="ResourceType">"MedicationStatement" or "MedicationRequest".</param>
/// <param name="ResourceId">The resource's logical id.</param>
/// <param name="ProductCodes">Codings of the product (medicationCodeableConcept or Medication.code).</param>
/// <param name="Ingredients">Ingredients from Medication.ingredient, when a Medication was resolved.</param>
/// <param name="Text">The product's text, for name matching when no code matches.</param>
/// <param name="Use">Active, intended or draft.</param>
/// <param name="StartedAt">When use started: effectivePeriod.start, effectiveDateTime, authoredOn or dateAsserted.</param>
/// <param name="StartSource">Which element gave <paramref name="StartedAt"/>, e.g. "effectivePeriod.start".</param>
/// <param name="Origin">How the record reached the service.</param>
public sealed record MedicationFact(
    string ResourceType,
    string ResourceId,
    IReadOnlyList<CodeRef> ProductCodes,
    IReadOnlyList<MedicationIngredient> Ingredients,
    string? Text,
    MedicationUse Use,
    DateTimeOffset? StartedAt,
    string? StartSource,
    DataOrigin Origin = DataOrigin.Prefetch)
{
    /// <summary>Ordered volume in mL (dose quantity), when the order gives one; used for infusion predictions.</summary>
    public double? VolumeMilliliters { get; init; }

    /// <summary>Route text or code display, e.g. "intravenous".</summary>
    public string? Route { get; init; }

    /// <summary>Free-text dosage instruction as sent.</summary>
    public string? DosageText { get; init; }

    /// <summary>
    /// Why the product could not be read (its Medication could not be resolved, no code and no text), or null when it
    /// could. A rule must not read an unreadable medicine as "not this drug": it makes a drug criterion unknown.
    /// </summary>
    public string? ProductUnreadable { get; init; }

    /// <summary>For a stopped or completed record: when use ended (effectivePeriod.end), when recorded.</summary>
    public DateTimeOffset? EndedAt { get; init; }

    /// <summary>
    /// For a stopped or completed record without an end: the latest time it is known to have been recorded
    /// (dateAsserted, effectiveDateTime, authoredOn); use ended at or before it.
    /// </summary>
    public DateTimeOffset? LastRecordedAt { get; init; }

    /// <summary>"{ResourceType}/{id}", the relative reference a delete action names.</summary>
    public string Reference => ResourceType + "/" + ResourceId;
}
