using CdsNatremia.Core.CorrectionRate;
using CdsNatremia.Core.Facts;

namespace CdsNatremia.Core.Tests.CorrectionRate;

public class AdrogueMadiasTests
{
    [Fact]
    public void ChangePerLitre_FollowsTheFormula()
    {
        // Adrogué & Madias, N Engl J Med 2000;342:1581 (formula verified in secondary sources, reference sheet):
        // change per litre = (infusate Na + infusate K − serum Na) / (TBW + 1).
        // 0.9% saline 154 mmol/L (reference sheet, secondary), serum 120, TBW 35 L: (154 + 0 − 120) / 36 = 0.9444…
        Assert.Equal(34.0 / 36.0, AdrogueMadias.ChangePerLitre(154, 0, 120, 35), 10);

        // Potassium counts with sodium: Ringer's lactate 130 + 4 (K from memory), serum 110, TBW 29 L: 24 / 30 = 0.8.
        Assert.Equal(0.8, AdrogueMadias.ChangePerLitre(130, 4, 110, 29), 10);
    }

    [Fact]
    public void ChangePerLitre_HypotonicFluidAboveSerumSodium_Lowers()
        => Assert.True(AdrogueMadias.ChangePerLitre(77, 0, 118, 30) < 0); // 0.45% saline 77 mmol/L (reference sheet) below serum 118

    [Fact]
    public void ChangeForVolume_FurstWorkedExample_108To112()
    {
        // Worked example (Furst et al., Am J Med Sci 2000;319:240; reference sheet: secondary): 50 kg, TBW fraction 0.6,
        // serum sodium 108 mmol/L, 292 mL of 3% saline (513 mmol/L) raises sodium to 112 mmol/L.
        var water = 50 * 0.6;
        var perLitre = AdrogueMadias.ChangePerLitre(513, 0, 108, water);
        var after = 108 + AdrogueMadias.ChangeForVolume(perLitre, 292);
        Assert.Equal(112, Math.Round(after));
        Assert.Equal(13.06, perLitre, 2); // (513 − 108) / 31
    }

    [Fact]
    public void Scenario16_SixtyKgWomanAt118_ThreePercent150mL()
    {
        // Scenario 16 manifest: TBW 0.5 × 60 = 30 L (woman under 70, reference sheet fractions), infusate 513 mmol/L:
        // (513 − 118) / 31 = 12.74 per litre; 150 mL → 1.91 mmol/L.
        var water = BodyWater.Estimate(60, PatientSex.Female, 55, new InfusionOptions());
        Assert.Equal(30, water.Litres, 10);
        var perLitre = AdrogueMadias.ChangePerLitre(513, 0, 118, water.Litres);
        Assert.Equal(12.7, Math.Round(perLitre, 1));
        Assert.Equal(1.9, Math.Round(AdrogueMadias.ChangeForVolume(perLitre, 150), 1));
    }

    [Theory]
    [InlineData(0)]
    [InlineData(-5)]
    [InlineData(double.NaN)]
    public void ChangePerLitre_NoBodyWater_Throws(double water)
        => Assert.Throws<ArgumentOutOfRangeException>(() => AdrogueMadias.ChangePerLitre(154, 0, 120, water));
}
