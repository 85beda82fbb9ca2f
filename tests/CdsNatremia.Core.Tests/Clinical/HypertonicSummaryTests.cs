using CdsNatremia.Core.Cards;
using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Tests.Support;

namespace CdsNatremia.Core.Tests.Clinical;

/// <summary>
/// Issue 13 (11): a hypertonic low sodium is "not hypotonic" first, never an emergency low-sodium card with correction
/// limits, and the likely osmole is named when the record holds one (common practice: mannitol, irrigation fluids, contrast).
/// </summary>
public class HypertonicSummaryTests
{
    private static PatientFacts Hypertonic(double sodium, params MedicationFact[] medications)
        => Some.Facts(Some.Sodium(sodium, 2), Some.Lab(Analyte.SerumOsmolality, 318, 2), Some.Lab(Analyte.Glucose, 5.5, 2), Some.Lab(Analyte.Urea, 5, 2))
            with { Medications = medications };

    private static MedicationFact Mannitol() => new("MedicationStatement", "mannitol", [], [], "Mannitol 20% intravenous infusion", MedicationUse.Active, Some.Now.AddHours(-6), "effectivePeriod.start");

    [Fact]
    public void Compose_ProfoundButHypertonicWithMannitol_NotHypotonicFirstWarningAndOsmoleNamed()
    {
        // Sodium 118 is in the profound band (2014 European guideline), but measured 318 mOsm/kg (> 295, common practice) is
        // hypertonic: not an emergency low-sodium card (the profound indicator would be critical).
        var card = SomeClinical.Assessment(Hypertonic(118, Mannitol()));
        Assert.StartsWith("Not hypotonic: sodium 118 mmol/L (profound range", card.Summary, StringComparison.Ordinal);
        Assert.Contains("with osmolality 318 mOsm/kg", card.Summary, StringComparison.Ordinal);
        Assert.Contains("likely mannitol", card.Summary, StringComparison.Ordinal);
        Assert.Equal(CardIndicator.Warning, card.Indicator);
        Assert.Contains("**Findings**\n\n- This is **not hypotonic hyponatremia** (osmolality 318 mOsm/kg): the likely osmole is **mannitol**", card.Report, StringComparison.Ordinal);
        Assert.Contains("MedicationStatement/mannitol", card.ResourcesUsed);
        Assert.DoesNotContain("high risk of osmotic demyelination**", card.Report, StringComparison.Ordinal);
    }

    [Fact]
    public void Compose_HypertonicWithoutAnOsmoleInTheRecord_AsksForOne()
    {
        var card = SomeClinical.Assessment(Hypertonic(121));
        Assert.StartsWith("Not hypotonic:", card.Summary, StringComparison.Ordinal);
        Assert.Contains("look for another osmole", card.Summary, StringComparison.Ordinal);
        Assert.Equal(CardIndicator.Warning, card.Indicator);
    }

    [Fact]
    public void Compose_NormalOsmolalityWithGlycineInTheRecord_NotHypotonicNamesGlycineAndNotCritical()
    {
        // Measured 288 (≤ 295: isotonic, common practice); calculated 2 × 118 + 5 + 5 = 246, gap 42 > 10 (reference sheet):
        // with glycine irrigation in the record the likely osmole is named (common practice), not a low-sodium emergency.
        var glycine = new MedicationFact("MedicationStatement", "gly", [], [], "glycine 1.5% irrigation solution", MedicationUse.Active, Some.Now.AddHours(-5), "effectivePeriod.start");
        var facts = Some.Facts(Some.Sodium(118, 2), Some.Lab(Analyte.SerumOsmolality, 288, 2), Some.Lab(Analyte.Glucose, 5, 2), Some.Lab(Analyte.Urea, 5, 2))
            with { Medications = [glycine] };
        var card = SomeClinical.Assessment(facts);
        Assert.StartsWith("Not hypotonic: sodium 118 mmol/L (profound range", card.Summary, StringComparison.Ordinal);
        Assert.Contains("osmolality 288 mOsm/kg (gap 42)", card.Summary, StringComparison.Ordinal);
        Assert.Contains("likely glycine irrigation fluid", card.Summary, StringComparison.Ordinal);
        Assert.Equal(CardIndicator.Warning, card.Indicator);
    }

    [Fact]
    public void Compose_NormalOsmolalityWithRaisedGapButNoOsmole_PseudohyponatremiaReadingKept()
    {
        // Pseudohyponatremia raises the gap too (the measured sodium is falsely low), so a gap alone does not decide.
        var facts = Some.Facts(Some.Sodium(118, 2), Some.Lab(Analyte.SerumOsmolality, 288, 2), Some.Lab(Analyte.Glucose, 5, 2), Some.Lab(Analyte.Urea, 5, 2));
        var card = SomeClinical.Assessment(facts);
        Assert.StartsWith("Sodium 118 mmol/L (profound hyponatremia", card.Summary, StringComparison.Ordinal);
        Assert.Contains("pseudohyponatremia", card.Report, StringComparison.Ordinal);
    }

    [Fact]
    public void Compose_HypotonicProfound_StillCritical()
    {
        // Measured 250 mOsm/kg < 275 (SIADH criteria, reference sheet): hypotonic; the profound card stays critical.
        var facts = Some.Facts(Some.Sodium(118, 2), Some.Lab(Analyte.SerumOsmolality, 250, 2), Some.Lab(Analyte.Glucose, 5.5, 2), Some.Lab(Analyte.Urea, 5, 2));
        var card = SomeClinical.Assessment(facts);
        Assert.Equal(CardIndicator.Critical, card.Indicator);
        Assert.StartsWith("Sodium 118 mmol/L (profound hyponatremia", card.Summary, StringComparison.Ordinal);
    }

    [Fact]
    public void Compose_UnknownTonicityWithMannitolInTheRecord_AsksForMeasuredOsmolality()
    {
        var facts = Some.Facts(Some.Sodium(124, 2)) with { Medications = [Mannitol()] };
        var card = SomeClinical.Assessment(facts);
        Assert.Contains("mannitol in the record: measure osmolality before treating", card.Summary, StringComparison.Ordinal);
        Assert.Contains("**An osmole is in the record**", card.Report, StringComparison.Ordinal);
    }

    [Fact]
    public void Compose_HyperglycaemiaProfound_NotHypotonicWithGlucoseAndWarning()
    {
        // Glucose 40 mmol/L (720.6 mg/dL at 18.016): Hillier 2.4 per 100 mg/dL (Hillier et al. 1999) → 121 + 2.4 × 6.206 = 135.9.
        var facts = Some.Facts(Some.Sodium(121, 2), Some.Lab(Analyte.SerumOsmolality, 310, 2), Some.Lab(Analyte.Glucose, 40, 2), Some.Lab(Analyte.Urea, 6, 2));
        var card = SomeClinical.Assessment(facts);
        Assert.StartsWith("Not hypotonic: sodium 121 mmol/L (profound range", card.Summary, StringComparison.Ordinal);
        Assert.Contains("with glucose 40 mmol/L", card.Summary, StringComparison.Ordinal);
        Assert.Contains("corrected sodium 135.9 mmol/L (Hillier)", card.Summary, StringComparison.Ordinal);
        Assert.Equal(CardIndicator.Warning, card.Indicator);
    }
}
