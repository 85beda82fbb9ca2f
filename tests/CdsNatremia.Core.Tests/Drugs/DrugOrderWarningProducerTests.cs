using CdsNatremia.Core.Cards;
using CdsNatremia.Core.Drugs;
using CdsNatremia.Core.Engine;
using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Findings;
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
        Assert.Equal(FindingKind.DrugOrderHeadlineLow, card.Content!.Headline.Kind);
        Assert.Equal(new NumberValue(129, null), card.Content.Headline["sodium"]);
    }

    [Fact]
    public void Render_SsriDraftAt129_SummaryHeadlineAndSuggestionWording()
    {
        // 129 mmol/L: moderate (2014 European guideline); recheck within 7 days: RecheckWithinHours 168 (common practice).
        var card = Decide(Some.Facts(Some.Sodium(129)), HookKind.OrderSign, [CitalopramDraft]).Single();
        Assert.Equal(
            "citalopram, a selective serotonin reuptake inhibitor (SSRI), can lower sodium; sodium is already 129 mmol/L (moderate, 2 h ago).",
            card.Summary);
        Assert.StartsWith("**Ordering citalopram, which can lower sodium: sodium is already 129 mmol/L, moderate hyponatremia (2 h ago, 10 Mar 10:00)**", card.Detail, StringComparison.Ordinal);
        Assert.Contains("**Next:** Before starting citalopram, clinicians usually weigh the need for it now against the risk to sodium", card.Detail, StringComparison.Ordinal);
        Assert.Equal("Remove the draft citalopram order", card.Suggestions[0].Label);
        Assert.Equal("Remove the draft order MedicationRequest/draft-citalopram (citalopram).", card.Suggestions[0].Actions[0].Description);
        Assert.Equal("Keep the citalopram order and recheck sodium within 7 days", card.Suggestions[1].Label);
        Assert.Equal("Order Sodium, serum or plasma", card.Suggestions[1].Actions[0].Description);
        Assert.Equal("citalopram can lower sodium; recheck within 7 days of starting it.", card.Suggestions[1].Actions[0].Create!.Reason);
        Assert.Contains("**Sodium is already low**: ", card.Report, StringComparison.Ordinal);
        Assert.Contains("The draft order \"citalopram 10 mg tablet\" (MedicationRequest/draft-citalopram) contains **citalopram**, matched by code RxNorm 2556", card.Report, StringComparison.Ordinal);
    }

    [Fact]
    public void Produce_FallingSodium_HeadlineAndReasonCarryTheDrop()
    {
        // 140 → 135 within 7 days: a drop of 5 ≥ the meaningful 4 mmol/L (DrugCauseOptions defaults, common practice).
        var facts = Some.Facts(Some.Sodium(140, hoursAgo: 72, id: "na-140"), Some.Sodium(135, id: "na-135"));
        var card = Decide(facts, HookKind.OrderSign, [CitalopramDraft]).Single();
        Assert.Equal(FindingKind.DrugOrderHeadlineFalling, card.Content!.Headline.Kind);
        var fall = Assert.Single(card.Content.Reasons, f => f.Kind == FindingKind.DrugOrderReasonFalling);
        Assert.Equal(new NumberValue(5, 1), fall["drop"]);
        Assert.Contains("sodium is falling: 135 mmol/L, down from 140.", card.Summary, StringComparison.Ordinal);
    }

    [Fact]
    public void Produce_ProfoundButStale_CautionSaysRecheckFirst()
    {
        // 120 mmol/L, 96 h old: stale beyond the 72-h window (common practice); the card says so among its cautions.
        var card = Decide(Some.Facts(Some.Sodium(120, 96)), HookKind.OrderSign, [CitalopramDraft]).Single();
        Assert.Single(card.Content!.Cautions, f => f.Kind == FindingKind.DrugOrderCautionStale);
        Assert.Contains("**Caution:** The latest sodium is stale (4 days ago)", card.Detail, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData(129.0, 0)]
    [InlineData(118.0, 0)]
    [InlineData(131.0, 1)]
    [InlineData(135.0, 2)]
    public void Detail_EveryOrderScenario_WithinTheShortCardBudget(double sodium, int variant)
    {
        // Short-card budget (CardRenderer.DetailBudget); the richest cards: a combination, a drug already taken, two drafts.
        var facts = (variant switch
        {
            1 => Some.Facts(Some.Sodium(sodium)),
            2 => Some.Facts(Some.Sodium(140, hoursAgo: 72), Some.Sodium(sodium)),
            _ => Some.Facts(Some.Sodium(sodium)),
        }) with
        {
            Medications =
            [
                SomeDrugs.Statement("hctz", "hydrochlorothiazide 25 mg", Some.Now.AddDays(-40), SomeDrugs.RxNorm("5487")),
                SomeDrugs.Statement("cit", "citalopram 10 mg", Some.Now.AddDays(-400), SomeDrugs.RxNorm("2556")),
            ],
        };
        var cards = Decide(facts, HookKind.OrderSign, [CitalopramDraft, SomeDrugs.Draft("d-furo", "furosemide 40 mg tablet")]);
        Assert.NotEmpty(cards);
        Assert.All(cards, c => Assert.InRange(c.Detail.Length, 1, CdsNatremia.Core.Rendering.CardRenderer.DetailBudget));
        Assert.All(cards, c => Assert.True(c.Summary.Length < 140)); // CDS Hooks: summary under 140 characters
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
        var together = Assert.Single(card.Content!.Reasons, f => f.Kind == FindingKind.DrugOrderReasonTogether);
        Assert.Equal([new TextValue("hydrochlorothiazide", true)], Assert.IsType<ListValue>(together["names"]).Values);
        Assert.Contains("hydrochlorothiazide", card.Detail, StringComparison.Ordinal);
        Assert.Contains("**Medicines acting together**: citalopram with hydrochlorothiazide (thiazide or thiazide-like diuretic; already taken, MedicationStatement/hctz)", card.Report, StringComparison.Ordinal);
    }

    [Fact]
    public void Produce_NoSodiumForAnOlderPatient_Warning()
    {
        var facts = Some.Facts() with { BirthDate = new DateOnly(1950, 1, 1) };
        var card = Decide(facts, HookKind.OrderSign, [CitalopramDraft]).Single();
        Assert.Equal(CardIndicator.Warning, card.Indicator);
        Assert.Equal(FindingKind.DrugOrderHeadlineAbsent, card.Content!.Headline.Kind);
        Assert.Single(card.Content.Steps, f => f.Kind == FindingKind.DrugOrderAbsent && f.Certainty == Certainty.Unknown);
        // 76 years old on 2026-03-10; age 65 or over and no sodium in 180 days (DrugCauseOptions defaults, common practice).
        Assert.Contains("**No recent sodium**: no usable sodium in the last 180 days (none is on record), and the patient is 76 years old", card.Report, StringComparison.Ordinal);
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
