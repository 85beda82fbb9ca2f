using CdsNatremia.Core.Cards;
using CdsNatremia.Core.Drugs;
using CdsNatremia.Core.Engine;
using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Tests.Support;

namespace CdsNatremia.Core.Tests.Drugs;

public class DrugOrderWarningProducerTests
{
    private static readonly MedicationFact CitalopramDraft = SomeDrugs.Draft("draft-citalopram", "citalopram 10 mg tablet", SomeDrugs.RxNorm("2556"));

    private static IReadOnlyList<Card> Decide(PatientFacts facts, HookKind hook, IReadOnlyList<MedicationFact> drafts, IReadOnlyList<string>? selected = null)
        => Some.Engine(knowledge: SomeDrugs.Knowledge).Decide(new DecisionRequest
        {
            Hook = hook,
            Facts = facts,
            Now = Some.Now,
            DraftOrders = drafts,
            SelectedOrders = selected ?? [],
        }).Where(c => c.Topic == "drug-order-warning").ToList();

    [Fact]
    public void Produce_SsriDraftAt129_WarningWithRemoveAndKeepWithRecheck()
    {
        var card = Decide(Some.Facts(Some.Sodium(129)), HookKind.OrderSign, [CitalopramDraft]).Single();
        Assert.Equal(CardIndicator.Warning, card.Indicator); // 129: moderate (2014 European guideline), not profound
        Assert.Equal(SelectionBehavior.AtMostOne, card.SelectionBehavior);
        Assert.Equal(2, card.Suggestions.Count);
        var remove = card.Suggestions[0].Actions.Single();
        Assert.Equal(ActionKind.Delete, remove.Kind);
        Assert.Equal("MedicationRequest/draft-citalopram", remove.ResourceId);
        var recheck = card.Suggestions[1].Actions.Single();
        Assert.Equal(ActionKind.Create, recheck.Kind);
        Assert.Equal("2951-2", recheck.Create!.LoincCode); // LOINC serum/plasma sodium (reference sheet, verified)
        Assert.Equal(168, recheck.Create.WithinHours); // DrugCauseOptions default
        Assert.Equal([SomeDrugs.OverrideReason], card.OverrideReasons);
        Assert.Equal("Benefit outweighs the risk", card.OverrideReasons[0].Display);
        Assert.Contains("citalopram", card.Summary, StringComparison.Ordinal);
        Assert.Contains("129 mmol/L", card.Summary, StringComparison.Ordinal);
        Assert.Contains("Advisory only", card.Detail, StringComparison.Ordinal);
    }

    [Fact]
    public void Produce_ProfoundSodium_CriticalWithTheShorterRecheck()
    {
        var card = Decide(Some.Facts(Some.Sodium(124.9)), HookKind.OrderSign, [CitalopramDraft]).Single();
        Assert.Equal(CardIndicator.Critical, card.Indicator); // < 125: profound (2014 European guideline)
        Assert.Equal(24, card.Suggestions[1].Actions[0].Create!.WithinHours);
    }

    [Fact]
    public void Produce_ProfoundSodiumButStale_AtMostWarning()
    {
        // 120 mmol/L is profound (2014 European guideline) but 96 h old, beyond the 72-h stale window (common practice).
        var card = Decide(Some.Facts(Some.Sodium(120, 96)), HookKind.OrderSign, [CitalopramDraft]).Single();
        Assert.Equal(CardIndicator.Warning, card.Indicator);
    }

    [Fact]
    public void Produce_At125_WarningNotCritical()
        => Assert.Equal(CardIndicator.Warning, Decide(Some.Facts(Some.Sodium(125)), HookKind.OrderSign, [CitalopramDraft]).Single().Indicator);

    [Fact]
    public void Produce_OrderSelect_OnlySelectedDrafts()
    {
        var facts = Some.Facts(Some.Sodium(129));
        Assert.Empty(Decide(facts, HookKind.OrderSelect, [CitalopramDraft], ["MedicationRequest/other"]));
        Assert.Single(Decide(facts, HookKind.OrderSelect, [CitalopramDraft], ["MedicationRequest/draft-citalopram"]));
    }

