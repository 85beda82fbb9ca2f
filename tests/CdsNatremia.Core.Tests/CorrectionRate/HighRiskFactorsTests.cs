using CdsNatremia.Core.CorrectionRate;
using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Findings;
using CdsNatremia.Core.Knowledge;
using CdsNatremia.Core.Tests.Support;

namespace CdsNatremia.Core.Tests.CorrectionRate;

public class HighRiskFactorsTests
{
    // US expert panel (Verbalis et al. 2013, reference sheet, secondary): hypokalaemia makes osmotic demyelination more
    // likely; it is judged during the episode, so a low value at the nadir counts even after it was replaced.
    [Fact]
    public void Find_LowPotassiumAtTheNadirSinceReplaced_StillHighRisk()
    {
        var nadir = Some.Sodium(112, hoursAgo: 30);
        var facts = Some.Facts(nadir, Some.Lab(Analyte.Potassium, 2.9, hoursAgo: 29), Some.Lab(Analyte.Potassium, 4.0, hoursAgo: 2));
        var factors = HighRiskFactors.Find(facts, nadir, KnowledgeBase.Empty, new CorrectionRateOptions());
        Assert.Contains(factors, f => f.Kind == "potassium" && f.Description.Kind == FindingKind.RateFactorPotassiumConfigured && f.Description["potassium"] == new NumberValue(2.9, null));
    }

    [Fact]
    public void Find_LowPotassiumLongBeforeTheEpisode_NotCounted()
    {
        var nadir = Some.Sodium(112, hoursAgo: 30);
        var facts = Some.Facts(nadir, Some.Lab(Analyte.Potassium, 2.9, hoursAgo: 24 * 400), Some.Lab(Analyte.Potassium, 4.0, hoursAgo: 2));
        var factors = HighRiskFactors.Find(facts, nadir, KnowledgeBase.Empty, new CorrectionRateOptions());
        Assert.DoesNotContain(factors, f => f.Kind == "potassium");
    }

    [Fact]
    public void LowestOfLowStretch_NadirOlderThanTheEpisodeWindow_StillFound()
    {
        // Found in review: 104 at 0 h, 110 at 24 h, 116 at 48 h, 120 at 73 h. The 72-h episode sees 110 as its nadir, but
        // sodium ≤ 105 mmol/L (US expert panel, reference sheet) makes the whole correction high risk.
        var facts = Some.Facts(Some.Sodium(104, 73, id: "na-104"), Some.Sodium(110, 49), Some.Sodium(116, 25), Some.Sodium(120, 0));
        var series = CdsNatremia.Core.Sodium.SodiumSeries.From(facts, Some.Now, new CdsNatremia.Core.Sodium.SodiumReadingOptions());
        var lowest = HighRiskFactors.LowestOfLowStretch(series, series.Results[1], 135);
        Assert.Equal("na-104", lowest.ResourceId);
        Assert.Contains(HighRiskFactors.Find(facts, lowest, KnowledgeBase.Empty, new CorrectionRateOptions()), f => f.Kind == "nadir");
    }

    [Fact]
    public void LowestOfLowStretch_StopsAtTheLastNormalValue()
    {
        var facts = Some.Facts(Some.Sodium(100, 200), Some.Sodium(138, 150), Some.Sodium(110, 49), Some.Sodium(120, 0));
        var series = CdsNatremia.Core.Sodium.SodiumSeries.From(facts, Some.Now, new CdsNatremia.Core.Sodium.SodiumReadingOptions());
        Assert.Equal(110, HighRiskFactors.LowestOfLowStretch(series, series.Results[2], 135).Value);
    }
}
