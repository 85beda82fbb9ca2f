using CdsNatremia.Core.Cards;
using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Findings;
using CdsNatremia.Core.Rendering;
using CdsNatremia.Core.Tests.Support;

namespace CdsNatremia.Core.Tests.Drugs;

public class DrugCauseRuleTests
{
    private static readonly DateTimeOffset ThreeWeeksAgo = Some.Now.AddDays(-21);

    private static Card Assessment(PatientFacts facts)
        => Some.Engine(knowledge: SomeDrugs.Knowledge).Decide(Some.Request(facts)).Single(c => c.Topic == "sodium-assessment");

    private static PatientFacts Patient(params MedicationFact[] medications)
        => Some.Facts(Some.Sodium(138, hoursAgo: 24 * 28, id: "na-before"), Some.Sodium(126, id: "na-now")) with { Medications = medications };

    private static Finding Nested(Finding finding, string slot) => Assert.IsType<PhraseValue>(finding[slot]).Finding;

    private static IEnumerable<Finding> OfKind(IEnumerable<Finding> findings, string kind) => findings.Where(f => f.Kind == kind);

    /// <summary>The possible-cause finding of <paramref name="drug"/> and its timing verdict.</summary>
    private static string VerdictOf(Card card, string drug)
        => Nested(card.Content!.Causes.Single(f => f.Kind == FindingKind.DrugCause && f["drug"] == new TextValue(drug, true)), "verdict").Kind;

    [Fact]
    public void Apply_ThiazideInAceCombination_NamesTheThiazideItsGroupTierHowAndTiming()
    {
        // A lisinopril/hydrochlorothiazide product: ingredient RxNorm 5487 is hydrochlorothiazide (reference sheet, verified).
        var combination = new MedicationFact(
            "MedicationRequest", "combo", [SomeDrugs.Atc("C09BA03")],
            [new([], "lisinopril"), new([SomeDrugs.RxNorm("5487")], "hydrochlorothiazide")],
            "lisinopril and hydrochlorothiazide tablet", MedicationUse.Active, ThreeWeeksAgo, "authoredOn");
        var cards = Some.Engine(knowledge: SomeDrugs.Knowledge).Decide(Some.Request(Patient(combination)));
        var card = cards.Single();
        var content = card.Content!;

        // Started 21 days ago, after 138 (28 days ago) and before 126: it began before the fall (SodiumFall definition).
        var likely = Assert.Single(OfKind(content.Reasons, FindingKind.DrugLikely));
        Assert.Equal(new TextValue("hydrochlorothiazide", true), likely["drug"]);
        Assert.Equal(FindingKind.DrugTierPrimary, Nested(likely, "tier").Kind);
        Assert.Equal(Certainty.Likely, likely.Certainty);
        Assert.Equal(Weights.Culprit, likely.Weight);

        var step = Assert.Single(OfKind(content.Steps, FindingKind.DrugStep));
        Assert.Equal(FindingKind.DrugMatchedByCode, Nested(step, "how").Kind);
        Assert.Equal(new TextValue("RxNorm 5487", true), Nested(step, "how")["code"]);
        Assert.Equal(FindingKind.DrugGroupPrimary, Nested(step, "group").Kind);
        Assert.Equal(FindingKind.DrugMedicineInProduct, Nested(step, "medicine").Kind);
        Assert.Equal(new TextValue("authoredOn", true), Nested(Nested(step, "timing"), "started")["source"]);
        Assert.Equal(FindingKind.DrugVerdictLikely, Nested(step, "verdict").Kind);

        // The summary names the drug as the action; the short card shows the likely cause; the report says how it matched.
        Assert.Contains("review hydrochlorothiazide, a likely cause", card.Summary, StringComparison.Ordinal);
        Assert.Contains("**hydrochlorothiazide** (thiazide or thiazide-like diuretic, primary tier) is a **likely contributor**: it began before the fall.", card.Detail, StringComparison.Ordinal);
        Assert.Contains("matched by code RxNorm 5487", card.Report, StringComparison.Ordinal);
        Assert.Contains("drug.cause", card.RuleIds);
        Assert.Contains("MedicationRequest/combo", card.ResourcesUsed);
    }

