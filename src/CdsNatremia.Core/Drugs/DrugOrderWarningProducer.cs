using CdsNatremia.Core.Assessment;
using CdsNatremia.Core.Cards;
using CdsNatremia.Core.CorrectionRate;
using CdsNatremia.Core.Engine;
using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Knowledge;
using CdsNatremia.Core.Sodium;
using CdsNatremia.Core.Text;

namespace CdsNatremia.Core.Drugs;

/// <summary>
/// On order-select (selected drafts only) and order-sign: one card per draft medication order that can lower sodium
/// when the latest sodium is low, falling, or (configurable) absent for an older patient
/// (<see cref="OrderWarningReason.Decide"/>). A warning, critical when the sodium is profound, with two choices
/// (at most one): remove the draft order, or keep it and add a sodium recheck. A normal, stable sodium gives no card,
/// so re-ordering a drug the patient already takes without trouble stays quiet. Thresholds: <see cref="DrugCauseOptions"/>.
/// </summary>
public sealed class DrugOrderWarningProducer : ICardProducer
{
    /// <summary>The desmopressin set's id: it lowers sodium, and its card says so (one card per order).</summary>
    public const string DesmopressinSetId = "drug-desmopressin";

    /// <summary>Our override-reason code system's id in the knowledge base (<see cref="OverrideReasonChoice.SystemId"/>).</summary>
    public const string OverrideReasonSystemId = OverrideReasonChoice.SystemId;

    /// <inheritdoc />
    public string RuleId => "drug.order-warning";

    /// <inheritdoc />
    public IEnumerable<Card> Produce(DecisionContext context)
    {
        Guard.NotNull(context, nameof(context));
        var request = context.Request;
        var options = context.Options.DrugCause;
        var sets = DrugCauseSets.Causes(context.Knowledge)
            .Where(s => options.WarnOnSecondaryTier || s.Tier == EvidenceTier.Primary)
            .ToList();
        var drafts = DraftOrders.Considered(request);
        var implicatedDrafts = drafts
            .Select(d => (Draft: d, Matches: MedicationMatching.MatchAll(sets, d).ToList()))
            .Where(x => x.Matches.Count > 0)
            .ToList();
        if (implicatedDrafts.Count == 0)
        {
            return [];
        }

        var reason = OrderWarningReason.Decide(context.Sodium.Results, context.Thresholds.NormalFrom, options, request.Now, request.Facts.AgeAt(request.Now));
        if (reason is null)
        {
            return [];
        }

        var fall = DrugCauseAnalysis.Fall(context);
        var existing = DrugCauseAnalysis.Find(sets, request.Facts.Medications, fall, context.Display);
        return implicatedDrafts
            .DistinctBy(x => x.Draft.Reference, StringComparer.Ordinal)
            .Select(x => Build(context, x.Draft, x.Matches, reason, existing, implicatedDrafts.Select(o => o.Draft).Where(o => o.Reference != x.Draft.Reference).ToList(), sets))
            .ToList();
    }

    /// <summary>
    /// True when this producer gives a card for <paramref name="draft"/> (it is in a warned drug group and the sodium gives a
    /// reason). Other producers ask it so that one order gets one card, not two (desmopressin: <see cref="CorrectionRate.RateCautionOrderCardProducer"/>).
    /// </summary>
    public static bool Warns(DecisionContext context, MedicationFact draft)
    {
        Guard.NotNull(context, nameof(context));
        Guard.NotNull(draft, nameof(draft));
        var options = context.Options.DrugCause;
        var request = context.Request;
        if (!DraftOrders.IsConsidered(request, draft))
        {
            return false;
        }

        var sets = DrugCauseSets.Causes(context.Knowledge).Where(s => options.WarnOnSecondaryTier || s.Tier == EvidenceTier.Primary).ToList();
        if (!MedicationMatching.MatchAll(sets, draft).Any())
        {
            return false;
        }

        return OrderWarningReason.Decide(context.Sodium.Results, context.Thresholds.NormalFrom, options, request.Now, request.Facts.AgeAt(request.Now)) is not null;
    }

