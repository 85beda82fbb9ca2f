using System.Text.Json.Nodes;
using CdsNatremia.Cli.Prefetch;
using CdsNatremia.Cli.Tests.Support;
using CdsNatremia.Core.Engine;
using CdsNatremia.Service.Hooks;

namespace CdsNatremia.Cli.Tests.Prefetch;

/// <summary>
/// Search semantics are checked against the FHIR R4 specification, "Search" page (hl7.org/fhir/R4/search.html):
/// token forms §3.1.1.4.9, date prefixes §3.1.1.4.2/§3.1.1.4.7, _sort §3.1.1.5.4, _count §3.1.1.5.5, _include §3.1.1.5.6.
/// </summary>
public class FhirSearchEvaluatorTests
{
    private static readonly JsonObject[] Labs =
    [
        Inputs.Observation("na-old", "2951-2", "2026-03-01T08:00:00Z"),
        Inputs.Observation("na-new", "2951-2", "2026-03-09T08:00:00Z"),
        Inputs.Observation("na-blood", "2947-0", "2026-03-05T08:00:00Z"),
        Inputs.Observation("na-local", "2951-2", "2026-03-04T08:00:00Z", system: "urn:local"),
        Inputs.Observation("na-error", "2951-2", "2026-03-08T08:00:00Z", status: "entered-in-error"),
        Inputs.Observation("na-other", "2951-2", "2026-03-09T09:00:00Z", patient: "p2"),
        Inputs.Observation("k", "2823-3", "2026-03-09T08:00:00Z"),
    ];

    private static IReadOnlyList<string> Run(string query) => Inputs.Ids(FhirSearchEvaluator.Evaluate(FhirQuery.Parse(query), Labs).Matches);

    [Theory]
    // [system]|[code]: the code in that system only.
    [InlineData("Observation?code=http://loinc.org|2951-2", "na-error,na-new,na-old,na-other")]
    // [code]: the code in any system.
    [InlineData("Observation?code=2951-2&patient=p1", "na-error,na-local,na-new,na-old")]
    // |[code]: the code with no system: none here.
    [InlineData("Observation?code=|2951-2", "")]
    // [system]|: any code of the system.
    [InlineData("Observation?code=urn:local|", "na-local")]
    // A comma is OR.
    [InlineData("Observation?patient=p1&code=http://loinc.org|2947-0,http://loinc.org|2823-3", "k,na-blood")]
    public void Evaluate_TokenForms_MatchAsFhirDefines(string query, string expected)
        => Assert.Equal(expected.Split(',', StringSplitOptions.RemoveEmptyEntries), Run(query));

    [Theory]
    [InlineData("Observation?patient=p2", "na-other")]
    [InlineData("Observation?patient=Patient/p2", "na-other")]
    [InlineData("Observation?subject=https://ehr.example.org/fhir/Patient/p2", "na-other")]
    public void Evaluate_PatientReference_AnyFormOfTheReference(string query, string expected)
        => Assert.Equal([expected], Run(query));

    [Fact]
    public void Evaluate_StatusAndNot_FiltersStatus()
    {
        Assert.Equal(["na-error"], Run("Observation?status=entered-in-error"));
        Assert.DoesNotContain("na-error", Run("Observation?status:not=entered-in-error"));
    }

    [Theory]
    // Prefixes: gt/lt compare beyond the search value's range; a date without time covers the whole day.
    [InlineData("Observation?code=2951-2&patient=p1&date=gt2026-03-08", "na-new")]
    [InlineData("Observation?code=2951-2&patient=p1&date=ge2026-03-08", "na-error,na-new")]
    [InlineData("Observation?code=2951-2&patient=p1&date=lt2026-03-04", "na-old")]
    [InlineData("Observation?code=2951-2&patient=p1&date=le2026-03-04", "na-local,na-old")]
    [InlineData("Observation?code=2951-2&patient=p1&date=2026-03-09", "na-new")]
    [InlineData("Observation?code=2951-2&patient=p1&date=eq2026-03", "na-error,na-local,na-new,na-old")]
    [InlineData("Observation?code=2951-2&patient=p1&date=ge2026-03-02&date=le2026-03-05", "na-local")]
    public void Evaluate_DatePrefixes_CompareRanges(string query, string expected)
        => Assert.Equal(expected.Split(','), Run(query));

    [Fact]
    public void Evaluate_SortDescendingByDate_NewestFirst()
        => Assert.Equal(["na-new", "na-error", "na-local", "na-old"], Run("Observation?patient=p1&code=2951-2&_sort=-date"));

    [Fact]
    public void Evaluate_Count_IsThePageSizeNotAFilter()
    {
        var outcome = FhirSearchEvaluator.Evaluate(FhirQuery.Parse("Observation?patient=p1&_sort=-date&_count=2"), Labs);
        Assert.Equal(2, outcome.PageSize);
        Assert.Equal(6, outcome.Matches.Count);
        var page = SearchsetBundle.Page(FhirQuery.Parse("Observation?patient=p1&_sort=-date&_count=2"), outcome);
        Assert.Equal(6, (int)page["total"]!);
        Assert.Equal(["k", "na-new"], ((JsonArray)page["entry"]!).Select(e => (string)e!["resource"]!["id"]!).Order());
    }

    [Fact]
    public void Evaluate_UnknownParameter_ReportedAndIgnored()
    {
        var outcome = FhirSearchEvaluator.Evaluate(FhirQuery.Parse("Observation?patient=p2&value-quantity=lt130&code:in=http://x/vs"), Labs);
        Assert.Equal(["na-other"], Inputs.Ids(outcome.Matches));
        Assert.Equal(2, outcome.Unsupported.Count);
    }

    [Fact]
    public void Evaluate_Read_ByTypeAndId()
        => Assert.Equal(["k"], Run("Observation/k"));

    [Fact]
    public void Evaluate_IncludeMedication_AddsTheReferencedMedication()
    {
        var resources = Inputs.Resources("18");
        var outcome = FhirSearchEvaluator.Evaluate(FhirQuery.Parse("MedicationRequest?patient=s18-pt&_include=MedicationRequest:medication"), resources);
        Assert.Single(outcome.Included); // the lisinopril–hydrochlorothiazide product of MedicationRequest/s18-lis-hctz
        Assert.Equal("Medication", (string?)outcome.Included[0]["resourceType"]);
    }

    [Fact]
    public void ServiceTemplates_Scenario01_EachKeySelectsItsResources()
    {
        // The service's own discovery templates, evaluated against the thiazide patient.
        var resources = Inputs.Resources("01");
        var context = new JsonObject { ["patientId"] = "s01-pt", ["userId"] = "Practitioner/x" };
        IReadOnlyList<string> Key(string key)
        {
            var query = FhirQuery.Parse(PrefetchTokens.Substitute(PrefetchKeys.Templates[key], context));
            var outcome = FhirSearchEvaluator.Evaluate(query, resources);
            Assert.Empty(outcome.Unsupported);
            return Inputs.Ids(outcome.Matches.Take(outcome.PageSize ?? int.MaxValue));
        }

        Assert.Equal(["s01-pt"], Key(PrefetchKeys.Patient));
        Assert.Equal(["s01-na-2", "s01-na-1"], Key(PrefetchKeys.Sodium)); // newest first (_sort=-date)
        Assert.DoesNotContain("s01-na-2", Key(PrefetchKeys.Labs));
        Assert.Contains("s01-hctz", Key(PrefetchKeys.MedicationStatements));
    }
}
