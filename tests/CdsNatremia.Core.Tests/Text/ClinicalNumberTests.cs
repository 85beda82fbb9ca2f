using CdsNatremia.Core.CorrectionRate;
using CdsNatremia.Core.Engine;
using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Tests.Support;
using CdsNatremia.Core.Text;

namespace CdsNatremia.Core.Tests.Text;

/// <summary>
/// Issue 13 (15): a number shown is the number used. The rule on its own, then over every formula's inputs: body water,
/// Adrogué–Madias, Katz, Hillier, calculated osmolality, Furst and the rate limits.
/// </summary>
public class ClinicalNumberTests
{
    [Theory]
    [InlineData(0.45, "0.45")] // total body water fraction, woman of 70 or over (reference sheet, secondary)
    [InlineData(0.5, "0.5")]
    [InlineData(124, "124")]
    [InlineData(124.5, "124.5")]
    [InlineData(3.45, "3.45")]
    [InlineData(18.016, "18.016")] // mg/dL per mmol/L of glucose (reference sheet)
    [InlineData(27.000000000000004, "27")] // 60 × 0.45 in floating point
    [InlineData(-0.0001, "0")]
    public void Format_InputsAndFactors_PrintedWithThePrecisionUsed(double value, string expected)
        => Assert.Equal(expected, ClinicalNumber.Format(value));

    [Theory]
    [InlineData(0.9677, 1, "1")]
    [InlineData(12.74, 1, "12.7")]
    [InlineData(12.75, 1, "12.8")] // half away from zero
    [InlineData(1.2096, 2, "1.21")]
    public void Rounded_Results_RoundedExplicitly(double value, int decimals, string expected)
        => Assert.Equal(expected, ClinicalNumber.Rounded(value, decimals));

    [Fact]
    public void Rounded_TooManyDecimals_Throws()
        => Assert.Throws<ArgumentOutOfRangeException>(() => ClinicalNumber.Rounded(1, 4));

    private static string InfusionDetail(PatientFacts facts, string order = "sodium chloride 0.9%", double millilitres = 1000)
        => Assert.Single(SomeClinical.Decide(facts, HookKind.OrderSign, [SomeClinical.Draft("o", order, millilitres, "intravenous")]),
            c => c.Topic == InfusionPredictionCardProducer.Topic).Report;

    [Fact]
    public void BodyWater_WomanOf75_FractionPrintedAs045NotAs05()
    {
        // Issue 13's case: 60 kg woman of 75 × 0.45 (reference sheet, secondary) = 27 L; the card printed "× 0.5".
        var detail = InfusionDetail(SomeClinical.Woman(75, Some.Sodium(124, 3), Some.Lab(Analyte.BodyWeight, 60, 3)));
        Assert.Contains("× 0.45 (woman, age 75 years) = **27 L**", detail, StringComparison.Ordinal);
    }

    [Fact]
    public void AdrogueMadias_InputsWithDecimals_PrintedAsUsed()
    {
        // 63.3 kg × 0.45 = 28.485 L (not "28.5"); (154 + 0 − 124.5) / (28.485 + 1) = 1.0005 → +1 per litre (Adrogué–Madias).
        var detail = InfusionDetail(SomeClinical.Woman(75, Some.Sodium(124.5, 3), Some.Lab(Analyte.BodyWeight, 63.3, 3)));
        Assert.Contains("weight 63.3 kg", detail, StringComparison.Ordinal);
        Assert.Contains("= **28.485 L**", detail, StringComparison.Ordinal);
        Assert.Contains("(154 + 0 − 124.5) / (28.485 + 1) = **+1 mmol/L**", detail, StringComparison.Ordinal);
    }

    [Fact]
    public void AdrogueMadias_RingersLactatePotassium_PrintedAsUsed()
    {
        // Ringer's lactate: sodium 130 (reference sheet) + potassium 4 (from memory); 50 kg man of 40: TBW 0.6 × 50 = 30 L.
        var facts = Some.Facts(Some.Sodium(120, 3), Some.Lab(Analyte.BodyWeight, 50, 3)) with { Sex = PatientSex.Male, BirthDate = new DateOnly(1986, 1, 1) };
        var detail = InfusionDetail(facts, "Ringer's lactate");
        Assert.Contains("(130 + 4 − 120) / (30 + 1)", detail, StringComparison.Ordinal);
    }

