using CdsNatremia.Core.Drugs;
using CdsNatremia.Core.Facts;
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
        Assert.Contains("not recorded", evidence.Text, StringComparison.Ordinal);
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
        Assert.Contains("138 mmol/L", evidence.Text, StringComparison.Ordinal);
        Assert.Contains("124 mmol/L", evidence.Text, StringComparison.Ordinal);
        Assert.Contains("effectivePeriod.start", evidence.Text, StringComparison.Ordinal);
        Assert.Equal("likely contributor", evidence.VerdictText);
    }
}