    [Fact]
    public void Produce_ReorderOfADrugAlreadyTakenWithStableNormalSodium_NoCard()
    {
        var facts = Some.Facts(Some.Sodium(140, hoursAgo: 24 * 60), Some.Sodium(139)) with
        {
            Medications = [SomeDrugs.Statement("cit", "citalopram 10 mg", Some.Now.AddYears(-2), SomeDrugs.RxNorm("2556"))],
        };
        Assert.Empty(Decide(facts, HookKind.OrderSign, [CitalopramDraft]));
    }

    [Fact]
    public void Produce_DraftNotACause_NoCard()
        => Assert.Empty(Decide(Some.Facts(Some.Sodium(120)), HookKind.OrderSign, [SomeDrugs.Draft("d1", "amlodipine 5 mg tablet")]));

    [Fact]
    public void Produce_DraftSsriWhileOnAThiazide_CallsOutTheCombination()
    {
        var facts = Some.Facts(Some.Sodium(131)) with
        {
            Medications = [SomeDrugs.Statement("hctz", "hydrochlorothiazide 25 mg", Some.Now.AddDays(-40), SomeDrugs.RxNorm("5487"))],
        };
        var card = Decide(facts, HookKind.OrderSign, [CitalopramDraft]).Single();
        Assert.Contains("Medicines acting together", card.Detail, StringComparison.Ordinal);
        Assert.Contains("hydrochlorothiazide", card.Detail, StringComparison.Ordinal);
    }

    [Fact]
    public void Produce_NoSodiumForAnOlderPatient_Warning()
    {
        var facts = Some.Facts() with { BirthDate = new DateOnly(1950, 1, 1) };
        var card = Decide(facts, HookKind.OrderSign, [CitalopramDraft]).Single();
        Assert.Equal(CardIndicator.Warning, card.Indicator);
        Assert.Contains("No recent sodium", card.Detail, StringComparison.Ordinal);
    }

    [Fact]
    public void Produce_SecondaryTierSwitchedOff_NoCardForALoopDiuretic()
    {
        var options = new RuleOptions { DrugCause = new DrugCauseOptions { WarnOnSecondaryTier = false } };
        var engine = Some.Engine(options, SomeDrugs.Knowledge);
        var cards = engine.Decide(new DecisionRequest
        {
            Hook = HookKind.OrderSign,
            Facts = Some.Facts(Some.Sodium(129)),
            Now = Some.Now,
            DraftOrders = [SomeDrugs.Draft("d-furo", "furosemide 40 mg tablet")],
        });
        Assert.Empty(cards);
    }
}

/// <summary>One rule for which draft orders an order hook speaks about (DraftOrders), for every producer.</summary>
public class DraftOrderSelectionTests
{
    private static readonly MedicationFact Citalopram = SomeDrugs.Draft("draft-citalopram", "citalopram 10 mg tablet", SomeDrugs.RxNorm("2556"));

    [Theory]
    [InlineData("draft-citalopram")]                   // bare id (CDS Hooks order-select examples use bare ids)
    [InlineData("MedicationRequest/draft-citalopram")] // relative reference
    [InlineData("https://ehr.example.org/fhir/MedicationRequest/draft-citalopram")] // absolute URL
    public void OrderSelect_SelectionInEitherReferenceForm_DrugWarningAndDraftOrdersAgree(string selection)
    {
        var request = new DecisionRequest
        {
            Hook = HookKind.OrderSelect,
            Facts = Some.Facts(Some.Sodium(129)),
            Now = Some.Now,
            DraftOrders = [Citalopram],
            SelectedOrders = [selection],
        };
        Assert.True(CdsNatremia.Core.CorrectionRate.DraftOrders.IsConsidered(request, Citalopram));
        var cards = Some.Engine(knowledge: SomeDrugs.Knowledge).Decide(request);
        Assert.Contains(cards, c => c.Topic == "drug-order-warning"); // 129 mmol/L: moderate (2014 European guideline)
    }

    [Fact]
    public void OrderSelect_OtherOrderSelected_NoDrugWarning()
    {
        var request = new DecisionRequest
        {
            Hook = HookKind.OrderSelect,
            Facts = Some.Facts(Some.Sodium(129)),
            Now = Some.Now,
            DraftOrders = [Citalopram],
            SelectedOrders = ["MedicationRequest/draft-other"],
        };
        Assert.False(CdsNatremia.Core.CorrectionRate.DraftOrders.IsConsidered(request, Citalopram));
        Assert.DoesNotContain(Some.Engine(knowledge: SomeDrugs.Knowledge).Decide(request), c => c.Topic == "drug-order-warning");
    }
}