    [Fact]
    public void Apply_ThiazideAndSsri_CalledOutAsActingTogether()
    {
        var card = Assessment(Patient(
            SomeDrugs.Statement("hctz", "hydrochlorothiazide 25 mg", ThreeWeeksAgo, SomeDrugs.RxNorm("5487")),
            SomeDrugs.Statement("cit", "citalopram 20 mg", null, SomeDrugs.RxNorm("2556"))));
        var together = Assert.Single(OfKind(card.Content!.Reasons, FindingKind.DrugTogether));
        Assert.Equal(2, Assert.IsType<ListValue>(together["names"]).Values.Count);
        Assert.Equal(FindingKind.DrugVerdictPossible, VerdictOf(card, "citalopram")); // citalopram: start unknown
        Assert.Contains("- **Medicines acting together**: hydrochlorothiazide and citalopram; their effects on sodium add up (common practice).", card.Detail, StringComparison.Ordinal);
    }

    [Fact]
    public void Apply_DrugStartedAfterTheSodiumWasLow_UnlikelyAndNotCalledOutTogether()
    {
        var card = Assessment(Patient(
            SomeDrugs.Statement("hctz", "hydrochlorothiazide 25 mg", ThreeWeeksAgo, SomeDrugs.RxNorm("5487")),
            SomeDrugs.Statement("cit", "citalopram 20 mg", Some.Now.AddHours(-1), SomeDrugs.RxNorm("2556"))));
        Assert.Equal(FindingKind.DrugVerdictUnlikely, VerdictOf(card, "citalopram"));
        Assert.Contains("unlikely to have caused the fall", card.Report, StringComparison.Ordinal);
        Assert.Empty(OfKind(card.Content!.Reasons, FindingKind.DrugTogether));
    }

    [Fact]
    public void Apply_VaptanIsNeverACause()
    {
        // Vaptans raise sodium (reference: profiles/README.md, drug-vaptan is a rate caution only).
        var card = Assessment(Patient(SomeDrugs.Statement("tol", "tolvaptan 15 mg", ThreeWeeksAgo, SomeDrugs.Atc("C03XA01"))));
        Assert.DoesNotContain("drug.cause", card.RuleIds);
        Assert.DoesNotContain("tolvaptan", card.Report, StringComparison.OrdinalIgnoreCase);
    }

    [Fact]
    public void Apply_SecondaryTierByName_LabelledSecondaryAndMatchedByName()
    {
        var card = Assessment(Patient(SomeDrugs.Statement("furo", "furosemide 40 mg tablet", ThreeWeeksAgo)));
        var step = Assert.Single(OfKind(card.Content!.Steps, FindingKind.DrugStep));
        Assert.Equal(FindingKind.DrugGroupSecondary, Nested(step, "group").Kind);
        Assert.Equal(FindingKind.DrugMatchedByName, Nested(step, "how").Kind);
        Assert.Equal(FindingKind.DrugTierSecondary, Nested(Assert.Single(OfKind(card.Content.Reasons, FindingKind.DrugLikely)), "tier").Kind);
        Assert.Contains("secondary tier", card.Report, StringComparison.Ordinal);
    }

    [Fact]
    public void Apply_SecondaryTierOnly_SummaryDoesNotNameItAsTheAction()
    {
        // Only a primary-tier (well-established) likely cause leads the summary; furosemide is secondary here.
        var card = Assessment(Patient(SomeDrugs.Statement("furo", "furosemide 40 mg tablet", ThreeWeeksAgo)));
        Assert.DoesNotContain("furosemide", card.Summary, StringComparison.Ordinal);
    }

