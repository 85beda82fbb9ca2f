using CdsNatremia.Core.Assessment;
using CdsNatremia.Core.Cards;
using CdsNatremia.Core.CorrectionRate;
using CdsNatremia.Core.Engine;
using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Findings;
using CdsNatremia.Core.Knowledge;
using CdsNatremia.Core.Rendering;
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
        var existing = DrugCauseAnalysis.Find(sets, request.Facts.Medications, fall);
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
        var mainName = DrugText.Name(main);

        // Reasons: what the headline does not say yet, by weight (the short card shows three). Steps: the full reasoning.
        var reasons = new List<Finding>();
        var steps = new List<Finding>();
        foreach (var match in matches)
        {
            var reference = Slot.Text("reference", draft.Reference);
            Slot[] slots = [reference, DrugText.Name(match), Slot.Phrase("how", DrugText.HowMatched(match)), Slot.Phrase("group", DrugText.GroupAndTier(match.Set))];
            steps.Add((draft.Text is { } text
                ? Finding.Of(FindingKind.DrugOrderContainsProduct, [.. slots, Slot.Text("product", text)])
                : Finding.Of(FindingKind.DrugOrderContains, slots)).RestingOn(draft.Reference));
            reasons.Add(Finding.Of(FindingKind.DrugOrderReasonGroup, DrugText.Name(match), Slot.Phrase("group", DrugText.GroupAndTier(match.Set)))
                .Weighted(Weights.Context)
                .RestingOn(draft.Reference));
        }

        steps.Add(ReasonStep(reason, thresholds, options, used));
        if (ReasonFinding(reason, options) is { } why)
        {
            reasons.Add(why);
        }

        var relowering = string.Equals(main.Set.Id, DesmopressinSetId, StringComparison.Ordinal)
            ? Allowance.For(context)?.Overcorrected
            : null;
        if (relowering is not null)
        {
            reasons.Add(Finding.Of(FindingKind.DrugOrderReasonRelowering).Weighted(Weights.Culprit));
            steps.Add(RateCautionOrderCardProducer.Relowering(relowering).RestingOn(relowering.Baseline.Reference));
        }

        var sameDrug = existing.Where(e => matches.Any(m => m.Set.Id == e.Match.Set.Id
            && string.Equals(m.Ingredient, e.Match.Ingredient, StringComparison.OrdinalIgnoreCase))).ToList();
        foreach (var drug in sameDrug)
        {
            used.Add(drug.Medication.Reference);
            var reference = Slot.Text("reference", drug.Medication.Reference);
            steps.Add(Finding.Of(
                    FindingKind.DrugOrderAlreadyTaken,
                    DrugText.Name(drug.Match),
                    reference,
                    Slot.Phrase("timing", drug.Timing.Evidence),
                    Slot.Phrase("verdict", drug.Timing.VerdictFinding))
                .With(drug.Timing.Certainty)
                .RestingOn([drug.Medication.Reference, .. drug.Timing.Evidence.Evidence]));
            reasons.Add(Finding.Of(FindingKind.DrugOrderReasonAlreadyTaken, DrugText.Name(drug.Match), reference, Slot.Phrase("verdict", drug.Timing.VerdictFinding))
                .With(drug.Timing.Certainty)
                .Weighted(Weights.Cause)
                .RestingOn(drug.Medication.Reference));
        }

        var together = existing.Except(sameDrug).Where(e => e.Medication.Use == MedicationUse.Active)
            .Select(e => (e.Match, Kind: FindingKind.DrugOrderTogetherTaken, e.Medication.Reference))
            .Concat(otherDrafts.SelectMany(o => MedicationMatching.MatchAll(sets, o)
                .Select(m => (Match: m, Kind: FindingKind.DrugOrderTogetherOrdered, o.Reference))))
            .Where(t => !matches.Any(m => string.Equals(m.Ingredient, t.Match.Ingredient, StringComparison.OrdinalIgnoreCase)))
            .DistinctBy(t => t.Match.Ingredient.ToLowerInvariant())
            .ToList();
        if (together.Count > 0)
        {
            var others = together
                .Select(t => (SlotValue)new PhraseValue(Finding.Of(t.Kind, DrugText.Name(t.Match), DrugText.Group(t.Match.Set), Slot.Text("reference", t.Reference))))
                .ToList();
            var references = together.Select(t => t.Reference).ToArray();
            steps.Add(Finding.Of(FindingKind.DrugOrderTogether, mainName, Slot.List("names", others, TogetherSeparator)).With(Certainty.Possible).RestingOn(references));
            reasons.Add(Finding.Of(FindingKind.DrugOrderReasonTogether, Slot.Names("names", together.Select(t => t.Match.Ingredient)))
                .With(Certainty.Possible)
                .Weighted(Weights.Cause)
                .RestingOn(references));
        }

        var recheck = Slot.Phrase("recheck", Finding.Of(FindingKind.DrugOrderWithin, Slot.Verbatim("duration", ClinicalDuration.Hours(recheckHours))));
        var heartFailure = HeartFailureTreatment.HeartFailure(context);
        var treatment = HeartFailureTreatment.IsTreatment(main, heartFailure);
        if (treatment)
        {
            used.Add(heartFailure!.Reference);
            reasons.Add(Finding.Of(FindingKind.DrugOrderReasonHeartFailure, Slot.Phrase("heartFailure", HeartFailureTreatment.Cite(heartFailure)))
                .Weighted(Weights.Culprit)
                .RestingOn(heartFailure.Reference));
        }

        List<Finding> consider = treatment
            ?
            [
                HeartFailureTreatment.Considerations(main, heartFailure!),
                Finding.Of(FindingKind.DrugOrderRecheckAfterChange, recheck),
                Finding.Of(FindingKind.DrugOrderChoiceKeepOnly),
            ]
            :
            [
                DrugText.ConsiderationsBeforeStarting(main),
                Finding.Of(FindingKind.DrugOrderRecheckIfKept, recheck),
                Finding.Of(FindingKind.DrugOrderChoices),
            ];

        var cautions = new List<Finding>();
        if (context.Sodium.LatestIsStale && reason.Latest is { } stale && reason.Trigger != OrderWarningTrigger.AbsentOlderPatient)
        {
            cautions.Add(Finding.Of(FindingKind.DrugOrderCautionStale, Slot.Time("age", stale.EffectiveAt, TimeStyle.Age)).RestingOn(stale.Reference));
        }

        var content = new CardContent
        {
            Summary = Finding.Of(SummaryKind(reason.Trigger), [Slot.Phrase("drugWithGroup", DrugText.NameWithGroup(main)), .. SodiumSlots(reason, thresholds, options)]),
            Headline = Finding.Of(HeadlineKind(reason.Trigger), [mainName, .. SodiumSlots(reason, thresholds, options)]).RestingOn([.. used]),
            Reasons = reasons,
            Steps = steps,
            NextSteps = consider,
            Cautions = cautions,
            Sources = [DrugText.KnowledgeSource, thresholds.Source],
        };

        // Suggestion labels and order reasons are plain text (not Markdown): rendered here, from the catalogue.
        string Plain(Finding finding) => PhraseCatalogue.Default.Render(finding, context.Display);
        var plainName = Slot.Verbatim("drug", main.Ingredient);
        var suggestions = new List<Suggestion>();
        if (!treatment)
        {
            suggestions.Add(new(
                Plain(Finding.Of(FindingKind.DrugOrderRemoveLabel, plainName)),
                [SuggestedAction.Remove(draft.Reference, Plain(Finding.Of(FindingKind.DrugOrderRemoveDescription, plainName, Slot.Verbatim("reference", draft.Reference))))],
                null,
                "remove-draft-" + draft.ResourceId));
        }

        suggestions.Add(
            new(
                Plain(Finding.Of(FindingKind.DrugOrderKeepLabel, plainName, recheck)),
                [SuggestedAction.Order(LabOrders.SerumSodium(LabOrders.Why(FindingKind.DrugOrderKeepReason, plainName, recheck), recheckHours))],
                null,
                "keep-and-recheck-sodium-" + draft.ResourceId));

        return new Card
        {
            Content = content,
            // A stale sodium calls for a recheck first, and a deliberate re-lowering is a senior decision: at most a warning.
            Indicator = profound && relowering is null && !context.Sodium.LatestIsStale ? CardIndicator.Critical : CardIndicator.Warning,
            Topic = "drug-order-warning",
            RuleIds = [RuleId],
            ResourcesUsed = [.. used],
            Suggestions = suggestions,
            SelectionBehavior = SelectionBehavior.AtMostOne,
        };
    }

    /// <summary>How the drugs acting together are joined (a separator, not a sentence).</summary>
    private const string TogetherSeparator = "; ";

    private static string SummaryKind(OrderWarningTrigger trigger) => trigger switch
    {
        OrderWarningTrigger.Low => FindingKind.DrugOrderSummaryLow,
        OrderWarningTrigger.Falling => FindingKind.DrugOrderSummaryFalling,
        _ => FindingKind.DrugOrderSummaryAbsent,
    };

    private static string HeadlineKind(OrderWarningTrigger trigger) => trigger switch
    {
        OrderWarningTrigger.Low => FindingKind.DrugOrderHeadlineLow,
        OrderWarningTrigger.Falling => FindingKind.DrugOrderHeadlineFalling,
        _ => FindingKind.DrugOrderHeadlineAbsent,
    };

    /// <summary>The values of the summary and headline: the sodium that gave the warning, or the days and the age.</summary>
    private static Slot[] SodiumSlots(OrderWarningReason reason, SeverityThresholds thresholds, DrugCauseOptions options) => reason.Trigger switch
    {
        OrderWarningTrigger.Low =>
        [
            Slot.Number("sodium", reason.Latest!.Value),
            Slot.Text("band", thresholds.NameOf(thresholds.Classify(reason.Latest.Value))),
            Slot.Time("when", reason.Latest.EffectiveAt, TimeStyle.AgeAndTime),
            Slot.Time("age", reason.Latest.EffectiveAt, TimeStyle.Age),
        ],
        OrderWarningTrigger.Falling =>
        [
            Slot.Number("sodium", reason.Latest!.Value),
            Slot.Number("higher", reason.Higher!.Value),
            Slot.Time("when", reason.Latest.EffectiveAt, TimeStyle.AgeAndTime),
        ],
        _ => [Slot.Number("days", options.RecentSodiumDays), Slot.Count("age", reason.AgeYears ?? 0)],
    };

    /// <summary>The short reason for the card beyond the headline: how far the sodium fell, or why a missing sodium matters.</summary>
    private static Finding? ReasonFinding(OrderWarningReason reason, DrugCauseOptions options) => reason.Trigger switch
    {
        OrderWarningTrigger.Falling => Finding.Of(
                FindingKind.DrugOrderReasonFalling,
                Slot.Rounded("drop", reason.Higher!.Value - reason.Latest!.Value, 1),
                Slot.Number("higher", reason.Higher.Value),
                Slot.Time("when", reason.Higher.EffectiveAt, TimeStyle.AgeAndTime),
                Slot.Number("meaningful", options.MeaningfulDropMmolPerL),
                Slot.Verbatim("window", ClinicalDuration.Hours(options.FallingWindowHours)))
            .Weighted(Weights.Pace)
            .RestingOn(reason.Latest.Reference, reason.Higher.Reference),
        OrderWarningTrigger.AbsentOlderPatient => Finding.Of(
                FindingKind.DrugOrderReasonAbsent,
                Slot.Count("age", reason.AgeYears ?? 0),
                Slot.Count("minAge", options.AbsentSodiumMinimumAgeYears),
                Slot.Phrase("last", LastSodium(reason)))
            .With(Certainty.Unknown)
            .Weighted(Weights.Pace),
        _ => null,
    };

    private static Finding LastSodium(OrderWarningReason reason)
        => reason.Latest is { } last
            ? Finding.Of(FindingKind.DrugOrderAbsentLast, Slot.Result("result", last)).RestingOn(last.Reference)
            : Finding.Of(FindingKind.DrugOrderAbsentNone);

    private static Finding ReasonStep(OrderWarningReason reason, SeverityThresholds thresholds, DrugCauseOptions options, SortedSet<string> used)
    {
        switch (reason.Trigger)
        {
            case OrderWarningTrigger.Low:
                var latest = reason.Latest!;
                used.Add(latest.Reference);
                var band = thresholds.Classify(latest.Value);
                return Finding.Of(
                        FindingKind.DrugOrderLow,
                        Slot.Result("result", latest),
                        Slot.Text("band", thresholds.NameOf(band)),
                        Slot.Text("range", thresholds.RangeOf(band)),
                        Slot.Verbatim("source", thresholds.Source))
                    .RestingOn(latest.Reference);
            case OrderWarningTrigger.Falling:
                used.Add(reason.Latest!.Reference);
                used.Add(reason.Higher!.Reference);
                return Finding.Of(
                        FindingKind.DrugOrderFalling,
                        Slot.Result("latest", reason.Latest),
                        Slot.Rounded("drop", reason.Higher.Value - reason.Latest.Value, 1),
                        Slot.Result("higher", reason.Higher),
                        Slot.Number("meaningful", options.MeaningfulDropMmolPerL),
                        Slot.Verbatim("window", ClinicalDuration.Hours(options.FallingWindowHours)))
                    .RestingOn(reason.Latest.Reference, reason.Higher.Reference);
            default:
                if (reason.Latest is { } old)
                {
                    used.Add(old.Reference);
                }

                return Finding.Of(
                        FindingKind.DrugOrderAbsent,
                        Slot.Number("days", options.RecentSodiumDays),
                        Slot.Phrase("last", LastSodium(reason)),
                        Slot.Count("age", reason.AgeYears ?? 0),
                        Slot.Count("minAge", options.AbsentSodiumMinimumAgeYears))
                    .With(Certainty.Unknown);
        }
    }
}
