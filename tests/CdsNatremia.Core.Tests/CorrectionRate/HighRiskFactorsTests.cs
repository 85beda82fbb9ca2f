using CdsNatremia.Core.CorrectionRate;
using CdsNatremia.Core.Facts;
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
        Assert.Contains(factors, f => f.Description.Contains("low potassium: 2.9", StringComparison.Ordinal));
    }

    [Fact]
    public void Find_LowPotassiumLongBeforeTheEpisode_NotCounted()
    {
        var nadir = Some.Sodium(112, hoursAgo: 30);
        var facts = Some.Facts(nadir, Some.Lab(Analyte.Potassium, 2.9, hoursAgo: 24 * 400), Some.Lab(Analyte.Potassium, 4.0, hoursAgo: 2));
        var factors = HighRiskFactors.Find(facts, nadir, KnowledgeBase.Empty, new CorrectionRateOptions());
        Assert.DoesNotContain(factors, f => f.Description.Contains("potassium", StringComparison.Ordinal));
    }
}
