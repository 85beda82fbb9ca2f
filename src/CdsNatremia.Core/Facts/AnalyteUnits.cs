namespace CdsNatremia.Core.Facts;

/// <summary>The canonical unit and a reader's name for each <see cref="Analyte"/>.</summary>
public static class AnalyteUnits
{
    /// <summary>The unit every value of this analyte is held in after conversion.</summary>
    public static string CanonicalUnit(Analyte analyte) => analyte switch
    {
        Analyte.Sodium or Analyte.UrineSodium or Analyte.Glucose or Analyte.Urea or Analyte.Potassium
            or Analyte.UrinePotassium or Analyte.Triglyceride => "mmol/L",
        Analyte.SerumOsmolality or Analyte.UrineOsmolality => "mOsm/kg",
        Analyte.Creatinine => "µmol/L",
        Analyte.TotalProtein or Analyte.Albumin => "g/L",
        Analyte.Thyrotropin => "mIU/L",
        Analyte.Cortisol => "nmol/L",
        Analyte.BodyWeight => "kg",
        _ => throw new ArgumentOutOfRangeException(nameof(analyte), analyte, null),
    };

    /// <summary>The name a clinician reads on a card.</summary>
    public static string DisplayName(Analyte analyte) => analyte switch
    {
        Analyte.Sodium => "Sodium",
        Analyte.UrineSodium => "Urine sodium",
        Analyte.SerumOsmolality => "Serum osmolality",
        Analyte.UrineOsmolality => "Urine osmolality",
        Analyte.Glucose => "Glucose",
        Analyte.Urea => "Urea",
        Analyte.Potassium => "Potassium",
        Analyte.UrinePotassium => "Urine potassium",
        Analyte.Creatinine => "Creatinine",
        Analyte.Triglyceride => "Triglyceride",
        Analyte.TotalProtein => "Total protein",
        Analyte.Albumin => "Albumin",
        Analyte.Thyrotropin => "TSH",
        Analyte.Cortisol => "Cortisol",
        Analyte.BodyWeight => "Body weight",
        _ => throw new ArgumentOutOfRangeException(nameof(analyte), analyte, null),
    };
}
