using CdsNatremia.Service.Tests.Support;

namespace CdsNatremia.Service.Tests.Drugs;

/// <summary>Drug-cause options out of their [Range] stop start-up with the option named.</summary>
public class DrugCauseOptionsStartupTests
{
    [Theory]
    [InlineData("MeaningfulDropMmolPerL", "0")]     // below the range 1–20
    [InlineData("RecheckWithinHours", "0")]         // below the range 1–2160
    [InlineData("AbsentSodiumMinimumAgeYears", "200")] // above the range 0–130
    public void Startup_OptionOutOfRange_Refused(string option, string value)
    {
        using var factory = NatremiaFactory.With(new() { ["Natremia:Rules:DrugCause:" + option] = value });
        var ex = Record.Exception(() => factory.CreateClient());
        Assert.NotNull(ex);
        var messages = string.Join(" | ", Flatten(ex));
        Assert.Contains("Natremia:Rules:DrugCause", messages, StringComparison.Ordinal);
        Assert.Contains(option, messages, StringComparison.Ordinal);
    }

    [Fact]
    public async Task Startup_DefaultOptions_Serve()
    {
        using var factory = new NatremiaFactory();
        var response = await factory.CreateClient().GetAsync("/readyz");
        Assert.True(response.IsSuccessStatusCode);
    }

    private static IEnumerable<string> Flatten(Exception ex)
    {
        yield return ex.Message;
        if (ex is AggregateException aggregate)
        {
            foreach (var inner in aggregate.InnerExceptions.SelectMany(Flatten))
            {
                yield return inner;
            }
        }
        else if (ex.InnerException is { } inner)
        {
            foreach (var message in Flatten(inner))
            {
                yield return message;
            }
        }
    }
}
