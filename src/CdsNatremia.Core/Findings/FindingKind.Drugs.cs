namespace CdsNatremia.Core.Findings;

/// <summary>The drug findings: medicines that can lower sodium on the assessment card (cause, timing, recently stopped, heart-failure treatment) and the order warning.</summary>
public static partial class FindingKind
{
    /// <summary>A drug group of the primary tier, with what the tier means.</summary>
    public const string DrugGroupPrimary = "drug.group.primary";

    /// <summary>A drug group of the secondary tier, with what the tier means.</summary>
    public const string DrugGroupSecondary = "drug.group.secondary";

    /// <summary>The primary tier, short.</summary>
    public const string DrugTierPrimary = "drug.tier.primary";

    /// <summary>The secondary tier, short.</summary>
    public const string DrugTierSecondary = "drug.tier.secondary";

    /// <summary>How a drug matched: by name.</summary>
    public const string DrugMatchedByName = "drug.matched.by-name";

    /// <summary>How a drug matched: by code.</summary>
    public const string DrugMatchedByCode = "drug.matched.by-code";

    /// <summary>A drug with its group, for a summary (group label starting with a consonant).</summary>
    public const string DrugNameWithGroupA = "drug.name-with-group.a";

    /// <summary>A drug with its group, for a summary (group label starting with a vowel).</summary>
    public const string DrugNameWithGroupAn = "drug.name-with-group.an";

    /// <summary>What clinicians usually consider for a drug that can lower sodium.</summary>
    public const string DrugConsider = "drug.consider";

    /// <summary>What clinicians usually consider, with the group's own caution ({caution}).</summary>
    public const string DrugConsiderWithCaution = "drug.consider.with-caution";

    /// <summary>The anti-epileptics' caution (common practice).</summary>
    public const string DrugCautionAntiepileptic = "drug.consider.caution.antiepileptic";

    /// <summary>The antidepressants' caution (common practice).</summary>
    public const string DrugCautionAntidepressant = "drug.consider.caution.antidepressant";

    /// <summary>Desmopressin's caution.</summary>
    public const string DrugCautionDesmopressin = "drug.consider.caution.desmopressin";

    /// <summary>Chemotherapy's caution.</summary>
    public const string DrugCautionChemotherapy = "drug.consider.caution.chemotherapy";

    /// <summary>What clinicians usually weigh before starting a drug that can lower sodium.</summary>
    public const string DrugConsiderBeforeStarting = "drug.consider.before-starting";

    /// <summary>Timing verdict: likely.</summary>
    public const string DrugVerdictLikely = "drug.verdict.likely";

    /// <summary>Timing verdict: possible.</summary>
    public const string DrugVerdictPossible = "drug.verdict.possible";

    /// <summary>Timing verdict: unlikely.</summary>
    public const string DrugVerdictUnlikely = "drug.verdict.unlikely";

    /// <summary>Timing: recorded as intended, not yet taken.</summary>
    public const string DrugTimingIntended = "drug.timing.intended";

    /// <summary>Timing: start not recorded.</summary>
    public const string DrugTimingStartUnknown = "drug.timing.start-unknown";

    /// <summary>When a drug started, and from which element.</summary>
    public const string DrugTimingStarted = "drug.timing.started";

    /// <summary>When a drug started (the element not named).</summary>
    public const string DrugTimingStartedNoSource = "drug.timing.started.no-source";

    /// <summary>Timing: no low sodium, so no fall.</summary>
    public const string DrugTimingNoFall = "drug.timing.no-fall";

    /// <summary>Timing: started on or after the first low result.</summary>
    public const string DrugTimingAfterFirstLow = "drug.timing.after-first-low";

    /// <summary>Timing: started before the first low result, but no earlier higher sodium.</summary>
    public const string DrugTimingNoBefore = "drug.timing.no-before";

    /// <summary>Timing: started during the fall.</summary>
    public const string DrugTimingDuringFall = "drug.timing.during-fall";

    /// <summary>Timing: already taken before the fall.</summary>
    public const string DrugTimingAlreadyTaken = "drug.timing.already-taken";

    /// <summary>A sodium value with its time and resource.</summary>
    public const string DrugSodiumAt = "drug.sodium-at";

