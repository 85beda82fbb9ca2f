using System.Reflection;
using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Tests.Support;
using CdsNatremia.Core.Workup;

namespace CdsNatremia.Core.Tests.Facts;

/// <summary>The fact-state type on its own: a rule cannot read "could not be read" or "absent" as met, not met or normal.</summary>
public class ObservedTests
{
    private static readonly LabResult Value = Some.Lab(Analyte.UrineOsmolality, 420, id: "uosm");

    public static TheoryData<string> CouldNotBeReadStates() => ["unreadable", "superseded", "not-this-patient"];

    private static Observed<LabResult> Make(string state) => state switch
    {
        "unreadable" => Observed<LabResult>.Unreadable("unit 'mg' is not accepted", "urine osmolality 420 mg"),
        "superseded" => Observed<LabResult>.Superseded("superseded by Observation/x"),
        "not-this-patient" => Observed<LabResult>.NotThisPatient(),
        _ => throw new ArgumentOutOfRangeException(nameof(state)),
    };

    [Theory]
    [MemberData(nameof(CouldNotBeReadStates))]
    public void Judge_StateThatCouldNotBeRead_CouldNotBeReadWhateverTheCriterionSays(string state)
    {
        var observed = Make(state);
        Assert.Equal(CriterionStatus.CouldNotBeRead, observed.Judge(_ => true, _ => true));
        Assert.Equal(CriterionStatus.CouldNotBeRead, observed.Judge(_ => false, _ => false));
        Assert.True(observed.CouldNotBeRead);
        Assert.False(observed.HasValue);
        Assert.StartsWith("could not be read: ", observed.CouldNotBeReadText, StringComparison.Ordinal);
    }

    [Fact]
    public void Judge_Absent_UnknownNeverMet()
    {
        var absent = Observed<LabResult>.Absent("no urine osmolality");
        Assert.Equal(CriterionStatus.Unknown, absent.Judge(_ => true));
        Assert.Equal(CriterionStatus.Unknown, absent.Judge(_ => false));
        Assert.Null(absent.CouldNotBeReadText);
    }

    [Fact]
    public void Judge_Usable_MetOrNotMetOnTheValue()
    {
        // 2014 European guideline SIADH criterion: urine osmolality > 100 mOsm/kg.
        Assert.Equal(CriterionStatus.Met, Observed<LabResult>.Usable(Value).Judge(r => r.Value > 100));
        Assert.Equal(CriterionStatus.NotMet, Observed<LabResult>.Usable(Value).Judge(r => r.Value > 500));
    }

    [Fact]
    public void Judge_BoundThatDoesNotDecide_UnknownAndWithoutBoundRuleNeverDecided()
    {
        var bound = Observed<LabResult>.Bounded(Value with { Comparator = ValueComparator.LessThan });
        Assert.Equal(CriterionStatus.Unknown, bound.Judge(r => r.Value > 100));              // no bound rule: a bound never decides
        Assert.Equal(CriterionStatus.Unknown, bound.Judge(r => r.Value > 100, _ => null));
        Assert.Equal(CriterionStatus.NotMet, bound.Judge(r => r.Value > 100, _ => false));
    }

    [Fact]
    public void Match_EachStateCallsOnlyItsOwnBranch()
    {
        string Which(Observed<LabResult> o) => o.Match(_ => "usable", _ => "bounded", x => "unread:" + x.State, _ => "absent");
        Assert.Equal("usable", Which(Observed<LabResult>.Usable(Value)));
        Assert.Equal("bounded", Which(Observed<LabResult>.Bounded(Value)));
        Assert.Equal("unread:Unreadable", Which(Make("unreadable")));
        Assert.Equal("unread:Superseded", Which(Make("superseded")));
        Assert.Equal("unread:NotThisPatient", Which(Make("not-this-patient")));
        Assert.Equal("absent", Which(Observed<LabResult>.Absent("none")));
    }

    [Fact]
    public void Observed_HasNoPublicMemberThatHandsOutTheValue()
    {
        // The value is reachable only through Match and Judge, which make the caller answer for every state.
        var members = typeof(Observed<LabResult>).GetMembers(BindingFlags.Public | BindingFlags.Instance)
            .Where(m => m is PropertyInfo p && p.PropertyType == typeof(LabResult)
                || m is MethodInfo mi && mi.ReturnType == typeof(LabResult)
                || m is MethodInfo withOut && withOut.GetParameters().Any(p => p.IsOut))
            .Select(m => m.Name)
            .ToList();
        Assert.Empty(members);
    }

    [Fact]
    public void NotThisPatient_CarriesNoItemText()
        => Assert.Null(Observed<LabResult>.NotThisPatient().ItemText);

    [Fact]
    public void Observe_OnlySetAsideResult_CouldNotBeReadNotAbsent()
    {
        var facts = Some.Facts() with { SetAside = [new SetAsideItem("Observation/u1", "Urine sodium 40 mmol/d", "unit 'mmol/d' is not accepted", Analyte.UrineSodium, Some.Now.AddHours(-1))] };
        var observed = facts.Observe(Analyte.UrineSodium);
        Assert.Equal(FactState.Unreadable, observed.State);
        Assert.Contains("Observation/u1", observed.Reason, StringComparison.Ordinal);
    }

    [Fact]
    public void Observe_OnlyAnotherPatientsResult_NotThisPatient()
    {
        var facts = Some.Facts() with { SetAside = [SetAsideItem.AboutAnotherPatient("Observation", Analyte.UrineSodium)] };
        Assert.Equal(FactState.NotThisPatient, facts.Observe(Analyte.UrineSodium).State);
    }

    [Fact]
    public void Observe_WithdrawnOrSupersededOnly_Absent()
    {
        var facts = Some.Facts() with
        {
            SetAside =
            [
                new SetAsideItem("Observation/u1", "Urine sodium", "entered in error", Analyte.UrineSodium, Some.Now, FactState.Absent),
                new SetAsideItem("Observation/u2", "Urine sodium", "superseded", Analyte.UrineSodium, Some.Now, FactState.Superseded),
            ],
        };
        Assert.Equal(FactState.Absent, facts.Observe(Analyte.UrineSodium).State);
    }

    [Fact]
    public void Observe_BoundNewerThanMeasurement_Bounded()
    {
        var facts = Some.Facts(Some.Lab(Analyte.UrineSodium, 45, hoursAgo: 5)) with
        {
            BoundedLabs = [Some.Lab(Analyte.UrineSodium, 20, hoursAgo: 1) with { Comparator = ValueComparator.LessThan }],
        };
        Assert.Equal(FactState.Bounded, facts.Observe(Analyte.UrineSodium).State);
    }
}
