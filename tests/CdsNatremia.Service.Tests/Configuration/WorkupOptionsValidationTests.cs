using CdsNatremia.Core.Engine;
using CdsNatremia.Core.Workup;
using CdsNatremia.Scenarios;
using CdsNatremia.Service.Configuration;
using CdsNatremia.Service.Tests.Support;

namespace CdsNatremia.Service.Tests.Configuration;

public class WorkupOptionsValidationTests
{
    [Fact]
    public void Validate_Defaults_Succeed()
        => Assert.True(new RuleOptionsValidator().Validate(null, new RuleOptions()).Succeeded);

    [Theory]
    [InlineData(240, 295)] // below the [Range] of HypotonicBelow
    [InlineData(290, 285)] // hypotonic edge above the hypertonic edge
    public void Validate_BadTonicityEdges_FailNamingTheSection(double hypotonicBelow, double hypertonicAbove)
    {
        var options = new RuleOptions { Workup = new WorkupOptions { HypotonicBelow = hypotonicBelow, HypertonicAbove = hypertonicAbove } };
        var result = new RuleOptionsValidator().Validate(null, options);
        Assert.True(result.Failed);
        Assert.Contains("Natremia:Rules:Workup", result.FailureMessage, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData(1.2, 1.0, false)] // stricter band starting above the "unlikely" edge: the Furst bands would overlap
    [InlineData(0.5, 1.0, true)]  // defaults (Furst et al. 2000; bands from memory)
    [InlineData(1.0, 1.0, true)]
    public void Validate_FurstBands_StricterEdgeMustNotExceedTheUnlikelyEdge(double stricterFrom, double unlikelyAbove, bool valid)
    {
        var options = new RuleOptions { Workup = new WorkupOptions { FurstStricterRestrictionFrom = stricterFrom, FurstRestrictionUnlikelyAbove = unlikelyAbove } };
        var result = new RuleOptionsValidator().Validate(null, options);
        Assert.Equal(valid, result.Succeeded);
        if (!valid)
        {
            Assert.Contains("FurstStricterRestrictionFrom must not exceed FurstRestrictionUnlikelyAbove", result.FailureMessage, StringComparison.Ordinal);
        }
    }

    [Fact]
    public async Task Configuration_KatzChosen_ServiceSummaryUsesKatz()
    {
        await using var factory = NatremiaFactory.With(new() { ["Natremia:Rules:Workup:GlucoseCorrection"] = "Katz" });
        var cards = await HookCalls.RunAsync(factory.CreateClient(), ScenarioLibrary.Find("05")!);
        // Katz 1973: 128 + 1.6 × (650 − 100)/100 = 136.8 mmol/L.
        Assert.Contains(cards, c => ((string)c!["summary"]!).Contains("corrected sodium 136.8 mmol/L (Katz)", StringComparison.Ordinal));
    }
}