    /// <summary>The fall step: no low sodium.</summary>
    public const string DrugFallNone = "drug.fall.none";

    /// <summary>The fall step: the result before the fall and the first low result.</summary>
    public const string DrugFallKnown = "drug.fall.known";

    /// <summary>The fall step: no earlier higher sodium.</summary>
    public const string DrugFallStartUnknown = "drug.fall.start-unknown";

    /// <summary>The medicine named by its ingredient.</summary>
    public const string DrugMedicine = "drug.medicine";

    /// <summary>The medicine named by its ingredient in a product of another name.</summary>
    public const string DrugMedicineInProduct = "drug.medicine.in-product";

    /// <summary>The record a drug verdict rests on.</summary>
    public const string DrugRecordsOne = "drug.records.one";

    /// <summary>The record a drug verdict rests on, and the other records of the same drug.</summary>
    public const string DrugRecordsMany = "drug.records.many";

    /// <summary>The reasoning step for one medicine.</summary>
    public const string DrugStep = "drug.step";

    /// <summary>The reasoning step for a loop diuretic that treats heart failure.</summary>
    public const string DrugStepHeartFailure = "drug.step.heart-failure";

    /// <summary>A medicine in the possible causes.</summary>
    public const string DrugCause = "drug.cause";

    /// <summary>A loop diuretic treating heart failure in the possible causes.</summary>
    public const string DrugCauseHeartFailure = "drug.cause.heart-failure";

    /// <summary>Key finding: a likely drug contributor.</summary>
    public const string DrugLikely = "drug.likely";

    /// <summary>Key finding: a likely drug contributor that treats the patient's heart failure.</summary>
    public const string DrugLikelyHeartFailure = "drug.likely.heart-failure";

    /// <summary>The joint of two names in a list (with its spaces).</summary>
    public const string DrugListAnd = "drug.list.and";

    /// <summary>Key finding: medicines acting together.</summary>
    public const string DrugTogether = "drug.together";

    /// <summary>Summary action: review a likely drug cause.</summary>
    public const string DrugActionReviewLikely = "drug.action.review-likely";

    /// <summary>Reason of the sodium recheck offered while a drug that can lower sodium is taken.</summary>
    public const string DrugRecheckWhileTaking = "drug.recheck.while-taking";

    /// <summary>The heart-failure condition cited.</summary>
    public const string DrugHeartFailure = "drug.heart-failure";

    /// <summary>The heart-failure condition cited with its text.</summary>
    public const string DrugHeartFailureWithText = "drug.heart-failure.text";

    /// <summary>What clinicians usually consider for a loop diuretic in heart failure.</summary>
    public const string DrugHeartFailureConsider = "drug.heart-failure.consider";

    /// <summary>When a medicine stopped: the end is recorded.</summary>
    public const string DrugStoppedEnded = "drug.stopped.ended";

    /// <summary>When a medicine stopped: only when it was last recorded.</summary>
    public const string DrugStoppedOnOrBefore = "drug.stopped.on-or-before";

    /// <summary>When a medicine stopped: not recorded.</summary>
    public const string DrugStoppedUndated = "drug.stopped.undated";

    /// <summary>The reasoning step for a recently stopped medicine.</summary>
    public const string DrugStoppedStep = "drug.stopped.step";

    /// <summary>A recently stopped medicine in the possible causes.</summary>
    public const string DrugStoppedCause = "drug.stopped.cause";

    /// <summary>Order warning summary: sodium already low.</summary>
    public const string DrugOrderSummaryLow = "drug.order.summary.low";

    /// <summary>Order warning summary: sodium falling.</summary>
    public const string DrugOrderSummaryFalling = "drug.order.summary.falling";

    /// <summary>Order warning summary: no recent sodium for an older patient.</summary>
    public const string DrugOrderSummaryAbsent = "drug.order.summary.absent";

    /// <summary>Order warning headline: sodium already low.</summary>
    public const string DrugOrderHeadlineLow = "drug.order.headline.low";

    /// <summary>Order warning headline: sodium falling.</summary>
    public const string DrugOrderHeadlineFalling = "drug.order.headline.falling";

