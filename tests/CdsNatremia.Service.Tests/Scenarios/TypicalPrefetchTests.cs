using System.Text.Json;
using System.Text.Json.Nodes;
using CdsNatremia.Core.Engine;
using CdsNatremia.Core.Facts;
using CdsNatremia.Fhir.Reading;
using CdsNatremia.Scenarios;
using CdsNatremia.Service.Tests.Support;

namespace CdsNatremia.Service.Tests.Scenarios;

/// <summary>
/// The typical prefetch that the benchmarks and the load run measure (docs/performance.md): it must hold what issue 10
/// promises (30 sodium results over two weeks, 15 other laboratory results, 8 medications, 6 conditions, a patient, a
/// weight), every item must be readable (otherwise the measurements would time the set-aside path), and the service
/// must answer it with a card. No timing here: speed is measured by the benchmarks only.
/// </summary>
public class TypicalPrefetchTests(NatremiaFactory factory) : IClassFixture<NatremiaFactory>
{
    private static JsonObject Request() => TypicalPrefetch.Request(ScenarioLibrary.Anchor, Guid.NewGuid());

    private static int Entries(JsonObject request, string key)
        => request["prefetch"]![key]!["entry"]?.AsArray().Count ?? 0;

    [Fact]
    public void Request_PrefetchKeys_HoldThePromisedCounts()
    {
        var request = Request();
        // Counts: issue 10, "a typical prefetch".
        Assert.Equal(30, Entries(request, "sodium"));
        Assert.Equal(15, Entries(request, "labs"));
        Assert.Equal(1, Entries(request, "weight"));
        Assert.Equal(6, Entries(request, "conditions"));
        Assert.Equal(8, Entries(request, "medicationStatements") + Entries(request, "medicationRequests"));
        Assert.Equal("Patient", (string?)request["prefetch"]!["patient"]!["resourceType"]);
        Assert.Equal(TypicalPrefetch.PatientId, (string?)request["context"]!["patientId"]);
    }

    [Fact]
    public void Resources_SodiumResults_SpanTwoWeeksBeforeNow()
    {
        var times = TypicalPrefetch.Resources(ScenarioLibrary.Anchor)
            .Where(r => (string?)r["code"]?["coding"]?[0]?["code"] == "2951-2") // LOINC 2951-2 serum sodium (reference sheet, verified)
            .Select(r => DateTimeOffset.Parse((string)r["effectiveDateTime"]!, System.Globalization.CultureInfo.InvariantCulture))
            .ToList();
        Assert.Equal(30, times.Count);
        Assert.True(times.Max() <= ScenarioLibrary.Anchor);
        Assert.Equal(TimeSpan.FromDays(14), ScenarioLibrary.Anchor - times.Min());
    }

    [Fact]
    public void FhirLayer_TypicalPrefetch_ReadsEveryItemAndSetsNothingAside()
    {
        using var document = JsonDocument.Parse(Request().ToJsonString());
        var bundles = new BundleReader(new ResourceParser());
        var values = document.RootElement.GetProperty("prefetch").EnumerateObject()
            .Select(p => bundles.Read(p.Name, p.Value, DataOrigin.Prefetch))
            .ToList();
        var facts = new FactsAssembler(new RuleOptions().Reading).Assemble(TypicalPrefetch.PatientId, ScenarioLibrary.Anchor, values, []).Facts;

        Assert.Empty(facts.SetAside);
        Assert.Empty(facts.Unavailable);
        Assert.Equal(30, facts.Labs.Count(l => l.Analyte == Analyte.Sodium));
        Assert.Equal(15, facts.Labs.Count(l => l.Analyte is not Analyte.Sodium and not Analyte.BodyWeight));
        Assert.Equal(1, facts.Labs.Count(l => l.Analyte == Analyte.BodyWeight));
        Assert.Equal(6, facts.Conditions.Count);
        Assert.Equal(8, facts.Medications.Count);
        Assert.Equal(PatientSex.Female, facts.Sex);
        // Mass units converted with molar masses: glucose 112 mg/dL ÷ 18.016 = 6.22 mmol/L (reference sheet: 1 mmol/L = 18.016 mg/dL).
        Assert.Equal(112 / 18.016, facts.Latest(Analyte.Glucose)!.Value, 6);
    }

    [Fact]
    public async Task ChartReview_TypicalRequest_ProfoundCriticalCard()
    {
        var cards = await HookCalls.CardsAsync(await HookCalls.PostAsync(factory.CreateClient(), "natremia-chart-review", Request()));
        var card = cards.Single(c => (string?)c!["source"]!["topic"]!["code"] == "sodium-assessment")!;
        Assert.Equal("critical", (string?)card["indicator"]); // 124 < 125 mmol/L: profound (2014 European guideline, Spasovski et al.)
        Assert.Contains("124 mmol/L", (string)card["summary"]!, StringComparison.Ordinal);
        Assert.Contains("Advisory only", (string)card.CardText(), StringComparison.Ordinal);
    }
}
