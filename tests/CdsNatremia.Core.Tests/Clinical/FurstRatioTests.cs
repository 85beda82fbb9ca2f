using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Tests.Support;
using CdsNatremia.Core.Workup;

namespace CdsNatremia.Core.Tests.Clinical;

/// <summary>
/// Issue 13 (8): the urine-to-serum electrolyte ratio (U_Na + U_K) / S_Na (Furst et al., Am J Med Sci 2000;319:240;
/// reference sheet, secondary) and what it implies for fluid restriction (&gt; 1 unlikely to work; 0.5–1 stricter; &lt; 0.5
/// usual; bands as given in the issue, from memory).
/// </summary>
public class FurstRatioTests
{
    [Theory]
    [InlineData(80, 40, 120, 1.0)]   // (80 + 40) / 120 = 1 (Furst et al. 2000 formula, computed by hand)
    [InlineData(90, 45, 125, 1.08)]  // 135 / 125
    [InlineData(30, 20, 124, 0.403)] // 50 / 124
    public void Compute_PublishedFormula_HandComputedValues(double urineSodium, double urinePotassium, double serumSodium, double expected)
        => Assert.Equal(expected, FurstRatio.Compute(urineSodium, urinePotassium, serumSodium), 3);

    [Theory]
    [InlineData(0.49, FluidRestrictionOutlook.UsualRestriction)]
    [InlineData(0.5, FluidRestrictionOutlook.StricterRestriction)]
    [InlineData(1.0, FluidRestrictionOutlook.StricterRestriction)] // "> 1" is the unlikely band (Furst et al. 2000, as taught)
    [InlineData(1.01, FluidRestrictionOutlook.RestrictionUnlikelyToWork)]
    public void Band_AroundEachEdge_TheRightOutlook(double ratio, FluidRestrictionOutlook expected)
        => Assert.Equal(expected, FurstRatio.Band(ratio, new WorkupOptions()));

    [Fact]
    public void Compute_SerumSodiumZero_Throws()
        => Assert.Throws<ArgumentOutOfRangeException>(() => FurstRatio.Compute(80, 40, 0));

    private static List<LabResult> SiadhLike(double urineSodium, double? urinePotassium)
    {
        // Hypotonic (measured 255 mOsm/kg), concentrated urine (420 mOsm/kg > 100, 2014 European guideline), serum sodium 124.
        var labs = new List<LabResult>
        {
            Some.Sodium(124, 2), Some.Lab(Analyte.SerumOsmolality, 255, 2), Some.Lab(Analyte.Glucose, 5, 2), Some.Lab(Analyte.Urea, 4, 2),
            Some.Lab(Analyte.UrineOsmolality, 420, 2), Some.Lab(Analyte.UrineSodium, urineSodium, 2, id: "una"),
        };
        if (urinePotassium is { } k)
        {
            labs.Add(Some.Lab(Analyte.UrinePotassium, k, 2, id: "uk"));
        }

        return labs;
    }

    [Fact]
    public void Apply_RatioAboveOne_RestrictionUnlikelyToWorkAndNoGenericFirstStep()
    {
        // (110 + 40) / 124 = 1.21 > 1: fluid restriction unlikely to work (Furst et al. 2000).
        var card = SomeClinical.Assessment(Some.Facts([.. SiadhLike(110, 40)]));
        Assert.Contains("(urine sodium 110 + urine potassium 40) / serum sodium 124 = **1.21**", card.Report, StringComparison.Ordinal);
        Assert.Contains("**fluid restriction is unlikely to work**", card.Report, StringComparison.Ordinal);
        Assert.DoesNotContain("fluid restriction is the usual first step;", card.Report, StringComparison.Ordinal);
        Assert.Contains("Observation/uk", card.ResourcesUsed);
    }

    [Fact]
    public void Apply_SiadhCriteriaMet_AdviceUsesTheRatioNotTheGenericFirstStep()
    {
        // All SIADH essential criteria met on the data (TSH 2 mIU/L within 0.4–4.0, cortisol 400 nmol/L ≥ 138; from memory
        // defaults): the advice replaces "fluid restriction is the usual first step" with the Furst ratio's verdict.
        var card = SomeClinical.Assessment(Some.Facts([.. SiadhLike(110, 40), Some.Lab(Analyte.Thyrotropin, 2, 2), Some.Lab(Analyte.Cortisol, 400, 2)]));
        Assert.Contains("If SIADH is confirmed, the Furst ratio of 1.21 says whether fluid restriction will work", card.Report, StringComparison.Ordinal);
        Assert.DoesNotContain("fluid restriction is the usual first step", card.Report, StringComparison.Ordinal);
    }

    [Fact]
    public void Apply_RatioBetweenHalfAndOne_StricterRestriction()
    {
        // (60 + 20) / 124 = 0.65: stricter restriction (Furst et al. 2000).
        var card = SomeClinical.Assessment(Some.Facts([.. SiadhLike(60, 20)]));
        Assert.Contains("= **0.65**", card.Report, StringComparison.Ordinal);
        Assert.Contains("**stricter fluid restriction**", card.Report, StringComparison.Ordinal);
    }

    [Fact]
    public void Apply_RatioBelowHalf_UsualRestriction()
    {
        // (40 + 10) / 124 = 0.4: the usual restriction (Furst et al. 2000).
        var card = SomeClinical.Assessment(Some.Facts([.. SiadhLike(40, 10)]));
        Assert.Contains("= **0.4**", card.Report, StringComparison.Ordinal);
        Assert.Contains("the **usual fluid restriction** can be expected to work", card.Report, StringComparison.Ordinal);
    }

    [Fact]
    public void Apply_NoUrinePotassium_LowerBoundOnlyAndNoBand()
    {
        // 60 / 124 = 0.48 without potassium: only a lower bound, so no restriction advice from it.
        var card = SomeClinical.Assessment(Some.Facts([.. SiadhLike(60, null)]));
        Assert.Contains("urine sodium 60 / serum sodium 124 = **0.48** without urine potassium", card.Report, StringComparison.Ordinal);
        Assert.Contains("urine potassium is needed", card.Report, StringComparison.Ordinal);
        Assert.DoesNotContain("Furst ratio 0.48:", card.Report, StringComparison.Ordinal);
    }

    [Fact]
    public void Apply_NoUrinePotassiumButSodiumAloneAboveOne_StillUnlikelyToWork()
    {
        // 130 / 124 = 1.05 > 1 before potassium is added (it can only raise the ratio).
        var card = SomeClinical.Assessment(Some.Facts([.. SiadhLike(130, null)]));
        Assert.Contains("**fluid restriction is unlikely to work**", card.Report, StringComparison.Ordinal);
    }

    [Fact]
    public void Apply_DiluteUrine_NoRatio()
    {
        // Urine ≤ 100 mOsm/kg (2014 European guideline): the kidney is excreting water; the ratio does not apply.
        var labs = SiadhLike(20, 10);
        labs[4] = Some.Lab(Analyte.UrineOsmolality, 80, 2);
        Assert.DoesNotContain("Furst ratio", SomeClinical.Assessment(Some.Facts([.. labs])).Report, StringComparison.Ordinal);
    }
}
