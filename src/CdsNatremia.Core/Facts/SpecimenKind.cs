namespace CdsNatremia.Core.Facts;

/// <summary>Where a result was measured. Blood-gas (direct ion-selective electrode) and laboratory sodium can differ by a few mmol/L.</summary>
public enum SpecimenKind
{
    /// <summary>Serum or plasma, the usual laboratory specimen.</summary>
    SerumOrPlasma,
    /// <summary>Whole blood of unstated origin.</summary>
    Blood,
    /// <summary>Arterial blood (blood gas).</summary>
    ArterialBlood,
    /// <summary>Venous blood (blood gas).</summary>
    VenousBlood,
    /// <summary>Capillary blood (point of care).</summary>
    CapillaryBlood,
    /// <summary>Serum, plasma or blood (the LOINC code does not say which).</summary>
    SerumPlasmaOrBlood,
    /// <summary>Urine.</summary>
    Urine,
    /// <summary>Not a specimen: a measurement on the patient (e.g. weight).</summary>
    NotApplicable,
}
