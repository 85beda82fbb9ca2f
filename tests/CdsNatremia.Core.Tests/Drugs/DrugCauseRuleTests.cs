using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Tests.Support;

namespace CdsNatremia.Core.Tests.Drugs;

public class DrugCauseRuleTests
{
    private static readonly DateTimeOffset ThreeWeeksAgo = Some.Now.AddDays(-21);

    private static string Detail(PatientFacts facts)
        => Some.Engine(knowledge: SomeDrugs.Knowledge).Decide(Some.Request(facts)).Single(c => c.Topic == "sodium-assessment").Detail;

    private static PatientFacts Patient(params MedicationFact[] medications)
        => Some.Facts(Some.Sodium(138, hoursAgo: 24 * 28, id: "na-before"), Some.Sodium(126, id: "na-now")) with { Medications = medications };

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
        Assert.Contains("hydrochlorothiazide", card.Summary, StringComparison.Ordinal);
        Assert.Contains("**hydrochlorothiazide**", card.Detail, StringComparison.Ordinal);
        Assert.Contains("primary tier", card.Detail, StringComparison.Ordinal);
        Assert.Contains("matched by code RxNorm 5487", card.Detail, StringComparison.Ordinal);
        Assert.Contains("authoredOn", card.Detail, StringComparison.Ordinal);
        Assert.Contains("likely contributor", card.Detail, StringComparison.Ordinal);
        Assert.Contains("drug.cause", card.RuleIds);
        Assert.Contains("MedicationRequest/combo", card.ResourcesUsed);
    }

    [Fact]
    public void Apply_ThiazideAndSsri_CalledOutAsActingTogether()
    {
        var detail = Detail(Patient(
            SomeDrugs.Statement("hctz", "hydrochlorothiazide 25 mg", ThreeWeeksAgo, SomeDrugs.RxNorm("5487")),
            SomeDrugs.Statement("cit", "citalopram 20 mg", null, SomeDrugs.RxNorm("2556"))));
        Assert.Contains("Medicines acting together", detail, StringComparison.Ordinal);
        Assert.Contains("possible contributor", detail, StringComparison.Ordinal); // citalopram: start unknown
    }

    [Fact]
    public void Apply_DrugStartedAfterTheSodiumWasLow_UnlikelyAndNotCalledOutTogether()
    {
        var detail = Detail(Patient(
            SomeDrugs.Statement("hctz", "hydrochlorothiazide 25 mg", ThreeWeeksAgo, SomeDrugs.RxNorm("5487")),
            SomeDrugs.Statement("cit", "citalopram 20 mg", Some.Now.AddHours(-1), SomeDrugs.RxNorm("2556"))));
        Assert.Contains("unlikely to have caused the fall", detail, StringComparison.Ordinal);
        Assert.DoesNotContain("Medicines acting together", detail, StringComparison.Ordinal);
    }

    [Fact]
    public void Apply_VaptanIsNeverACause()
    {
        // Vaptans raise sodium (reference: profiles/README.md, drug-vaptan is a rate caution only).
        var detail = Detail(Patient(SomeDrugs.Statement("tol", "tolvaptan 15 mg", ThreeWeeksAgo, SomeDrugs.Atc("C03XA01"))));
        Assert.DoesNotContain("tolvaptan", detail, StringComparison.OrdinalIgnoreCase);
    }

    [Fact]
    public void Apply_SecondaryTierByName_LabelledSecondaryAndMatchedByName()
    {
        var detail = Detail(Patient(SomeDrugs.Statement("furo", "furosemide 40 mg tablet", ThreeWeeksAgo)));
        Assert.Contains("secondary tier", detail, StringComparison.Ordinal);
        Assert.Contains("matched by name", detail, StringComparison.Ordinal);
    }

    [Fact]
    public void Apply_SameDrugInStatementAndOrder_NamedOnceWithTheOtherRecordListed()
    {
        var detail = Detail(Patient(
            SomeDrugs.Statement("hctz-s", "hydrochlorothiazide 25 mg", ThreeWeeksAgo, SomeDrugs.RxNorm("5487")),
            SomeDrugs.Statement("hctz-r", "hydrochlorothiazide 25 mg", null, SomeDrugs.RxNorm("5487")) with { ResourceType = "MedicationRequest" }));
        Assert.Single(System.Text.RegularExpressions.Regex.Matches(detail, @"\*\*Medicine\*\*"));
        Assert.Contains("also recorded in MedicationRequest/hctz-r", detail, StringComparison.Ordinal);
    }

    [Fact]
    public void Apply_NeverPhrasedAsAnOrder()
    {
        var detail = Detail(Patient(SomeDrugs.Statement("hctz", "hydrochlorothiazide 25 mg", ThreeWeeksAgo, SomeDrugs.RxNorm("5487"))));
        Assert.Contains("clinicians usually consider", detail, StringComparison.Ordinal);
        Assert.DoesNotContain("Stop ", detail, StringComparison.Ordinal);
    }
}
