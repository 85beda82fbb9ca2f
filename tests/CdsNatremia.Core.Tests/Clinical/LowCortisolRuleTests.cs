using CdsNatremia.Core.Cards;
using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Tests.Support;

namespace CdsNatremia.Core.Tests.Clinical;

/// <summary>Issue 13 (10): a low cortisol means adrenal insufficiency must be considered urgently, and replacement can raise sodium quickly.</summary>
public class LowCortisolRuleTests
{
    [Fact]
    public void Apply_LowCortisol_UrgentAdrenalInsufficiencyAndRateCaution()
    {
        // Cortisol 90 nmol/L below the default 138 (5 µg/dL, from memory); glucocorticoid replacement can raise sodium
        // quickly (from memory: US expert panel, Verbalis et al. 2013).
        var card = SomeClinical.Assessment(Some.Facts(Some.Sodium(128, 2), Some.Lab(Analyte.Cortisol, 90, 2, id: "cort")));
        Assert.Contains("**adrenal insufficiency must be considered urgently**", card.Report, StringComparison.Ordinal);
        Assert.Contains("**can raise sodium quickly**", card.Report, StringComparison.Ordinal);
        Assert.Contains("low cortisol: consider adrenal insufficiency urgently", card.Summary, StringComparison.Ordinal);
        Assert.True(card.Indicator >= CardIndicator.Warning);
        Assert.Contains("Observation/cort", card.ResourcesUsed);
    }

    [Theory]
    [InlineData(137.9, true)]  // below the default 138 nmol/L (from memory)
    [InlineData(138, false)]
    [InlineData(400, false)]
    public void Apply_CortisolAroundTheDefaultLimit_UrgentOnlyBelow(double cortisol, bool urgent)
    {
        var card = SomeClinical.Assessment(Some.Facts(Some.Sodium(128, 2), Some.Lab(Analyte.Cortisol, cortisol, 2)));
        Assert.Equal(urgent, card.Report.Contains("must be considered urgently", StringComparison.Ordinal));
    }

    [Fact]
    public void Apply_LaboratoryLowerLimit_UsedBeforeTheDefault()
    {
        // Laboratory range 170–550 nmol/L sent with the result: 150 is low by it (FHIR Observation.referenceRange.low).
        var cortisol = Some.Lab(Analyte.Cortisol, 150, 2) with { ReferenceLow = 170 };
        Assert.Contains("the laboratory's lower limit of 170 nmol/L", SomeClinical.Assessment(Some.Facts(Some.Sodium(128, 2), cortisol)).Report, StringComparison.Ordinal);
    }

    [Fact]
    public void Apply_CortisolOlderThan30Days_NotUsed()
        => Assert.DoesNotContain("must be considered urgently",
            SomeClinical.Assessment(Some.Facts(Some.Sodium(128, 2), Some.Lab(Analyte.Cortisol, 90, 24 * 31))).Report, StringComparison.Ordinal);
}