    [Fact]
    public void Apply_SameDrugInStatementAndOrder_NamedOnceWithTheOtherRecordListed()
    {
        var card = Assessment(Patient(
            SomeDrugs.Statement("hctz-s", "hydrochlorothiazide 25 mg", ThreeWeeksAgo, SomeDrugs.RxNorm("5487")),
            SomeDrugs.Statement("hctz-r", "hydrochlorothiazide 25 mg", null, SomeDrugs.RxNorm("5487")) with { ResourceType = "MedicationRequest" }));
        var step = Assert.Single(OfKind(card.Content!.Steps, FindingKind.DrugStep));
        var records = Nested(step, "records");
        Assert.Equal(FindingKind.DrugRecordsMany, records.Kind);
        Assert.Equal(new TextValue("MedicationStatement/hctz-s", true), records["reference"]);
        Assert.Contains("also recorded in MedicationRequest/hctz-r", card.Report, StringComparison.Ordinal);
    }

    [Fact]
    public void Apply_NeverPhrasedAsAnOrder()
    {
        var card = Assessment(Patient(SomeDrugs.Statement("hctz", "hydrochlorothiazide 25 mg", ThreeWeeksAgo, SomeDrugs.RxNorm("5487"))));
        Assert.Single(OfKind(card.Content!.NextSteps, FindingKind.DrugConsider));
        Assert.Contains("clinicians usually consider", card.Report, StringComparison.Ordinal);
        Assert.DoesNotContain("Stop ", card.Report, StringComparison.Ordinal);
        Assert.DoesNotContain("Stop ", card.Detail, StringComparison.Ordinal);
    }

    [Fact]
    public void Render_FallStep_BeforeAndFirstLowCitedWithTimesAndResources()
    {
        // 138 (normal) then 126: Before = 138, FirstLow = 126 (SodiumFall definition).
        var card = Assessment(Patient(SomeDrugs.Statement("hctz", "hydrochlorothiazide 25 mg", ThreeWeeksAgo, SomeDrugs.RxNorm("5487"))));
        var fall = Assert.Single(OfKind(card.Content!.Steps, FindingKind.DrugFallKnown));
        Assert.Equal(
            "**The fall in sodium**: 138 mmol/L at 2026-02-10 12:00 UTC (Observation/na-before) before the fall; 126 mmol/L at 2026-03-10 10:00 UTC (Observation/na-now) is the first result near the lowest level of this low stretch. A medicine started before that first low result is a likely contributor; one started on or after it, unlikely.",
            PhraseCatalogue.Default.Render(fall, Some.Engine().DisplayAt(Some.Now)));
    }

    [Fact]
    public void Render_Considerations_AntidepressantCarriesItsTaperCaution()
    {
        // SSRIs are tapered rather than stopped abruptly (common practice).
        var card = Assessment(Patient(SomeDrugs.Statement("cit", "citalopram 20 mg", ThreeWeeksAgo, SomeDrugs.RxNorm("2556"))));
        var next = Assert.Single(OfKind(card.Content!.NextSteps, FindingKind.DrugConsiderWithCaution));
        Assert.Equal(
            "For citalopram, clinicians usually consider whether it is still needed, whether an alternative with a lower risk to sodium would serve, and rechecking sodium after any change; an antidepressant is usually tapered rather than stopped abruptly: discuss any change with the prescriber.",
            PhraseCatalogue.Default.Render(next, Some.Engine().DisplayAt(Some.Now)));
    }

    [Fact]
    public void Detail_LikelyCauses_StaysWithinTheShortCardBudget()
    {
        var card = Assessment(Patient(
            SomeDrugs.Statement("hctz", "hydrochlorothiazide 25 mg", ThreeWeeksAgo, SomeDrugs.RxNorm("5487")),
            SomeDrugs.Statement("cit", "citalopram 20 mg", ThreeWeeksAgo, SomeDrugs.RxNorm("2556")),
            SomeDrugs.Statement("furo", "furosemide 40 mg tablet", ThreeWeeksAgo)));
        Assert.InRange(card.Detail.Length, 1, CardRenderer.DetailBudget);
        Assert.True(card.Summary.Length < 140); // CDS Hooks: summary under 140 characters
    }
}
