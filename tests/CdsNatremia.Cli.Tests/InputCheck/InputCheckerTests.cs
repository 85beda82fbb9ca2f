using CdsNatremia.Cli.InputCheck;
using CdsNatremia.Core.Sodium;
using CdsNatremia.Fhir.Knowledge;
using CdsNatremia.Scenarios;
using CdsNatremia.Service.Hooks;
using CdsNatremia.Service.Knowledge;

namespace CdsNatremia.Cli.Tests.InputCheck;

public class InputCheckerTests
{
    private static readonly InputChecker Checker = new(
        new SodiumReadingOptions(),
        KnowledgeLoader.Load(KnowledgeDirectory.Resolve(null, AppContext.BaseDirectory)).Base,
        PrefetchKeys.Templates);

    private static ResourceVerdict Verdict(string scenario, string reference, DateTimeOffset? now = null)
    {
        var report = Checker.Check(ScenarioLibrary.Find(scenario)!.BundleJson, null, now ?? ScenarioLibrary.Anchor);
        Assert.True(report.Readable);
        return report.Resources.Single(r => r.Reference == reference);
    }

    [Fact]
    public void Check_SodiumInMgPerDl_SetAsideForItsUnit()
    {
        // Sodium is reported in mmol/L (or mEq/L); mg/dL is not a unit for it (common practice).
        var verdict = Verdict("14", "Observation/s14-na-2");
        Assert.Equal("set-aside", verdict.Verdict);
        Assert.Contains("mg/dL", verdict.Reason, StringComparison.Ordinal);
        Assert.Contains("sodium", verdict.PrefetchKeys);
    }

    [Fact]
    public void Check_EnteredInError_SetAside()
        => Assert.Contains("entered-in-error", Verdict("15", "Observation/s15-na-2").Reason, StringComparison.Ordinal);

    [Fact]
    public void Check_Hydrochlorothiazide_MatchedToTheThiazideGroup()
    {
        // RxNorm 5487 is hydrochlorothiazide (clinical reference sheet, verified), a thiazide.
        var verdict = Verdict("01", "MedicationStatement/s01-hctz");
        Assert.Equal("used", verdict.Verdict);
        Assert.Contains("thiazide", verdict.Reason, StringComparison.Ordinal);
    }

    [Fact]
    public void Check_LatestSodiumFourDaysLater_Stale()
    {
        Assert.Equal("used", Verdict("01", "Observation/s01-na-2").Verdict);
        Assert.Equal("used-stale", Verdict("01", "Observation/s01-na-2", ScenarioLibrary.Anchor.AddDays(4)).Verdict); // > 72 h default
    }

    [Fact]
    public void Check_InvalidDateAndUnknownElement_FhirIssuesListed()
    {
        // FHIR R4 dateTime is YYYY, YYYY-MM, YYYY-MM-DD or YYYY-MM-DDThh:mm:ss+zz:zz (datatypes §2.24.0.1); "yesterday" is none.
        const string bundle = """
            {"resourceType":"Bundle","type":"collection","entry":[
              {"resource":{"resourceType":"Patient","id":"p1","favouriteColour":"blue"}},
              {"resource":{"resourceType":"Condition","id":"c1","subject":{"reference":"Patient/p1"},"onsetDateTime":"yesterday","code":{"text":"x"}}}]}
            """;
        var report = Checker.Check(bundle, null, ScenarioLibrary.Anchor);
        Assert.NotEmpty(report.Resources.Single(r => r.Reference == "Patient/p1").FhirIssues);
        Assert.NotEmpty(report.Resources.Single(r => r.Reference == "Condition/c1").FhirIssues);
        Assert.False(report.Readable);
    }

    [Fact]
    public void Check_EveryScenario_ValidFhir()
        => Assert.All(ScenarioLibrary.All, s => Assert.True(Checker.Check(s.BundleJson, null, ScenarioLibrary.Anchor).Readable, s.Id));

    [Fact]
    public void Check_NotABundle_Problem()
    {
        var report = Checker.Check("""{"resourceType":"Patient","id":"x"}""", null, ScenarioLibrary.Anchor);
        Assert.False(report.Readable);
        Assert.Single(report.Problems);
    }

    [Fact]
    public void Check_EntryOfNoFhirType_Unreadable()
    {
        const string bundle = """
            {"resourceType":"Bundle","type":"collection","entry":[
              {"resource":{"resourceType":"Patient","id":"p1"}},
              {"resource":{"resourceType":"Observaton","id":"o1","status":"final"}}]}
            """;
        var report = Checker.Check(bundle, null, ScenarioLibrary.Anchor);
        Assert.Equal("unreadable", report.Resources.Single(r => r.Reference == "Observaton/o1").Verdict);
        Assert.Equal("used", report.Resources.Single(r => r.Reference == "Patient/p1").Verdict);
        Assert.False(report.Readable);
    }
}
