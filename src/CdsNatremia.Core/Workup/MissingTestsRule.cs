using CdsNatremia.Core.Assessment;
using CdsNatremia.Core.Cards;
using CdsNatremia.Core.Engine;
using CdsNatremia.Core.Facts;

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
        var hours = Invariant.Number(options.PairedWithinHours);
        var missing = new List<string>();

        void Offer(string name, LabOrderProposal proposal, bool recommended)
        {
            card.Suggest(LabOrders.AsSuggestion(proposal, recommended));
            missing.Add(name);
        }

        if (t.Measured is null)
        {
            Offer("serum osmolality", LabOrders.SerumOsmolality(Invariant.Format($"No measured serum osmolality within {hours} h of the low sodium; it shows whether the hyponatremia is hypotonic.")), recommended: true);
        }

        if (t.Glucose is null)
        {
            Offer("glucose", LabOrders.Glucose(Invariant.Format($"No glucose within {hours} h of the low sodium; hyperglycaemia lowers sodium without water excess.")), recommended: true);
        }

        var possiblyHypotonic = t.Band is Tonicity.Hypotonic or Tonicity.Unknown;
        if (possiblyHypotonic)
        {
            if (urine.Osmolality is null)
            {
                Offer("urine osmolality", LabOrders.UrineOsmolality("Urine osmolality separates excess water intake (≤ 100 mOsm/kg) from vasopressin-driven water retention."), recommended: true);
            }

            if (urine.Sodium is null && !urine.IsDilute)
            {
                Offer("urine sodium", LabOrders.UrineSodium("Urine sodium separates low effective arterial blood volume (≤ 30 mmol/L) from renal sodium loss or SIADH."), recommended: true);
            }

            // TSH and cortisol decide the SIADH criteria; recommended once the urine points that way (concentrated, sodium > 30).
            var siadhPicture = urine.Osmolality?.Value > options.DiluteUrineAtOrBelow && urine.Sodium?.Value > options.LowUrineSodiumAtOrBelow;
            var since = context.Request.Now.AddDays(-options.EndocrineTestMaxAgeDays);
            if (WorkupData.NewestSince(facts, Analyte.Thyrotropin, since) is null && !urine.IsDilute)
            {
                Offer("TSH", LabOrders.Thyrotropin("Hypothyroidism must be excluded before SIADH is diagnosed."), recommended: siadhPicture);
            }

            if (WorkupData.NewestSince(facts, Analyte.Cortisol, since) is null && !urine.IsDilute)
            {
                Offer("cortisol", LabOrders.Cortisol("Adrenal insufficiency must be excluded before SIADH is diagnosed."), recommended: siadhPicture);
            }
        }

        if (t.Band == Tonicity.Isotonic && t.Method == OsmolalityMethod.Measured)
        {
            var at = t.Sodium.EffectiveAt;
            if (WorkupData.Paired(facts, Analyte.Triglyceride, at, options.PairedWithinHours) is null)
            {
                Offer("triglyceride", LabOrders.Triglyceride("Normal osmolality with a low sodium: very high triglycerides cause pseudohyponatremia."), recommended: false);
            }

            if (WorkupData.Paired(facts, Analyte.TotalProtein, at, options.PairedWithinHours) is null)
            {
                Offer("total protein", LabOrders.TotalProtein("Normal osmolality with a low sodium: very high protein (paraprotein) causes pseudohyponatremia."), recommended: false);
            }
        }

        if (missing.Count == 0)
        {
            return;
        }

        card.RuleIds.Add(RuleId);
        var labsNote = facts.Unavailable.ContainsKey("labs") ? " (the laboratory results could not all be read, so some may exist)" : string.Empty;
        card.NextSteps.Add("Complete the work-up" + labsNote + ": " + string.Join("; ", missing) + " (offered as draft orders below).");
    }
}
