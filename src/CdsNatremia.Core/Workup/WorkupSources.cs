namespace CdsNatremia.Core.Workup;

/// <summary>The citations work-up cards print (from the clinical reference sheet).</summary>
public static class WorkupSources
{
    /// <summary>The 2014 European guideline (severity, onset, urine cut-offs).</summary>
    public const string European2014 = "2014 European clinical practice guideline on hyponatraemia (Spasovski et al., Eur J Endocrinol 2014;170:G1)";

    /// <summary>The osmolality formulas.</summary>
    public const string OsmolalityFormulas = "Calculated serum osmolality: 2 × Na + glucose + urea (mmol/L), or 2 × Na + glucose/18 + BUN/2.8 (mg/dL); osmolal gap above 10 mOsm/kg abnormal";

    /// <summary>Katz 1973.</summary>
    public const string Katz = "Katz MA. Hyperglycemia-induced hyponatremia: calculation of expected serum sodium depression. N Engl J Med 1973;289:843";

    /// <summary>Hillier 1999.</summary>
    public const string Hillier = "Hillier TA, Abbott RD, Barrett EJ. Hyponatremia: evaluating the correction factor for hyperglycemia. Am J Med 1999;106:399";

    /// <summary>SIADH criteria.</summary>
    public const string Siadh = "SIADH essential criteria as commonly listed after Schwartz–Bartter and Janicic & Verbalis";

    /// <summary>Facts of the trade with no single source.</summary>
    public const string CommonPractice = "Common practice (urea as an ineffective osmole; volume-status differential; pseudohyponatremia and direct ion-selective electrode sodium)";
}
