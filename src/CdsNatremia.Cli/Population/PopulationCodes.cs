namespace CdsNatremia.Cli.Population;

/// <summary>
/// The only codes the generator writes. LOINC and RxNorm codes are from the project's clinical reference sheet
/// ("LOINC" and "Medication codes" tables, status verified); SNOMED CT condition
/// codes and the loop-diuretic and proton-pump-inhibitor RxNorm codes are concepts listed in profiles/valuesets.
/// A test checks every code here against those files.
/// </summary>
internal static class PopulationCodes
{
    public const string Loinc = "http://loinc.org";
    public const string RxNorm = "http://www.nlm.nih.gov/research/umls/rxnorm";
    public const string Snomed = "http://snomed.info/sct";

    /// <summary>Laboratory codes: LOINC code, display, UCUM unit.</summary>
    public static readonly IReadOnlyDictionary<string, (string Code, string Display, string Unit)> Labs = new Dictionary<string, (string, string, string)>(StringComparer.Ordinal)
    {
        ["sodium"] = ("2951-2", "Sodium [Moles/volume] in Serum or Plasma", "mmol/L"),
        ["sodium-blood"] = ("2947-0", "Sodium [Moles/volume] in Blood", "mmol/L"),
        ["potassium"] = ("2823-3", "Potassium [Moles/volume] in Serum or Plasma", "mmol/L"),
        ["glucose"] = ("2345-7", "Glucose [Mass/volume] in Serum or Plasma", "mg/dL"),
        ["urea-nitrogen"] = ("3094-0", "Urea nitrogen [Mass/volume] in Serum or Plasma", "mg/dL"),
        ["creatinine"] = ("2160-0", "Creatinine [Mass/volume] in Serum or Plasma", "mg/dL"),
        ["serum-osmolality"] = ("2692-2", "Osmolality of Serum or Plasma", "mOsm/kg"),
        ["urine-osmolality"] = ("2695-5", "Osmolality of Urine", "mOsm/kg"),
        ["urine-sodium"] = ("2955-3", "Sodium [Moles/volume] in Urine", "mmol/L"),
        ["thyrotropin"] = ("3016-3", "Thyrotropin [Units/volume] in Serum or Plasma", "m[IU]/L"),
        ["triglyceride"] = ("2571-8", "Triglyceride [Mass/volume] in Serum or Plasma", "mg/dL"),
    };

    /// <summary>Medications: RxNorm ingredient code and name.</summary>
    public static readonly IReadOnlyList<(string Code, string Name, string Group)> Medications =
    [
        ("5487", "hydrochlorothiazide", "thiazide"),
        ("2409", "chlorthalidone", "thiazide"),
        ("5764", "indapamide", "thiazide"),
        ("36437", "sertraline", "ssri"),
        ("4493", "fluoxetine", "ssri"),
        ("2556", "citalopram", "ssri"),
        ("321988", "escitalopram", "ssri"),
        ("2002", "carbamazepine", "carbamazepine"),
        ("4603", "furosemide", "loop-diuretic"),
        ("7646", "omeprazole", "proton-pump-inhibitor"),
        ("40790", "pantoprazole", "proton-pump-inhibitor"),
    ];

    /// <summary>Conditions: SNOMED CT code and name (each listed in a profiles/valuesets/condition-*.json).</summary>
    public static readonly IReadOnlyList<(string Code, string Name)> Conditions =
    [
        ("84114007", "heart failure"),
        ("19943007", "cirrhosis of liver"),
        ("233604007", "pneumonia"),
        ("422400008", "vomiting"),
        ("40930008", "hypothyroidism"),
        ("66590003", "alcohol dependence"),
        ("709044004", "chronic kidney disease"),
    ];
}
