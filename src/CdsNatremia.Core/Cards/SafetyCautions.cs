namespace CdsNatremia.Core.Cards;

/// <summary>
/// The cautions every card carries. Wording is ours; the facts are from the reference sheet: correction limits of the
/// 2014 European guideline (≤ 10 mmol/L in the first 24 h, ≤ 8 mmol/L each 24 h after) and the US expert panel
/// (Verbalis et al., Am J Med 2013;126:S1), and osmotic demyelination as the harm of over-rapid correction.
/// </summary>
public static class SafetyCautions
{
    private static Rendering.PhraseCatalogue Phrases => Rendering.PhraseCatalogue.Default;

    /// <summary>Heading of the cautions block in every full report.</summary>
    public static string Heading => Phrases.Text("caution.heading");

    /// <summary>The advisory-only line.</summary>
    public static string AdvisoryOnly => Phrases.Text("caution.advisory-only");

    /// <summary>The local-protocol line.</summary>
    public static string LocalProtocols => Phrases.Text("caution.local-protocols");

    /// <summary>The correction-rate line.</summary>
    public static string CorrectionLimits => Phrases.Text("caution.correction-limits");

    /// <summary>The emergency line.</summary>
    public static string SevereSymptoms => Phrases.Text("caution.severe-symptoms");

    /// <summary>The standing line every short card ends with (advisory, local protocols, correction limits).</summary>
    public static string Standing => Phrases.Text("card.standing");

    /// <summary>
    /// The caution for a patient younger than the adult age (<see cref="Sodium.SeverityOptions.AdultFromAgeYears"/>): the
    /// 2014 European guideline covers adults, so its thresholds and correction limits may not apply to a child.
    /// </summary>
    public static Findings.Finding Paediatric(int ageYears, int adultFromAgeYears)
        => Findings.Finding.Of(Findings.FindingKind.PaediatricCaution, Findings.Slot.Count("age", ageYears), Findings.Slot.Count("adultFrom", adultFromAgeYears));

    /// <summary>All cautions in display order.</summary>
    public static IReadOnlyList<string> All => [AdvisoryOnly, LocalProtocols, CorrectionLimits, SevereSymptoms];
}
