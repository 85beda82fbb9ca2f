using CdsNatremia.Core.Sodium;

namespace CdsNatremia.Core.Tests.Sodium;

public class SeverityThresholdsTests
{
    // Source for every European2014 row: 2014 European clinical practice guideline (Spasovski et al.,
    // Eur J Endocrinol 2014;170:G1): mild 130–135, moderate 125–129, profound < 125 mmol/L (verified on the
    // reference sheet). Normal from 135 and up to 145: common practice (reference range 135–145 mmol/L).
    [Theory]
    [InlineData(124.9, SeverityBand.Profound)] // just below the moderate edge
    [InlineData(125.0, SeverityBand.Moderate)] // at the edge
    [InlineData(125.1, SeverityBand.Moderate)] // just above
    [InlineData(129.9, SeverityBand.Moderate)]
    [InlineData(130.0, SeverityBand.Mild)]
    [InlineData(130.1, SeverityBand.Mild)]
    [InlineData(134.9, SeverityBand.Mild)]
    [InlineData(135.0, SeverityBand.Normal)] // hyponatremia is < 135 (guideline); 135 is normal
    [InlineData(135.1, SeverityBand.Normal)]
    [InlineData(145.0, SeverityBand.Normal)] // upper limit of normal, common practice
    [InlineData(145.1, SeverityBand.AboveRange)] // high sodium: out of scope
    [InlineData(104, SeverityBand.Profound)]
    public void Classify_European2014_PlacesBoundariesAsTheGuidelineDoes(double sodium, SeverityBand expected)
        => Assert.Equal(expected, new SeverityOptions().Resolve().Classify(sodium));

    // Source: the older teaching cut-off "severe < 120 mmol/L" (common practice, reference sheet).
    [Theory]
    [InlineData(119.9, SeverityBand.Profound)]
    [InlineData(120.0, SeverityBand.Moderate)]
    [InlineData(120.1, SeverityBand.Moderate)]
    [InlineData(124.0, SeverityBand.Moderate)]
    [InlineData(129.9, SeverityBand.Moderate)]
    [InlineData(130.0, SeverityBand.Mild)]
    public void Classify_SevereBelow120Preset_UsesTheOlderCutOff(double sodium, SeverityBand expected)
    {
        var thresholds = new SeverityOptions { Preset = SeverityPreset.SevereBelow120 }.Resolve();
        Assert.Equal(expected, thresholds.Classify(sodium));
        Assert.Equal("severe", thresholds.NameOf(SeverityBand.Profound));
    }

    [Fact]
    public void Resolve_CustomPreset_TakesConfiguredNumbers()
    {
        var thresholds = new SeverityOptions { Preset = SeverityPreset.Custom, NormalFrom = 136, MildFrom = 131, ModerateFrom = 126, LowestBandName = "severe" }.Resolve();
        Assert.Equal(SeverityBand.Mild, thresholds.Classify(135.5));
        Assert.Equal(SeverityBand.Profound, thresholds.Classify(125.9));
    }

    [Fact]
    public void Classify_NotFinite_Throws()
        => Assert.Throws<ArgumentOutOfRangeException>(() => new SeverityOptions().Resolve().Classify(double.NaN));
}
