using CdsNatremia.Core.Cards;
using CdsNatremia.Core.Engine;
using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Findings;
using CdsNatremia.Core.Tests.Support;

namespace CdsNatremia.Core.Tests.Clinical;

/// <summary>Issue 13 (12): in heart failure a loop diuretic is part of treatment; it is not offered for stopping as a sodium cause (common practice).</summary>
public class HeartFailureLoopDiureticTests
{
    private static readonly ConditionFact HeartFailure = SomeClinical.Condition("hf", "I50.9", "Chronic heart failure"); // ICD-10 I50 (from memory)

    private static MedicationFact Furosemide() => SomeDrugs.Statement("furo", "furosemide 40 mg tablet", Some.Now.AddDays(-30), SomeDrugs.Atc("C03CA01"));

    private static PatientFacts Patient(bool heartFailure)
        => Some.Facts(Some.Sodium(138, 24 * 20), Some.Sodium(128, 2))
            with { Medications = [Furosemide()], Conditions = heartFailure ? [HeartFailure] : [] };

    [Fact]
    public void Apply_LoopDiureticInHeartFailure_PartOfTreatmentNotStopped()
    {
        var card = SomeClinical.Assessment(Patient(heartFailure: true));
        var content = card.Content!;
        Assert.Contains(content.NextSteps, f => f.Kind == FindingKind.DrugHeartFailureConsider);
        Assert.DoesNotContain(content.NextSteps, f => f.Kind is FindingKind.DrugConsider or FindingKind.DrugConsiderWithCaution);
        Assert.Contains(content.Causes, f => f.Kind == FindingKind.DrugCauseHeartFailure);
        // The short card itself says it is not stopped: the likely-cause reason carries it.
        Assert.Contains(content.Reasons, f => f.Kind == FindingKind.DrugLikelyHeartFailure);
        Assert.Contains("**not stopped for the sodium**", card.Detail, StringComparison.Ordinal);
        Assert.Contains("part of heart-failure treatment", card.Report, StringComparison.Ordinal);
        Assert.DoesNotContain("clinicians usually consider whether it is still needed", card.Report, StringComparison.Ordinal);
        Assert.Contains("heart failure (Condition/hf, \"Chronic heart failure\")", card.Report, StringComparison.Ordinal);
        Assert.Contains("Condition/hf", card.ResourcesUsed);
    }

    [Fact]
    public void Apply_LoopDiureticWithoutHeartFailure_UsualReview()
    {
        var card = SomeClinical.Assessment(Patient(heartFailure: false));
        Assert.Contains(card.Content!.NextSteps, f => f.Kind == FindingKind.DrugConsider);
        Assert.DoesNotContain(card.Content.Reasons, f => f.Kind == FindingKind.DrugLikelyHeartFailure);
        Assert.Contains("clinicians usually consider whether it is still needed", card.Report, StringComparison.Ordinal);
    }

    [Fact]
    public void Produce_LoopDiureticDraftInHeartFailure_NoRemoveSuggestion()
    {
        var draft = SomeClinical.Draft("furo-draft", "furosemide 40 mg tablet", codes: SomeDrugs.Atc("C03CA01"));
        var facts = Some.Facts(Some.Sodium(129, 2)) with { Conditions = [HeartFailure] };
        var card = Assert.Single(SomeClinical.Decide(facts, HookKind.OrderSign, [draft]), c => c.Topic == "drug-order-warning");
        Assert.DoesNotContain(card.Suggestions, s => s.Actions.Any(a => a.Kind == ActionKind.Delete));
        Assert.Single(card.Suggestions); // keep and recheck only
        Assert.Contains(card.Content!.Reasons, f => f.Kind == FindingKind.DrugOrderReasonHeartFailure);
        Assert.Equal(FindingKind.DrugHeartFailureConsider, card.Content.NextSteps[0].Kind);
        Assert.Contains("**not stopped for the sodium**", card.Detail, StringComparison.Ordinal);
    }

    [Fact]
    public void Produce_LoopDiureticDraftWithoutHeartFailure_RemoveStillOffered()
    {
        var draft = SomeClinical.Draft("furo-draft", "furosemide 40 mg tablet", codes: SomeDrugs.Atc("C03CA01"));
        var card = Assert.Single(SomeClinical.Decide(Some.Facts(Some.Sodium(129, 2)), HookKind.OrderSign, [draft]), c => c.Topic == "drug-order-warning");
        Assert.Contains(card.Suggestions, s => s.Actions.Any(a => a.Kind == ActionKind.Delete));
    }
}