    /// <summary>Order warning headline: no recent sodium.</summary>
    public const string DrugOrderHeadlineAbsent = "drug.order.headline.absent";

    /// <summary>Order warning reason: the drug's group and tier.</summary>
    public const string DrugOrderReasonGroup = "drug.order.reason.group";

    /// <summary>Order warning reason: how far the sodium fell.</summary>
    public const string DrugOrderReasonFalling = "drug.order.reason.falling";

    /// <summary>Order warning reason: an older patient without a recent sodium.</summary>
    public const string DrugOrderReasonAbsent = "drug.order.reason.absent";

    /// <summary>Order warning reason: the drug is already taken.</summary>
    public const string DrugOrderReasonAlreadyTaken = "drug.order.reason.already-taken";

    /// <summary>Order warning reason: medicines acting together.</summary>
    public const string DrugOrderReasonTogether = "drug.order.reason.together";

    /// <summary>Order warning reason: a loop diuretic that treats heart failure.</summary>
    public const string DrugOrderReasonHeartFailure = "drug.order.reason.heart-failure";

    /// <summary>Order warning reason: desmopressin after over-correction.</summary>
    public const string DrugOrderReasonRelowering = "drug.order.reason.relowering";

    /// <summary>Order warning caution: the latest sodium is stale.</summary>
    public const string DrugOrderCautionStale = "drug.order.caution.stale";

    /// <summary>Order warning step: what the draft order contains.</summary>
    public const string DrugOrderContains = "drug.order.contains";

    /// <summary>Order warning step: what the draft order, named, contains.</summary>
    public const string DrugOrderContainsProduct = "drug.order.contains.product";

    /// <summary>Order warning step: sodium already low.</summary>
    public const string DrugOrderLow = "drug.order.low";

    /// <summary>Order warning step: sodium falling.</summary>
    public const string DrugOrderFalling = "drug.order.falling";

    /// <summary>Order warning step: no recent sodium.</summary>
    public const string DrugOrderAbsent = "drug.order.absent";

    /// <summary>The last usable sodium, when too old.</summary>
    public const string DrugOrderAbsentLast = "drug.order.absent.last";

    /// <summary>No sodium on record.</summary>
    public const string DrugOrderAbsentNone = "drug.order.absent.none";

    /// <summary>Order warning step: the drug is already taken, with its timing.</summary>
    public const string DrugOrderAlreadyTaken = "drug.order.already-taken";

    /// <summary>Order warning step: medicines acting together.</summary>
    public const string DrugOrderTogether = "drug.order.together";

    /// <summary>A drug acting together that is already taken.</summary>
    public const string DrugOrderTogetherTaken = "drug.order.together.taken";

    /// <summary>A drug acting together that is in the same orders.</summary>
    public const string DrugOrderTogetherOrdered = "drug.order.together.ordered";

    /// <summary>When a recheck is wanted.</summary>
    public const string DrugOrderWithin = "drug.order.within";

    /// <summary>Next step for a diuretic treating heart failure: recheck after a change.</summary>
    public const string DrugOrderRecheckAfterChange = "drug.order.recheck-after-change";

    /// <summary>The one choice offered for a diuretic treating heart failure.</summary>
    public const string DrugOrderChoiceKeepOnly = "drug.order.choice.keep-only";

    /// <summary>Next step: recheck if the drug is kept.</summary>
    public const string DrugOrderRecheckIfKept = "drug.order.recheck-if-kept";

    /// <summary>The choices offered.</summary>
    public const string DrugOrderChoices = "drug.order.choices";

    /// <summary>Suggestion label: remove the draft order.</summary>
    public const string DrugOrderRemoveLabel = "drug.order.remove.label";

    /// <summary>Suggestion action: remove the draft order.</summary>
    public const string DrugOrderRemoveDescription = "drug.order.remove.description";

    /// <summary>Suggestion label: keep the order and recheck sodium.</summary>
    public const string DrugOrderKeepLabel = "drug.order.keep.label";

    /// <summary>Reason of the sodium recheck ordered with a kept drug.</summary>
    public const string DrugOrderKeepReason = "drug.order.keep.reason";
}
