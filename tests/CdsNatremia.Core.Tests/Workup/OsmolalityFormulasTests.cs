using CdsNatremia.Core.Workup;

namespace CdsNatremia.Core.Tests.Workup;

public class OsmolalityFormulasTests
{
    [Fact]
    public void GlucoseToMgPerDl_OneMillimole_Is18016()
        // Glucose 1 mmol/L = 18.016 mg/dL: molar mass 180.16 g/mol (reference sheet; UCUM-style unit arithmetic).
        => Assert.Equal(18.016, OsmolalityFormulas.GlucoseToMgPerDl(1), precision: 6);

    [Fact]
    public void UreaToBunMgPerDl_OneMillimole_Is28014()
        // Urea carries two nitrogen atoms: 2 × 14.007 g/mol = 28.014 g/mol → 2.8014 mg/dL of urea nitrogen per mmol/L
        // (the "BUN/2.8" of the US formula, reference sheet; atomic mass of nitrogen from memory).
        => Assert.Equal(2.8014, OsmolalityFormulas.UreaToBunMgPerDl(1), precision: 6);

    [Theory]
    // Calculated osmolality, SI: 2 × Na + glucose + urea, all mmol/L (reference sheet, secondary).
    [InlineData(140, 5, 5, 290)]
    [InlineData(124, 5.8, 5.7, 259.5)]
    [InlineData(128, 36.1, 10, 302.1)]
    public void CalculatedSi_SheetFormula(double sodium, double glucose, double urea, double expected)
        => Assert.Equal(expected, OsmolalityFormulas.CalculatedSi(sodium, glucose, urea), precision: 6);

    [Theory]
    // Calculated osmolality, US units: 2 × Na + glucose/18 + BUN/2.8 (reference sheet, secondary): 2×140 + 90/18 + 14/2.8 = 290.
    [InlineData(140, 90, 14, 290)]
    [InlineData(128, 650, 28, 302.111)]
    public void CalculatedUs_SheetFormula(double sodium, double glucoseMgPerDl, double bunMgPerDl, double expected)
        => Assert.Equal(expected, OsmolalityFormulas.CalculatedUs(sodium, glucoseMgPerDl, bunMgPerDl), precision: 3);

    [Theory]
    // The US form with rounded divisors (18, 2.8) and the SI form on exactly converted values agree to within 0.1 mOsm/kg
    // across the plausible range (glucose up to 1000 mg/dL, BUN up to 150 mg/dL): the divisors differ by < 0.1 % (reference sheet).
    [InlineData(110, 40, 5)]
    [InlineData(128, 650, 28)]
    [InlineData(134, 1000, 150)]
    [InlineData(120, 100, 8)]
    public void CalculatedUsAndSi_SamePatient_AgreeWithinATenth(double sodium, double glucoseMgPerDl, double bunMgPerDl)
    {
        var si = OsmolalityFormulas.CalculatedSi(sodium, glucoseMgPerDl / 18.016, bunMgPerDl / 2.8014);
        var us = OsmolalityFormulas.CalculatedUs(sodium, glucoseMgPerDl, bunMgPerDl);
        Assert.InRange(us - si, 0, 0.1);
    }

    [Theory]
    // Katz 1973 (N Engl J Med 289:843): +1.6 mmol/L per 100 mg/dL of glucose above 100 mg/dL; none at or below 100.
    [InlineData(130, 99, 130)]
    [InlineData(130, 100, 130)]
    [InlineData(130, 101, 130.016)]
    [InlineData(130, 200, 131.6)]
    [InlineData(130, 600, 138)]
    [InlineData(128, 650, 136.8)] // scenario 05 (manifest: Katz 136.8)
    public void KatzCorrectedSodium_PublishedFactor(double sodium, double glucoseMgPerDl, double expected)
        => Assert.Equal(expected, OsmolalityFormulas.KatzCorrectedSodium(sodium, glucoseMgPerDl), precision: 6);

    [Theory]
    // Hillier et al. 1999 (Am J Med 106:399): +2.4 mmol/L per 100 mg/dL of glucose above 100 mg/dL.
    [InlineData(130, 100, 130)]
    [InlineData(130, 200, 132.4)]
    [InlineData(130, 400, 137.2)]
    [InlineData(130, 500, 139.6)]
    [InlineData(128, 650, 141.2)] // scenario 05 (manifest: Hillier 141.2)
    public void HillierCorrectedSodium_PublishedFactor(double sodium, double glucoseMgPerDl, double expected)
        => Assert.Equal(expected, OsmolalityFormulas.HillierCorrectedSodium(sodium, glucoseMgPerDl), precision: 6);

    [Theory]
    // Hillier et al., Am J Med 1999;106:399 (abstract): up to 400 mg/dL the standard 1.6 per 100 mg/dL fitted well; above
    // 400 mg/dL a factor of 4.0 was better (reference sheet: "4.0 above 400 mg/dL"). So 400 → 1.6 × 3 = 4.8;
    // 401 → 4.8 + 0.04; 500 → 4.8 + 4.0 × 1 = 8.8; 650 → 4.8 + 10 = 14.8.
    [InlineData(130, 400, 134.8)]
    [InlineData(130, 401, 134.84)]
    [InlineData(130, 500, 138.8)]
    [InlineData(128, 650, 142.8)]
    public void HillierSteepCorrectedSodium_SteeperAbove400(double sodium, double glucoseMgPerDl, double expected)
        => Assert.Equal(expected, OsmolalityFormulas.HillierSteepCorrectedSodium(sodium, glucoseMgPerDl), precision: 6);

    [Fact]
    public void EffectiveAndGap_SubtractUreaAndCalculated()
    {
        // Effective osmolality = total − urea (urea is an ineffective osmole: common practice); gap = measured − calculated (sheet).
        Assert.Equal(261.9, OsmolalityFormulas.Effective(279, 17.1), precision: 6);
        Assert.Equal(18.9, OsmolalityFormulas.OsmolalGap(288, 269.1), precision: 6);
    }
}
