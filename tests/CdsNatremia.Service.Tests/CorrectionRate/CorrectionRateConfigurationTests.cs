using CdsNatremia.Scenarios;
using CdsNatremia.Service.Tests.Support;
using Microsoft.Extensions.Options;

namespace CdsNatremia.Service.Tests.CorrectionRate;

/// <summary>The correction-rate options bind from configuration and are validated at start.</summary>
public class CorrectionRateConfigurationTests
{
    [Fact]
    public async Task CustomLimits_ChangeTheCard()
    {
        // With a local first-24-h limit of 14, scenario 11's rise of 12 is only approaching it (within the 2 mmol/L margin).
        using var custom = NatremiaFactory.With(new()
        {
            ["Natremia:Rules:CorrectionRate:Preset"] = "Custom",
            ["Natremia:Rules:CorrectionRate:FirstDayLimit"] = "14",
            ["Natremia:Rules:CorrectionRate:TwoDayLimit"] = "30",
            ["Natremia:Rules:CorrectionRate:CustomSource"] = "local protocol of the test hospital",
        });
        var cards = await HookCalls.RunAsync(custom.CreateClient(), ScenarioLibrary.Find("11")!);
        var card = CorrectionRateScenarioTests.ByTopic(cards, "correction-rate")!;
        Assert.Equal("warning", (string?)card["indicator"]);
        Assert.Contains("local protocol of the test hospital", (string)card.CardText(), StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("Natremia:Rules:CorrectionRate:ApproachingWithinMmolPerL", "-1")] // [Range(0, 10)]
    [InlineData("Natremia:Rules:Infusion:Saline3Sodium", "5")] // [Range(300, 700)]
    public void OutOfRangeSetting_ServiceRefusesToStart(string key, string value)
    {
        using var bad = NatremiaFactory.With(new() { [key] = value });
        Assert.Throws<OptionsValidationException>(() => bad.CreateClient());
    }

    [Fact]
    public void HighRiskLimitAboveTheUsualOne_ServiceRefusesToStart()
    {
        using var bad = NatremiaFactory.With(new()
        {
            ["Natremia:Rules:CorrectionRate:Preset"] = "Custom",
            ["Natremia:Rules:CorrectionRate:HighRiskDayLimit"] = "12",
        });
        // The host may wrap the validation failure; the message must say what is wrong wherever it sits in the chain.
        var error = Assert.ThrowsAny<Exception>(() => bad.CreateClient());
        Assert.Contains("high-risk limits", Exceptions.AllMessages(error), StringComparison.Ordinal);
    }
}
