namespace CdsNatremia.Core.CorrectionRate;

/// <summary>Named sets of correction limits an operator can choose in configuration.</summary>
public enum CorrectionRatePreset
{
    /// <summary>
    /// 2014 European clinical practice guideline (Spasovski et al., Eur J Endocrinol 2014;170:G1): a rise of no more
    /// than 10 mmol/L in the first 24 h and 8 mmol/L in each 24 h after. The default.
    /// </summary>
    European2014,

    /// <summary>
    /// US expert panel (Verbalis et al., Am J Med 2013;126:S1): 10–12 mmol/L in any 24 h or 18 mmol/L in 48 h;
    /// 8 mmol/L in any 24 h for patients at high risk of osmotic demyelination; minimum goal 4–8 mmol/L per day
    /// (4–6 for high risk).
    /// </summary>
    UsExpertPanel2013,

    /// <summary>Limits taken as configured in <see cref="CorrectionRateOptions"/>.</summary>
    Custom,
}
