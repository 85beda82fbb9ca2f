using CdsNatremia.Service.Telemetry;

namespace CdsNatremia.Service.Tests.Telemetry;

/// <summary>The fetcher's outcome words and the FHIR layer's set-aside sentences fold onto small fixed label sets.</summary>
public sealed class FetchOutcomeTests
{
    [Theory]
    [InlineData("data", "fetched")]
    [InlineData("no data", "fetched")]
    [InlineData("partial", "fetched")]
    [InlineData("deadline", "timed out")]
    [InlineData("attempt time-out", "timed out")]
    [InlineData("circuit open", "circuit open")]
    [InlineData("refused", "refused")]
    [InlineData("unreachable", "failed")]
    [InlineData("malformed JSON", "failed")]
    public void FetchOutcome_FetcherWord_MapsOntoTheBoundedSet(string detail, string expected)
    {
        Assert.Equal(expected, NatremiaTelemetry.FetchOutcome(detail));
        Assert.Contains(expected, NatremiaTelemetry.FetchOutcomes);
    }

    [Theory]
    [InlineData("its subject is not the patient in the hook context", "other-patient")]
    [InlineData("status entered-in-error: a result entered in error never counts", "status")]
    [InlineData("unit 'mg/dL' is not one the service accepts for sodium (mmol/L); not converted, never guessed", "unit")]
    [InlineData("value is outside the plausible range for sodium (80–200 mmol/L): likely a unit or entry error", "implausible")]
    [InlineData("no unit was given; the service never guesses a unit", "no-unit")]
    [InlineData("Patient 12345 said something new", "other")]
    public void Classify_ReasonSentence_OneOfTheFixedClasses(string reason, string expected)
    {
        Assert.Equal(expected, SetAsideReasons.Classify(reason));
        Assert.Contains(expected, SetAsideReasons.Classes);
    }
}
