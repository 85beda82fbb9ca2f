namespace CdsNatremia.Core.Workup;

/// <summary>
/// The published formulas of the work-up, as pure functions. Units are in each parameter's name.
/// Sources (clinical reference sheet): calculated osmolality 2 × Na + glucose + urea in mmol/L, or
/// 2 × Na + glucose/18 + BUN/2.8 in mg/dL (secondary); glucose-corrected sodium by Katz (N Engl J Med 1973;289:843,
/// verified) and Hillier et al. (Am J Med 1999;106:399, verified); glucose 1 mmol/L = 18.016 mg/dL (molar mass 180.16 g/mol).
/// </summary>
public static class OsmolalityFormulas
{
    /// <summary>mg/dL of glucose in 1 mmol/L: molar mass 180.16 g/mol ÷ 10 (reference sheet). The US formula rounds it to 18.</summary>
    public const double GlucoseMgPerDlPerMmolPerL = 18.016;

    /// <summary>
    /// mg/dL of urea nitrogen (BUN) in 1 mmol/L of urea: two nitrogen atoms, 2 × 14.007 g/mol = 28.014 g/mol, ÷ 10
    /// (common practice; molar mass from memory). The US formula rounds it to 2.8.
    /// </summary>
    public const double BunMgPerDlPerMmolPerL = 2.8014;

    /// <summary>Glucose below this (mg/dL) needs no correction in either formula: both count only the excess above 100 mg/dL.</summary>
    public const double CorrectionBaselineMgPerDl = 100;

    /// <summary>Katz (1973): sodium rises 1.6 mmol/L per 100 mg/dL fall of glucose.</summary>
    public const double KatzPer100MgPerDl = 1.6;

    /// <summary>Hillier et al. (1999): 2.4 mmol/L per 100 mg/dL as the better overall estimate.</summary>
    public const double HillierPer100MgPerDl = 2.4;

    /// <summary>Hillier et al. (1999): the fall is steeper above 400 mg/dL, about 4.0 mmol/L per 100 mg/dL (reference sheet, verified).</summary>
    public const double HillierSteepPer100MgPerDl = 4.0;

    /// <summary>Where Hillier's steeper slope begins, mg/dL.</summary>
    public const double HillierSteepAboveMgPerDl = 400;

    /// <summary>Glucose mmol/L → mg/dL.</summary>
    public static double GlucoseToMgPerDl(double glucoseMmolPerL) => glucoseMmolPerL * GlucoseMgPerDlPerMmolPerL;

    /// <summary>Urea mmol/L → urea nitrogen (BUN) mg/dL.</summary>
    public static double UreaToBunMgPerDl(double ureaMmolPerL) => ureaMmolPerL * BunMgPerDlPerMmolPerL;

    /// <summary>SI calculated osmolality, mOsm/kg: 2 × Na + glucose + urea, all mmol/L.</summary>
    public static double CalculatedSi(double sodiumMmolPerL, double glucoseMmolPerL, double ureaMmolPerL)
        => (2 * sodiumMmolPerL) + glucoseMmolPerL + ureaMmolPerL;

    /// <summary>
    /// US-unit calculated osmolality, mOsm/kg: 2 × Na + glucose/18 + BUN/2.8 with the rounded textbook divisors.
    /// The service computes with <see cref="CalculatedSi"/> and exact molar-mass factors; this form is kept to show that
    /// both agree to within a few tenths of a mOsm/kg.
    /// </summary>
    public static double CalculatedUs(double sodiumMmolPerL, double glucoseMgPerDl, double bunMgPerDl)
        => (2 * sodiumMmolPerL) + (glucoseMgPerDl / 18) + (bunMgPerDl / 2.8);

    /// <summary>Effective osmolality (tonicity), mOsm/kg: total osmolality less urea, an ineffective osmole (common practice).</summary>
    public static double Effective(double osmolality, double ureaMmolPerL) => osmolality - ureaMmolPerL;

    /// <summary>Osmolal gap, mOsm/kg: measured − calculated.</summary>
    public static double OsmolalGap(double measured, double calculated) => measured - calculated;

    /// <summary>Katz (1973) glucose-corrected sodium, mmol/L: Na + 1.6 × (glucose − 100)/100, glucose in mg/dL.</summary>
    public static double KatzCorrectedSodium(double sodiumMmolPerL, double glucoseMgPerDl)
        => sodiumMmolPerL + (KatzPer100MgPerDl * Excess(glucoseMgPerDl) / 100);

    /// <summary>Hillier et al. (1999) glucose-corrected sodium, mmol/L: Na + 2.4 × (glucose − 100)/100, glucose in mg/dL.</summary>
    public static double HillierCorrectedSodium(double sodiumMmolPerL, double glucoseMgPerDl)
        => sodiumMmolPerL + (HillierPer100MgPerDl * Excess(glucoseMgPerDl) / 100);

    /// <summary>
    /// Hillier's piecewise reading (Hillier et al., Am J Med 1999;106:399, abstract): up to 400 mg/dL the standard
    /// 1.6 per 100 mg/dL fitted well, and above 400 mg/dL a factor of 4.0 per 100 mg/dL was better; 2.4 is the paper's
    /// single overall factor. So: 1.6 per 100 mg/dL from 100 to 400 mg/dL, plus 4.0 per 100 mg/dL for the glucose above
    /// 400 mg/dL. Shown beside the single-factor values, never used alone.
    /// </summary>
    public static double HillierSteepCorrectedSodium(double sodiumMmolPerL, double glucoseMgPerDl)
    {
        var excess = Excess(glucoseMgPerDl);
        var low = Math.Min(excess, HillierSteepAboveMgPerDl - CorrectionBaselineMgPerDl);
        var high = Math.Max(0, glucoseMgPerDl - HillierSteepAboveMgPerDl);
        return sodiumMmolPerL + (KatzPer100MgPerDl * low / 100) + (HillierSteepPer100MgPerDl * high / 100);
    }

    private static double Excess(double glucoseMgPerDl) => Math.Max(0, glucoseMgPerDl - CorrectionBaselineMgPerDl);
}
