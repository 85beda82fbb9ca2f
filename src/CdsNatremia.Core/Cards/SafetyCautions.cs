namespace CdsNatremia.Core.Cards;

/// <summary>
/// The cautions every card carries. Wording is ours; the facts are from the reference sheet: correction limits of the
/// 2014 European guideline (≤ 10 mmol/L in the first 24 h, ≤ 8 mmol/L each 24 h after) and the US expert panel
/// (Verbalis et al., Am J Med 2013;126:S1), and osmotic demyelination as the harm of over-rapid correction.
/// </summary>
public static class SafetyCautions
{
    /// <summary>Heading of the cautions block in every card detail.</summary>
    public const string Heading = "Cautions";

    /// <summary>The advisory-only line; tests look for it on every card.</summary>
    public const string AdvisoryOnly = "Advisory only: this supports and does not replace clinical judgement.";

    /// <summary>The local-protocol line.</summary>
    public const string LocalProtocols = "Follow local protocols and act within your licensed practice.";

    /// <summary>The correction-rate line.</summary>
    public const string CorrectionLimits =
        "Correcting chronic hyponatremia too fast can cause osmotic demyelination: keep the rise within the limits " +
        "(2014 European guideline: no more than 10 mmol/L in the first 24 h and 8 mmol/L in each 24 h after; " +
        "stricter, 8 mmol/L in any 24 h, for patients at high risk per the US expert panel, Verbalis et al. 2013) " +
        "and check sodium often while treating.";

    /// <summary>The emergency line.</summary>
    public const string SevereSymptoms =
        "Severe symptoms (vomiting, seizures, reduced consciousness, cardiorespiratory distress) are an emergency: " +
        "seek senior help at once.";

    /// <summary>
    /// The caution for a patient younger than the adult age (<see cref="Sodium.SeverityOptions.AdultFromAgeYears"/>): the
    /// 2014 European guideline covers adults, so its thresholds and correction limits may not apply to a child.
    /// </summary>
    public static string Paediatric(int ageYears, int adultFromAgeYears) => Invariant.Format(
        $"**This patient is a child ({ageYears} years old, under {adultFromAgeYears})**: the thresholds, correction limits and formulas on this card are for adults (the 2014 European guideline covers adults) and may not apply; follow paediatric protocols and seek paediatric advice.");

    /// <summary>All cautions in display order.</summary>
    public static IReadOnlyList<string> All { get; } = [AdvisoryOnly, LocalProtocols, CorrectionLimits, SevereSymptoms];
}
