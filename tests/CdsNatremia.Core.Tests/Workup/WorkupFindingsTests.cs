using CdsNatremia.Core.Cards;
using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Findings;
using CdsNatremia.Core.Rendering;
using CdsNatremia.Core.Tests.Support;
using static CdsNatremia.Core.Tests.Workup.WorkupTestData;

namespace CdsNatremia.Core.Tests.Workup;

/// <summary>
/// The work-up's decisions asserted as findings (kinds, values, certainty, evidence), never through wording: the same
/// chart gives the same findings whatever the phrase catalogue says.
/// </summary>
public class WorkupFindingsTests
{
    private static PatientFacts Facts(params LabResult[] labs) => new() { PatientId = Some.PatientId, Labs = labs };

    private static IEnumerable<Finding> All(Card card) => card.Content!.All();

    private static Finding One(Card card, string kind) => Assert.Single(All(card), f => f.Kind == kind);

    [Fact]
    public void Severity_124_ProfoundBandWithTheValueAsUsed()
    {
        // 2014 European guideline: profound below 125 mmol/L (reference sheet).
        var card = Card(Facts([.. Hypotonic(sodium: 124)]));
        var severity = One(card, FindingKind.SeverityFinding);
        Assert.Equal(new NumberValue(124, null), severity["sodium"]);
        Assert.Equal(new TextValue("profound", Escape: true), severity["band"]);
        Assert.Equal(FindingKind.HeadlineLow, card.Content!.Headline.Kind);
    }

    [Fact]
    public void Onset_NormalSodium30HoursBefore_AcuteWithHoursAndEvidence()
    {
        // 2014 European guideline: documented duration < 48 h is acute (reference sheet).
        var normal = Some.Sodium(139, hoursAgo: 32, id: "na-normal");
        var card = Card(Facts([normal, .. Hypotonic(sodium: 127, hoursAgo: 2)]));
        var acute = One(card, FindingKind.OnsetAcuteFinding);
        Assert.Equal(new DurationValue(30), acute["hours"]);
        Assert.Equal(new NumberValue(139, null), acute["normal"]);
        Assert.Contains("Observation/na-normal", acute.Evidence);
        Assert.Contains(card.Content!.Cautions, f => f.Kind == FindingKind.OnsetAcuteCaution);
        Assert.DoesNotContain(All(card), f => f.Kind == FindingKind.OnsetChronicStep);
    }

    [Fact]
    public void Onset_NoNormalSodiumOnRecord_ChronicBecauseNoNormal()
    {
        // 2014 European guideline: unknown duration is treated as chronic (reference sheet).
        var card = Card(Facts([.. Hypotonic()]));
        var step = One(card, FindingKind.OnsetChronicStep);
        Assert.Equal(FindingKind.OnsetChronicNoNormal, Assert.IsType<PhraseValue>(step["why"]).Finding.Kind);
    }

    [Fact]
    public void Tonicity_MeasuredOsmolality262_HypotonicEstablished()
    {
        // Effective osmolality below 275 mOsm/kg is hypotonic (SIADH criteria; reference sheet).
        var card = Card(Facts([.. Hypotonic()]));
        var tonicity = One(card, FindingKind.TonicityMeasuredFinding);
        Assert.Equal(Certainty.Established, tonicity.Certainty);
        Assert.Equal(FindingKind.TonicityBandHypotonic, Assert.IsType<PhraseValue>(tonicity["band"]).Finding.Kind);
        Assert.Equal(new NumberValue(262, null), tonicity["osmolality"]);
    }

    [Fact]
    public void Tonicity_NoOsmolalityNoGlucose_UnknownNeverHypotonic()
    {
        var card = Card(Facts(Some.Sodium(126)));
        var tonicity = One(card, FindingKind.TonicityUnknownFinding);
        Assert.Equal(Certainty.Unknown, tonicity.Certainty);
        Assert.DoesNotContain(All(card), f => f.Kind == FindingKind.TonicityMeasuredFinding);
    }

    [Fact]
    public void Urine_Osmolality80_DiluteAndNoSiadhChecklist()
    {
        // 2014 European guideline: urine osmolality ≤ 100 mOsm/kg is maximally dilute (reference sheet).
        var card = Card(Facts([.. Hypotonic(), Lab(Analyte.UrineOsmolality, 80, id: "uosm")]));
        var dilute = One(card, FindingKind.UrineOsmolalityDiluteFinding);
        Assert.Equal(new NumberValue(80, null), dilute["osmolality"]);
        Assert.Contains("Observation/uosm", dilute.Evidence);
        Assert.DoesNotContain(All(card), f => f.Kind == FindingKind.UrineSodiumHighFinding);
    }

    [Fact]
    public void MissingTests_NoUrineStudies_NamedAsUnknownAndOffered()
    {
        var card = Card(Facts([.. Hypotonic()]));
        var missing = One(card, FindingKind.MissingFinding);
        Assert.Equal(Certainty.Unknown, missing.Certainty);
        var kinds = Assert.IsType<ListValue>(missing["tests"]).Values.Cast<PhraseValue>().Select(p => p.Finding.Kind).ToList();
        Assert.Contains(FindingKind.MissingUrineOsmolality, kinds);
        Assert.Contains(FindingKind.MissingUrineSodium, kinds);
    }

    [Fact]
    public void Glucose650MgPerDl_KatzAndHillierAsSlotsAndNotHypotonicLeads()
    {
        // Katz 1973: +1.6 per 100 mg/dL above 100 → 128 + 8.8 = 136.8; Hillier 1999: +2.4 → 141.2.
        var card = Card(Facts([Some.Sodium(128), Lab(Analyte.SerumOsmolality, 305), Lab(Analyte.Glucose, 650 / 18.016), Lab(Analyte.Urea, 28 / 2.8014)]));
        var glucose = One(card, FindingKind.HypertonicGlucoseFinding);
        Assert.Equal(new NumberValue(136.8, null), glucose["katz"]);
        Assert.Equal(new NumberValue(141.2, null), glucose["hillier"]);
        Assert.Equal(FindingKind.HypertonicGlucoseNotHypotonic, card.Content!.Reasons[0].Kind);
        Assert.Equal(FindingKind.SummaryNotHypotonic, card.Content.Summary.Kind);
    }

    [Fact]
    public void ShortCard_TypicalHypotonicChart_WithinBudgetNamesValueAndRendersOnce()
    {
        var card = Card(Facts([.. Hypotonic(sodium: 124)]));
        Assert.True(card.Detail.Length <= CardRenderer.DetailBudget, $"{card.Detail.Length} characters");
        Assert.Contains("124 mmol/L", card.Detail, StringComparison.Ordinal);
        Assert.Contains("124 mmol/L", card.Summary, StringComparison.Ordinal);
        Assert.True(card.Report.Length > card.Detail.Length);
        Assert.Contains("**Reasoning (with the data each step used)**", card.Report, StringComparison.Ordinal);
    }
}
