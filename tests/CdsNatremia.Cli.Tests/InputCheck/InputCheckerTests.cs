using CdsNatremia.Cli.InputCheck;
using CdsNatremia.Core.Engine;
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
    public void Check_NotABundle_Unusable()
    {
        var report = Checker.Check("""{"resourceType":"Patient","id":"x"}""", null, ScenarioLibrary.Anchor);
        Assert.False(report.Readable);
        Assert.Contains("not a FHIR Bundle", report.Unusable, StringComparison.Ordinal);
        Assert.Empty(report.Resources);
    }

    [Fact]
    public void Check_TruncatedJson_UnusableWithItsLineAndColumn()
    {
        var json = ScenarioLibrary.Find("01")!.BundleJson;
        var report = Checker.Check(json[..(json.Length / 2)], null, ScenarioLibrary.Anchor);
        Assert.StartsWith("not valid JSON at line ", report.Unusable, StringComparison.Ordinal);
        Assert.Empty(report.Resources);
    }

    [Fact]
    public async Task Main_TruncatedFile_UsageExitCode()
    {
        var file = Path.Combine(Path.GetTempPath(), $"natremia-truncated-{Guid.NewGuid():N}.json");
        try
        {
            await File.WriteAllTextAsync(file, """{"resourceType":"Bundle","type":"collection","entry":[{"resource":{"resourceType":"Pat""");
            Assert.Equal(ExitCodes.Usage, await Program.Main(["check-input", file, "--json"]));
        }
        finally
        {
            File.Delete(file);
        }
    }

    [Fact]
    public void Check_InvalidElementInAFormattedFile_PositionInThatFile()
    {
        // Line 9 of the file below holds the unknown element, line 11 the impossible date.
        const string bundle = """
            {
              "resourceType": "Bundle",
              "type": "collection",
              "entry": [
                { "resource": { "resourceType": "Patient", "id": "p1" } },
                {
                  "resource": {
                    "resourceType": "Observation", "id": "o1", "status": "final",
                    "colour": "blue",
                    "subject": { "reference": "Patient/p1" },
                    "effectiveDateTime": "2026-13-45",
                    "code": { "coding": [ { "system": "http://loinc.org", "code": "2951-2" } ] }
                  }
                },
                { "resource": { "resourceType": "Patient", "id": "p2", "gender": "sometimes" } }
              ]
            }
            """;
        var report = Checker.Check(bundle, "p1", ScenarioLibrary.Anchor);
        var issues = report.Resources.Single(r => r.Reference == "Observation/o1").FhirIssues;
        Assert.Contains(issues, i => i.Contains("'colour'", StringComparison.Ordinal) && i.Contains("line 9, column", StringComparison.Ordinal));
        Assert.Contains(issues, i => i.Contains("2026-13-45", StringComparison.Ordinal) && i.Contains("line 11, column", StringComparison.Ordinal));
        // An entry on one line: the column is counted from the start of that line of the file.
        var gender = Assert.Single(report.Resources.Single(r => r.Reference == "Patient/p2").FhirIssues);
        var column = int.Parse(System.Text.RegularExpressions.Regex.Match(gender, @"line 15, column (\d+)").Groups[1].Value, System.Globalization.CultureInfo.InvariantCulture);
        Assert.InRange(column, bundle.Split('\n')[14].IndexOf("\"gender\"", StringComparison.Ordinal) + 1, bundle.Split('\n')[14].Length);
    }

    [Fact]
    public void Check_ConditionInNoKnownSet_IgnoredNotUsed()
    {
        const string bundle = """
            {"resourceType":"Bundle","type":"collection","entry":[
              {"resource":{"resourceType":"Patient","id":"p1"}},
              {"resource":{"resourceType":"Condition","id":"c1","subject":{"reference":"Patient/p1"},
                "clinicalStatus":{"coding":[{"system":"http://terminology.hl7.org/CodeSystem/condition-clinical","code":"active"}]},
                "verificationStatus":{"coding":[{"system":"http://terminology.hl7.org/CodeSystem/condition-ver-status","code":"confirmed"}]},
                "code":{"coding":[{"system":"http://snomed.info/sct","code":"22298006"}]}}}]}
            """;
        // SNOMED CT 22298006 (myocardial infarction) is in none of the condition sets of profiles/valuesets.
        var verdict = Checker.Check(bundle, null, ScenarioLibrary.Anchor).Resources.Single(r => r.Reference == "Condition/c1");
        Assert.Equal("ignored", verdict.Verdict);
        Assert.Contains("does not use it", verdict.Reason, StringComparison.Ordinal);
    }

    [Fact]
    public void Check_EveryScenario_ConditionUsedOnlyAsANamedClue()
    {
        var conditions = ScenarioLibrary.All
            .SelectMany(s => Checker.Check(s.BundleJson, null, ScenarioLibrary.Anchor).Resources)
            .Where(r => r.Reference.StartsWith("Condition/", StringComparison.Ordinal) && r.Verdict == "used")
            .ToList();
        Assert.NotEmpty(conditions);
        Assert.All(conditions, r => Assert.StartsWith("a clue the work-up names", r.Reason, StringComparison.Ordinal));
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