    private Card Build(
        DecisionContext context,
        MedicationFact draft,
        IReadOnlyList<MedicationMatch> matches,
        OrderWarningReason reason,
        IReadOnlyList<ImplicatedDrug> existing,
        IReadOnlyList<MedicationFact> otherDrafts,
        IReadOnlyList<CodeSet> sets)
    {
        var options = context.Options.DrugCause;
        var thresholds = context.Thresholds;
        var main = matches.OrderBy(m => m.Set.Tier ?? EvidenceTier.Secondary).First();
        var band = reason.Latest is { } latest ? thresholds.Classify(latest.Value) : (SeverityBand?)null;
        var profound = band == SeverityBand.Profound && reason.Trigger == OrderWarningTrigger.Low;
        var recheckHours = profound ? options.ProfoundRecheckWithinHours : options.RecheckWithinHours;
        var used = new SortedSet<string>(StringComparer.Ordinal) { draft.Reference };

        var findings = new List<string>();
        var product = draft.Text is { } text ? $" \"{Markdown.Escape(text)}\"" : string.Empty;
        foreach (var match in matches)
        {
            findings.Add($"The draft order{product} ({Markdown.Escape(draft.Reference)}) contains **{DrugText.Name(match)}**, {DrugText.HowMatched(match)}; group {DrugText.GroupAndTier(match.Set)}.");
        }

        findings.Add(ReasonLine(reason, thresholds, options, used, context.Display));

        var relowering = string.Equals(main.Set.Id, DesmopressinSetId, StringComparison.Ordinal)
            ? Allowance.For(context)?.Overcorrected
            : null;
        if (relowering is not null)
        {
            findings.Add(RateCautionOrderCardProducer.ReloweringText(relowering, context.Display));
        }

        var sameDrug = existing.Where(e => matches.Any(m => m.Set.Id == e.Match.Set.Id
            && string.Equals(m.Ingredient, e.Match.Ingredient, StringComparison.OrdinalIgnoreCase))).ToList();
        foreach (var drug in sameDrug)
        {
            used.Add(drug.Medication.Reference);
            findings.Add($"The patient already takes {DrugText.Name(drug.Match)} ({Markdown.Escape(drug.Medication.Reference)}); against the sodium series: {drug.Timing.Text}: **{drug.Timing.VerdictText}**.");
        }

        var together = existing.Except(sameDrug).Where(e => e.Medication.Use == MedicationUse.Active)
            .Select(e => (Name: DrugText.Name(e.Match), Label: e.Match.Set.Label, Where: "already taken, " + e.Medication.Reference))
            .Concat(otherDrafts.SelectMany(o => MedicationMatching.MatchAll(sets, o)
                .Select(m => (Name: DrugText.Name(m), Label: m.Set.Label, Where: "also in these orders, " + o.Reference))))
            .Where(t => !matches.Any(m => string.Equals(DrugText.Name(m), t.Name, StringComparison.OrdinalIgnoreCase)))
            .DistinctBy(t => t.Name.ToLowerInvariant())
            .ToList();
        if (together.Count > 0)
        {
            var names = string.Join("; ", together.Select(t => $"{t.Name} ({Markdown.Escape(t.Label)}; {Markdown.Escape(t.Where)})"));
            findings.Add($"**Medicines acting together**: {DrugText.Name(main)} with {names}; their effects on sodium add up (common practice).");
        }

        var recheck = Invariant.Format($"within {ClinicalDuration.Hours(recheckHours)}");
        var heartFailure = HeartFailureTreatment.HeartFailure(context);
        var treatment = HeartFailureTreatment.IsTreatment(main, heartFailure);
        if (treatment)
        {
            used.Add(heartFailure!.Reference);
        }

        var consider = treatment
            ? new List<string>
            {
                HeartFailureTreatment.Considerations(main, heartFailure!),
                $"Clinicians usually recheck sodium {recheck} of a change in the diuretic, and sooner if symptoms appear (common practice).",
                "The choice below adds a sodium recheck; removing the order is not offered, since the diuretic treats the heart failure.",
            }
            : new List<string>
            {
                DrugText.ConsiderationsBeforeStarting(main),
                $"If it is kept, clinicians usually recheck sodium {recheck} of starting it, and sooner if symptoms appear (common practice).",
                "The choices below are offered, at most one: remove this draft order, or keep it and add a sodium recheck.",
            };

        var detail = new DetailWriter()
            .Paragraph(Invariant.Format($"**A medicine that can lower sodium is being ordered**, as of {context.Display.Time(context.Request.Now)}. Advisory only."))
            .Bullets("Findings", findings)
            .Bullets("What clinicians usually consider", consider);
        CardFooter.Write(detail, context, [
            "Drug groups and codes: CdsNatremia knowledge files (profiles/valuesets; each code's source is listed in its file)",
            thresholds.Source,
        ]);

        var name = main.Ingredient;
        var removeLabel = $"Remove the draft {name} order";
        var suggestions = new List<Suggestion>();
        if (!treatment)
        {
            suggestions.Add(new(removeLabel, [SuggestedAction.Remove(draft.Reference, $"Remove the draft order {draft.Reference} ({name}).")], null, "remove-draft-" + draft.ResourceId));
        }

        suggestions.Add(
            new(
                Invariant.Format($"Keep the {name} order and recheck sodium {recheck}"),
                [SuggestedAction.Order(LabOrders.SerumSodium(Invariant.Format($"{name} can lower sodium; recheck {recheck} of starting it."), recheckHours))],
                null,
                "keep-and-recheck-sodium-" + draft.ResourceId));

        return new Card
        {
            Summary = Summary.Fit(SummaryText(main, reason, band, thresholds, options, context.Display)),
            // A stale sodium calls for a recheck first, and a deliberate re-lowering is a senior decision: at most a warning.
            Indicator = profound && relowering is null && !context.Sodium.LatestIsStale ? CardIndicator.Critical : CardIndicator.Warning,
            Detail = detail.ToString(),
            Topic = "drug-order-warning",
            RuleIds = [RuleId],
            ResourcesUsed = [.. used],
            Suggestions = suggestions,
            SelectionBehavior = SelectionBehavior.AtMostOne,
        };
    }

