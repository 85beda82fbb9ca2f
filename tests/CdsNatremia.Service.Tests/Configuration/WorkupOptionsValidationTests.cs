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

    [Fact]
    public async Task Configuration_KatzChosen_ServiceSummaryUsesKatz()
    {
        await using var factory = NatremiaFactory.With(new() { ["Natremia:Rules:Workup:GlucoseCorrection"] = "Katz" });
        var cards = await HookCalls.RunAsync(factory.CreateClient(), ScenarioLibrary.Find("05")!);
        // Katz 1973: 128 + 1.6 × (650 − 100)/100 = 136.8 mmol/L.
        Assert.Contains(cards, c => ((string)c!["summary"]!).Contains("corrected sodium 136.8 mmol/L (Katz)", StringComparison.Ordinal));
    }
}
