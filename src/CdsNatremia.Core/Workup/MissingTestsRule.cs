using CdsNatremia.Core.Assessment;
using CdsNatremia.Core.Cards;
using CdsNatremia.Core.Engine;
using CdsNatremia.Core.Facts;

using CdsNatremia.Core.Findings;

namespace CdsNatremia.Core.Workup;

/// <summary>
/// Step 7 of the work-up: the tests the next step needs but the record lacks (absent, or not taken close enough to the
/// sodium), offered as draft laboratory orders (CDS Hooks suggestions, selectionBehavior "any"). Recommended only where the
/// next decision hinges on them; the card exists only for a low sodium, so nothing is ever recommended for a normal one.
/// </summary>
public sealed class MissingTestsRule : IAssessmentRule
{
    /// <inheritdoc />
    public string RuleId => "workup.missing-tests";

    /// <inheritdoc />
    public void Apply(DecisionContext context, AssessmentBuilder card)
    {
        Guard.NotNull(context, nameof(context));
        Guard.NotNull(card, nameof(card));
        var options = context.Options.Workup;
        var t = TonicityAssessment.From(context);
        var urine = UrineStudies.From(context);
        var facts = context.Request.Facts;
        var hours = Slot.Number("hours", options.PairedWithinHours);
        var missing = new List<SlotValue>();

        void Offer(string name, LabOrderProposal proposal, bool recommended)
        {
            card.Suggest(LabOrders.AsSuggestion(proposal, recommended));
            missing.Add(new PhraseValue(Finding.Of(name)));
        }

        if (t.Measured is null)
        {
            Offer(FindingKind.MissingSerumOsmolality, LabOrders.SerumOsmolality(LabOrders.Why(FindingKind.MissingSerumOsmolalityOrder, hours)), recommended: true);
        }

        if (t.Glucose is null)
        {
            Offer(FindingKind.MissingGlucose, LabOrders.Glucose(LabOrders.Why(FindingKind.MissingGlucoseOrder, hours)), recommended: true);
        }

        var possiblyHypotonic = t.Band is Tonicity.Hypotonic or Tonicity.Unknown;
        if (possiblyHypotonic)
        {
            if (urine.Osmolality is null)
            {
                Offer(FindingKind.MissingUrineOsmolality, LabOrders.UrineOsmolality(LabOrders.Why(FindingKind.MissingUrineOsmolalityOrder)), recommended: true);
            }

            if (urine.Sodium is null && !urine.IsDilute)
            {
                Offer(FindingKind.MissingUrineSodium, LabOrders.UrineSodium(LabOrders.Why(FindingKind.MissingUrineSodiumOrder)), recommended: true);
            }

            // TSH and cortisol decide the SIADH criteria; recommended once the urine points that way (concentrated, sodium > 30).
            var siadhPicture = urine.Osmolality?.Value > options.DiluteUrineAtOrBelow && urine.Sodium?.Value > options.LowUrineSodiumAtOrBelow;
            var since = context.Request.Now.AddDays(-options.EndocrineTestMaxAgeDays);
            if (WorkupData.NewestSince(facts, Analyte.Thyrotropin, since) is null && !urine.IsDilute)
            {
                Offer(FindingKind.MissingTsh, LabOrders.Thyrotropin(LabOrders.Why(FindingKind.MissingTshOrder)), recommended: siadhPicture);
            }

            if (WorkupData.NewestSince(facts, Analyte.Cortisol, since) is null && !urine.IsDilute)
            {
                Offer(FindingKind.MissingCortisol, LabOrders.Cortisol(LabOrders.Why(FindingKind.MissingCortisolOrder)), recommended: siadhPicture);
            }
        }

        if (t.Band == Tonicity.Isotonic && t.Method == OsmolalityMethod.Measured)
        {
            var at = t.Sodium.EffectiveAt;
            if (WorkupData.Paired(facts, Analyte.Triglyceride, at, options.PairedWithinHours) is null)
            {
                Offer(FindingKind.MissingTriglyceride, LabOrders.Triglyceride(LabOrders.Why(FindingKind.MissingTriglycerideOrder)), recommended: false);
            }

            if (WorkupData.Paired(facts, Analyte.TotalProtein, at, options.PairedWithinHours) is null)
            {
                Offer(FindingKind.MissingTotalProtein, LabOrders.TotalProtein(LabOrders.Why(FindingKind.MissingTotalProteinOrder)), recommended: false);
            }
        }

        if (missing.Count == 0)
        {
            return;
        }

        card.RuleIds.Add(RuleId);
        var tests = Slot.List("tests", missing, "; ");
        card.NextSteps.Add(Finding.Of(facts.Unavailable.ContainsKey("labs") ? FindingKind.MissingNextLabsUnreadable : FindingKind.MissingNext, tests));
        card.Findings.Add(Finding.Of(FindingKind.MissingFinding, Slot.List("tests", missing)).With(Certainty.Unknown).Weighted(Weights.Missing));
    }
}
