using CdsNatremia.Core.Cards;
using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Findings;
using CdsNatremia.Core.Tests.Support;

namespace CdsNatremia.Core.Tests.Clinical;

/// <summary>Issue 13 (6): the chart card says this patient is at high risk of osmotic demyelination, with the factors and the limit.</summary>
public class HighRiskRuleTests
{
    [Fact]
    public void Apply_LowPotassium_ChartCardNamesHighRiskFactorValueAndStricterLimit()
    {
        // US expert panel (Verbalis et al., Am J Med 2013;126:S1; reference sheet, secondary): hypokalaemia is a high-risk
        // factor, and at high risk the limit is 8 mmol/L in any 24 h. Potassium 3.1 < 3.5 (common practice lower limit).
        var card = SomeClinical.Assessment(Some.Facts(Some.Sodium(122, 2), Some.Lab(Analyte.Potassium, 3.1, 2, id: "k-1")));
        var caution = Assert.Single(card.Content!.Cautions, f => f.Kind == FindingKind.RateHighRiskCaution);
        Assert.Equal(new NumberValue(8, null), caution["day"]);
        Assert.Contains("Observation/k-1", caution.Evidence);
        Assert.Contains(card.Content.Steps, f => f.Kind == FindingKind.RateHighRiskStatement);
        Assert.Contains("High risk of osmotic demyelination (low potassium): ≤ 8 mmol/L in any 24 h.", card.Detail, StringComparison.Ordinal);
        Assert.Contains("**This patient is at high risk of osmotic demyelination**", card.Report, StringComparison.Ordinal);
        Assert.Contains("low potassium: 3.1 mmol/L", card.Report, StringComparison.Ordinal);
        Assert.Contains("no more than 8 mmol/L in any 24 h", card.Report, StringComparison.Ordinal);
        Assert.Contains("Observation/k-1", card.ResourcesUsed);
        Assert.Contains("sodium.high-risk", card.RuleIds);
    }

    [Fact]
    public void Apply_ModerateSodiumWithLowPotassium_SummarySaysHighRisk()
    {
        // Moderate band (125–129, 2014 European guideline): the high-risk clause outranks the moderate "assess symptoms" one.
        var card = SomeClinical.Assessment(Some.Facts(Some.Sodium(127, 2), Some.Lab(Analyte.Potassium, 2.9, 2)));
        Assert.Contains("high risk of osmotic demyelination: rise ≤ 8 mmol/L in any 24 h", card.Summary, StringComparison.Ordinal);
        Assert.True(card.Indicator >= CardIndicator.Warning);
    }

    [Theory]
    [InlineData(105, true)] // ≤ 105 mmol/L: high risk (US expert panel, reference sheet)
    [InlineData(105.5, false)]
    [InlineData(106, false)]
    public void Apply_SodiumAtTheHighRiskEdge_StatedOnlyAtOrBelow105(double sodium, bool stated)
    {
        var card = SomeClinical.Assessment(Some.Facts(Some.Sodium(sodium, 2)));
        Assert.Equal(stated, card.Content!.Cautions.Any(f => f.Kind == FindingKind.RateHighRiskCaution));
        Assert.Equal(stated, card.Report.Contains("**This patient is at high risk of osmotic demyelination**", StringComparison.Ordinal));
    }

    [Fact]
    public void Apply_AlcoholUseDisorderAndCirrhosis_BothNamedWithTheirRecords()
    {
        // Advanced liver disease is a high-risk factor (US expert panel); ICD-10 K74 cirrhosis (from memory).
        var facts = Some.Facts(Some.Sodium(121, 2)) with { Conditions = [SomeClinical.Condition("liver", "K74.6", "Cirrhosis of liver")] };
        var card = SomeClinical.Assessment(facts);
        Assert.Contains("advanced liver disease: Cirrhosis of liver (Condition/liver)", card.Report, StringComparison.Ordinal);
    }

    [Fact]
    public void Apply_NoFactor_NoHighRiskStatement()
    {
        var card = SomeClinical.Assessment(Some.Facts(Some.Sodium(122, 2), Some.Lab(Analyte.Potassium, 4.1, 2)));
        Assert.DoesNotContain(card.Content!.Cautions, f => f.Kind == FindingKind.RateHighRiskCaution);
        Assert.DoesNotContain("at high risk of osmotic demyelination**", card.Report, StringComparison.Ordinal);
        Assert.DoesNotContain("sodium.high-risk", card.RuleIds);
    }

    [Fact]
    public void Apply_HypertonicLowSodium_NoCorrectionLimitStatement()
    {
        // Correction limits are for hypotonic hyponatremia (2014 European guideline); measured 320 mOsm/kg is hypertonic.
        var facts = Some.Facts(Some.Sodium(104, 2), Some.Lab(Analyte.SerumOsmolality, 320, 2), Some.Lab(Analyte.Glucose, 5.5, 2), Some.Lab(Analyte.Urea, 5, 2));
        Assert.DoesNotContain("sodium.high-risk", SomeClinical.Assessment(facts).RuleIds);
    }
}
