using CdsNatremia.Core.Drugs;
using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Findings;
using CdsNatremia.Core.Rendering;
using CdsNatremia.Core.Text;
using CdsNatremia.Core.Tests.Support;

namespace CdsNatremia.Core.Tests.Drugs;

public class DrugTimingTests
{
    // Sodium 138 (normal) at now − 30 days, then 124 at now − 2 h: the fall lies between them (SodiumFall definition).
    private static readonly LabResult Before = Some.Sodium(138, hoursAgo: 24 * 30, id: "na-before");
    private static readonly LabResult FirstLow = Some.Sodium(124, hoursAgo: 2, id: "na-low");
    private static readonly SodiumFall Fall = new(Before, FirstLow, FirstLow);

    private static MedicationFact Started(DateTimeOffset? at, MedicationUse use = MedicationUse.Active)
        => SomeDrugs.Statement("m1", "hydrochlorothiazide 25 mg", at) with { Use = use };

    [Theory]
    [InlineData(-1.0, TimingVerdict.Likely)]   // a minute before the result before the fall: already taken while sodium was 138
    [InlineData(0.0, TimingVerdict.Likely)]    // at the result before the fall: already taken then
    [InlineData(1.0, TimingVerdict.Likely)]    // a minute after it: began during the fall
    public void Assess_AroundTheResultBeforeTheFall(double minutesFromBefore, TimingVerdict expected)
        => Assert.Equal(expected, DrugTiming.Assess(Started(Before.EffectiveAt.AddMinutes(minutesFromBefore)), Fall).Verdict);

    [Theory]
    [InlineData(-1.0, TimingVerdict.Likely)]   // a minute before the first low result: before the fall ended
    [InlineData(0.0, TimingVerdict.Unlikely)]  // at the first low result: sodium was already this low
    [InlineData(1.0, TimingVerdict.Unlikely)]  // after it
    public void Assess_AroundTheFirstLowResult(double minutesFromFirstLow, TimingVerdict expected)
        => Assert.Equal(expected, DrugTiming.Assess(Started(FirstLow.EffectiveAt.AddMinutes(minutesFromFirstLow)), Fall).Verdict);

    [Fact]
    public void Assess_UnknownStart_Possible()
    {
        var evidence = DrugTiming.Assess(Started(null), Fall);
        Assert.Equal(TimingVerdict.Possible, evidence.Verdict);
        Assert.Equal(FindingKind.DrugTimingStartUnknown, evidence.Evidence.Kind);
        Assert.Equal(Certainty.Unknown, evidence.Evidence.Certainty); // unknown is never normal: the start is not known
        Assert.Equal(FindingKind.DrugVerdictPossible, evidence.VerdictFinding.Kind);
    }

    [Fact]
    public void Assess_NoHigherSodiumOnRecord_PossibleEvenWhenStartedBeforeTheLowResult()
    {
        var fall = new SodiumFall(null, FirstLow, FirstLow);
        Assert.Equal(TimingVerdict.Possible, DrugTiming.Assess(Started(FirstLow.EffectiveAt.AddDays(-10)), fall).Verdict);
    }

    [Fact]
    public void Assess_IntendedNotYetTaken_Unlikely()
        => Assert.Equal(TimingVerdict.Unlikely, DrugTiming.Assess(Started(Before.EffectiveAt.AddDays(-1), MedicationUse.Intended), Fall).Verdict);

    [Fact]
    public void Assess_StartedDuringTheFall_EvidenceNamesBothResultsAndTheStartSource()
    {
        var evidence = DrugTiming.Assess(Started(Before.EffectiveAt.AddDays(7)), Fall);
        Assert.Equal(FindingKind.DrugTimingDuringFall, evidence.Evidence.Kind);
        Assert.Equal(Certainty.Likely, evidence.Evidence.Certainty);
        Assert.Equal(new NumberValue(138, null), Nested(evidence.Evidence, "before")["value"]);
        Assert.Equal(new NumberValue(124, null), Nested(evidence.Evidence, "firstLow")["value"]);
        Assert.Equal(new TextValue("effectivePeriod.start", Escape: true), Nested(evidence.Evidence, "started")["source"]);
        Assert.Equal(FindingKind.DrugVerdictLikely, evidence.VerdictFinding.Kind);
        Assert.Equal(["MedicationStatement/m1", Before.Reference, FirstLow.Reference], evidence.Evidence.Evidence);
    }

    [Fact]
    public void Render_StartedDuringTheFall_FullSentenceWithTimesAndResources()
    {
        var evidence = DrugTiming.Assess(Started(Before.EffectiveAt.AddDays(7)), Fall);
        var display = TimeDisplay.Utc(Some.Now);
        Assert.Equal(
            "started 2026-02-15 (effectivePeriod.start), after 138 mmol/L at 2026-02-08 12:00 UTC (Observation/na-before) and before 124 mmol/L at 2026-03-10 10:00 UTC (Observation/na-low): it began before the fall",
            PhraseCatalogue.Default.Render(evidence.Evidence, display));
        Assert.Equal("likely contributor", PhraseCatalogue.Default.Render(evidence.VerdictFinding, display));
    }

    [Fact]
    public void Render_DateOnlyStartInAZoneWestOfUtc_DayAsRecorded()
    {
        // A start recorded as a date (midnight UTC) keeps its day; a zone 5 h west of UTC would otherwise show the day before.
        var west = TimeZoneInfo.CreateCustomTimeZone("test-west", TimeSpan.FromHours(-5), "test-west", "test-west");
        var evidence = DrugTiming.Assess(Started(new DateTimeOffset(2026, 2, 15, 0, 0, 0, TimeSpan.Zero)), Fall);
        Assert.StartsWith("started 2026-02-15 (effectivePeriod.start)", PhraseCatalogue.Default.Render(evidence.Evidence, new TimeDisplay(west, Some.Now)), StringComparison.Ordinal);
    }

    private static Finding Nested(Finding finding, string slot) => Assert.IsType<PhraseValue>(finding[slot]).Finding;
}