    private static string SummaryText(MedicationMatch main, OrderWarningReason reason, SeverityBand? band, SeverityThresholds thresholds, DrugCauseOptions options, TimeDisplay display)
    {
        var what = $"{DrugText.PlainNameWithGroup(main)} can lower sodium";
        return reason.Trigger switch
        {
            OrderWarningTrigger.Low => Invariant.Format(
                $"{what}; sodium is already {Invariant.Number(reason.Latest!.Value)} mmol/L ({thresholds.NameOf(band!.Value)}, {display.AgeAndTime(reason.Latest.EffectiveAt)})."),
            OrderWarningTrigger.Falling => Invariant.Format(
                $"{what}; sodium is falling: {Invariant.Number(reason.Latest!.Value)} mmol/L, down from {Invariant.Number(reason.Higher!.Value)}."),
            _ => Invariant.Format($"{what}; no sodium in the last {Invariant.Number(options.RecentSodiumDays)} days for a patient aged {reason.AgeYears}."),
        };
    }

    private static string ReasonLine(OrderWarningReason reason, SeverityThresholds thresholds, DrugCauseOptions options, SortedSet<string> used, TimeDisplay display)
    {
        switch (reason.Trigger)
        {
            case OrderWarningTrigger.Low:
                var latest = reason.Latest!;
                used.Add(latest.Reference);
                var band = thresholds.Classify(latest.Value);
                return Invariant.Format(
                    $"**Sodium is already low**: {Cite.Result(latest, display)}, {thresholds.NameOf(band)} hyponatremia ({thresholds.RangeOf(band)}; {thresholds.Source}); this medicine can lower it further.");
            case OrderWarningTrigger.Falling:
                used.Add(reason.Latest!.Reference);
                used.Add(reason.Higher!.Reference);
                return Invariant.Format(
                    $"**Sodium is falling**: {Cite.Result(reason.Latest, display)}, down {Invariant.Number(reason.Higher.Value - reason.Latest.Value)} mmol/L from {Cite.Result(reason.Higher, display)} (a drop of at least {Invariant.Number(options.MeaningfulDropMmolPerL)} mmol/L within {ClinicalDuration.Hours(options.FallingWindowHours)} counts as falling).");
            default:
                if (reason.Latest is { } old)
                {
                    used.Add(old.Reference);
                }

                var last = reason.Latest is { } l ? "the last usable one is " + Cite.Result(l, display) : "none is on record";
                return Invariant.Format(
                    $"**No recent sodium**: no usable sodium in the last {Invariant.Number(options.RecentSodiumDays)} days ({last}), and the patient is {reason.AgeYears} years old (age {options.AbsentSodiumMinimumAgeYears} or over: a higher risk of low sodium from medicines, common practice).");
        }
    }
}
