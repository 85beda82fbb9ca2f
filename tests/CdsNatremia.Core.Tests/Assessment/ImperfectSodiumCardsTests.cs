using CdsNatremia.Core.Assessment;
using CdsNatremia.Core.Cards;
using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Sodium;
using CdsNatremia.Core.Tests.Support;

namespace CdsNatremia.Core.Tests.Assessment;

/// <summary>The newest sodium that is a bound or could not be read: reasoned with, never silent.</summary>
public class ImperfectSodiumCardsTests
{
    private static readonly SeverityThresholds Thresholds = new SeverityOptions().Resolve();

    private static LabResult Bound(ValueComparator comparator, double value, double hoursAgo = 1, string id = "na-bound")
        => Some.Sodium(value, hoursAgo, id: id) with { Comparator = comparator };

    private static IReadOnlyList<Card> Decide(PatientFacts facts) => Some.Engine().Decide(Some.Request(facts));

    // 2014 European guideline bands: profound < 125, moderate 125–129, mild 130–134, normal from 135.
    [Theory]
    [InlineData(ValueComparator.LessThan, 100.0, SeverityBand.Profound, false)]
    [InlineData(ValueComparator.LessThan, 125.0, SeverityBand.Profound, false)]    // < 125: all profound
    [InlineData(ValueComparator.LessOrEqual, 125.0, SeverityBand.Moderate, true)]  // ≤ 125: 125 moderate or lower
    [InlineData(ValueComparator.LessThan, 130.0, SeverityBand.Moderate, true)]
    [InlineData(ValueComparator.LessThan, 135.0, SeverityBand.Mild, true)]
    [InlineData(ValueComparator.GreaterThan, 150.0, SeverityBand.Normal, false)]   // > 150: not low
    [InlineData(ValueComparator.GreaterOrEqual, 135.0, SeverityBand.Normal, false)]
    public void Place_BoundThatDecides_Band(ValueComparator comparator, double value, SeverityBand band, bool moreSevereOpen)
        => Assert.Equal(((SeverityBand?)band, moreSevereOpen), ImperfectSodiumCards.Place(Bound(comparator, value), Thresholds));

    [Theory]
    [InlineData(ValueComparator.LessThan, 140.0)]     // could be normal or low
    [InlineData(ValueComparator.GreaterThan, 120.0)]  // could be low or normal
    public void Place_BoundSpanningNormalAndLow_CannotTell(ValueComparator comparator, double value)
        => Assert.Null(ImperfectSodiumCards.Place(Bound(comparator, value), Thresholds).Band);

    [Fact]
    public void Decide_NewestBelow100AfterMeasured126_CriticalProfoundNoRateCard()
    {
        var cards = Decide(Some.Facts(Some.Sodium(126, 48)) with { BoundedLabs = [Bound(ValueComparator.LessThan, 100)] });
        var card = Assert.Single(cards); // no correction-rate card: no rate from a bound
        Assert.Equal(CardIndicator.Critical, card.Indicator);
        Assert.StartsWith("Sodium below 100 mmol/L (profound hyponatremia", card.Summary, StringComparison.Ordinal);
        Assert.Contains(ImperfectSodiumCards.BoundedRuleId, card.RuleIds);
    }

    [Fact]
    public void Decide_NewestAbove150AfterLowValue_NoCardAsForNormal()
        => Assert.Empty(Decide(Some.Facts(Some.Sodium(128, 30)) with { BoundedLabs = [Bound(ValueComparator.GreaterThan, 150)] }));

    [Fact]
    public void Decide_BoundBelow100FourDaysOld_AtMostWarning()
    {
        // A result older than the stale window (72 h, common practice) gives at most a warning.
        var card = Assert.Single(Decide(Some.Facts() with { BoundedLabs = [Bound(ValueComparator.LessThan, 100, hoursAgo: 96)] }));
        Assert.Equal(CardIndicator.Warning, card.Indicator);
    }

    [Fact]
    public void Decide_NewestUnreadableOlderNormal_InfoCardNamingTheReason()
    {
        var unreadable = new SetAsideItem("Observation/na-9", "Sodium 12400 mmol/L", "value is outside the plausible range for sodium (80–200 mmol/L)", Analyte.Sodium, Some.Now.AddHours(-1));
        var card = Assert.Single(Decide(Some.Facts(Some.Sodium(138, 20)) with { SetAside = [unreadable] }));
        Assert.Equal(CardIndicator.Info, card.Indicator);
        Assert.Contains("could not be used", card.Summary, StringComparison.Ordinal);
        Assert.Contains("plausible range", card.Report, StringComparison.Ordinal);
        Assert.Contains(card.Suggestions, s => s.Label.Contains("Sodium", StringComparison.Ordinal));
    }

    [Fact]
    public void Decide_NewestUnreadableOlderValuesLow_Warning()
    {
        var unreadable = new SetAsideItem("Observation/na-9", "Sodium (unreadable entry)", "it could not be read as FHIR R4", Analyte.Sodium, Some.Now.AddHours(-1));
        var card = Assert.Single(Decide(Some.Facts(Some.Sodium(129, 40), Some.Sodium(136, 20)) with { SetAside = [unreadable] }));
        Assert.Equal(CardIndicator.Warning, card.Indicator);
        Assert.Contains("Earlier low value", card.Report, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData(FactState.NotThisPatient)]
    [InlineData(FactState.Superseded)]
    [InlineData(FactState.Absent)]
    public void Decide_NewerSetAsideThatIsNotUnreadable_NormalStaysSilent(FactState state)
    {
        var item = new SetAsideItem("Observation/na-9", "Sodium", "reason", Analyte.Sodium, Some.Now.AddHours(-1), state);
        Assert.Empty(Decide(Some.Facts(Some.Sodium(138, 20)) with { SetAside = [item] }));
    }

    [Fact]
    public void Decide_AnotherPatientsNewerLowResult_NeitherSummaryNorIndicatorChange()
    {
        var own = Some.Facts(Some.Sodium(131, 3));
        var withOther = own with { SetAside = [SetAsideItem.AboutAnotherPatient("Observation", Analyte.Sodium)] };
        var clean = Assert.Single(Decide(own));
        var card = Assert.Single(Decide(withOther));
        Assert.Equal(clean.Summary, card.Summary);
        Assert.Equal(clean.Indicator, card.Indicator);
        Assert.Contains("1 resource about another patient was ignored", card.Report, StringComparison.Ordinal);
        Assert.DoesNotContain("a resource about another patient (not shown)", clean.Report, StringComparison.Ordinal);
    }

    [Fact]
    public void Decide_StaleProfoundSodium_AtMostWarning()
    {
        // 120 mmol/L is profound (2014 European guideline), but taken 96 h ago, beyond the 72-h stale window (common practice).
        var card = Assert.Single(Decide(Some.Facts(Some.Sodium(120, 96))));
        Assert.Equal(CardIndicator.Warning, card.Indicator);
        Assert.Contains("stale", card.Summary, StringComparison.Ordinal);
    }

    [Fact]
    public void Decide_HistoryUnavailable_SaysWhichChecksCouldNotBeMade()
    {
        var card = Assert.Single(Decide(Some.Facts(Some.Sodium(124, 1)) with { SodiumHistoryUnavailable = "prefetch 'sodium' was not sent" }));
        Assert.Contains("**onset**", card.Report, StringComparison.Ordinal);
        Assert.Contains("**correction rate**", card.Report, StringComparison.Ordinal);
        Assert.Contains("**drug timing**", card.Report, StringComparison.Ordinal);
    }
}