    [Fact]
    public void KatzAndHillier_GlucoseInMgPerDl_TheShownValueIsTheOneUsed()
    {
        // Glucose 25.55 mmol/L × 18.016 = 460.3 mg/dL (one decimal, then used): Katz 124 + 1.6 × 3.603 = 129.8;
        // Hillier 124 + 2.4 × 3.603 = 132.6 (Katz 1973; Hillier et al. 1999).
        var facts = Some.Facts(Some.Sodium(124, 2), Some.Lab(Analyte.SerumOsmolality, 300, 2), Some.Lab(Analyte.Glucose, 25.55, 2), Some.Lab(Analyte.Urea, 5, 2));
        var detail = SomeClinical.Assessment(facts).Detail;
        Assert.Contains("= 460.3 mg/dL. Katz (1.6 mmol/L per 100 mg/dL above 100): 124 + 1.6 × (460.3 − 100)/100 = **129.8 mmol/L**", detail, StringComparison.Ordinal);
        Assert.Contains("Hillier (2.4 per 100 mg/dL above 100): **132.6 mmol/L**", detail, StringComparison.Ordinal);
    }

    [Fact]
    public void CalculatedOsmolality_InputsWithTwoDecimals_PrintedAsUsed()
    {
        // 2 × 124 + 5.55 + 3.25 = 256.8 mOsm/kg (reference sheet formula, SI units).
        var facts = Some.Facts(Some.Sodium(124, 2), Some.Lab(Analyte.Glucose, 5.55, 2), Some.Lab(Analyte.Urea, 3.25, 2));
        Assert.Contains("256.8 mOsm/kg (SI units: 2 × 124 + glucose 5.55 + urea 3.25 mmol/L", SomeClinical.Assessment(facts).Detail, StringComparison.Ordinal);
    }

    [Fact]
    public void Furst_UrinePotassiumWithADecimal_PrintedAsUsed()
    {
        // (70 + 22.5) / 124 = 0.746 → 0.75 (Furst et al. 2000 formula).
        var facts = Some.Facts(Some.Sodium(124, 2), Some.Lab(Analyte.SerumOsmolality, 255, 2), Some.Lab(Analyte.UrineOsmolality, 400, 2),
            Some.Lab(Analyte.UrineSodium, 70, 2), Some.Lab(Analyte.UrinePotassium, 22.5, 2));
        Assert.Contains("(urine sodium 70 + urine potassium 22.5) / serum sodium 124 = **0.75**", SomeClinical.Assessment(facts).Detail, StringComparison.Ordinal);
    }

    [Fact]
    public void HighRiskPotassium_345_NotPrintedAsTheLimitItWasComparedWith()
    {
        // 3.45 < 3.5 (common practice lower limit): the card printed "3.5 … below … 3.5" before.
        var card = SomeClinical.Assessment(Some.Facts(Some.Sodium(122, 2), Some.Lab(Analyte.Potassium, 3.45, 2)));
        Assert.Contains("low potassium: 3.45 mmol/L", card.Report, StringComparison.Ordinal);
        Assert.Contains("of 3.5 mmol/L", card.Report, StringComparison.Ordinal);
    }

    [Fact]
    public void RateLimits_CustomLimitWithTwoDecimals_PrintedAsUsed()
    {
        // A local high-risk limit of 7.25 mmol/L in any 24 h (operator's choice): printed as 7.25, not 7.3 (or 7.2).
        var options = new RuleOptions { CorrectionRate = new CorrectionRateOptions { Preset = CorrectionRatePreset.Custom, HighRiskDayLimit = 7.25, HighRiskTwoDayLimit = 14.5 } };
        var facts = Some.Facts(Some.Sodium(104, 20), Some.Sodium(111, 1));
        var cards = SomeClinical.Decide(facts, options: options);
        var rate = Assert.Single(cards, c => c.Topic == CorrectionRateCardProducer.Topic);
        Assert.Contains("7.25 mmol/L in any 24 h", rate.Report, StringComparison.Ordinal);
        Assert.Contains("no more than 7.25 mmol/L in any 24 h", Assert.Single(cards, c => c.Topic == "sodium-assessment").Report, StringComparison.Ordinal);
    }
}
