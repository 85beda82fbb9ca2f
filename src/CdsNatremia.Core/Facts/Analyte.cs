namespace CdsNatremia.Core.Facts;

/// <summary>
/// A laboratory quantity the rules read. Each analyte has one canonical unit (see <see cref="AnalyteUnits"/>);
/// the FHIR layer converts every accepted unit to it and sets aside any unit it does not know.
/// </summary>
public enum Analyte
{
    /// <summary>Sodium in serum, plasma or blood, mmol/L. The specimen is kept in <see cref="LabResult.Specimen"/>.</summary>
    Sodium,
    /// <summary>Sodium concentration in a spot urine, mmol/L.</summary>
    UrineSodium,
    /// <summary>Measured serum or plasma osmolality, mOsm/kg.</summary>
    SerumOsmolality,
    /// <summary>Urine osmolality, mOsm/kg.</summary>
    UrineOsmolality,
    /// <summary>Glucose in serum, plasma or blood, canonical mmol/L.</summary>
    Glucose,
    /// <summary>Urea, canonical mmol/L of urea (urea nitrogen in mg/dL is divided by 2.8).</summary>
    Urea,
    /// <summary>Serum or plasma potassium, mmol/L.</summary>
    Potassium,
    /// <summary>Urine potassium, mmol/L.</summary>
    UrinePotassium,
    /// <summary>Serum or plasma creatinine, canonical µmol/L.</summary>
    Creatinine,
    /// <summary>Serum or plasma triglyceride, canonical mmol/L.</summary>
    Triglyceride,
    /// <summary>Serum or plasma total protein, canonical g/L.</summary>
    TotalProtein,
    /// <summary>Serum or plasma albumin, canonical g/L.</summary>
    Albumin,
    /// <summary>Thyrotropin (TSH), canonical mIU/L.</summary>
    Thyrotropin,
    /// <summary>Serum or plasma cortisol, canonical nmol/L.</summary>
    Cortisol,
    /// <summary>Body weight, canonical kg.</summary>
    BodyWeight,
}
