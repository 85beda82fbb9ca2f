namespace CdsNatremia.Core.Findings;

/// <summary>Finding kinds of the correction-rate, infusion and rate-caution cards and the high-risk rule (phrases in Phrases/CorrectionRate.resx); generated from the phrase list, one constant per phrase.</summary>
public static partial class FindingKind
{
    /// <summary>Phrase <c>rate.signed.positive</c>.</summary>
    public const string RateSignedPositive = "rate.signed.positive";

    /// <summary>Phrase <c>rate.signed.other</c>.</summary>
    public const string RateSignedOther = "rate.signed.other";

    /// <summary>Phrase <c>rate.limit.first-day</c>.</summary>
    public const string RateLimitFirstDay = "rate.limit.first-day";

    /// <summary>Phrase <c>rate.limit.later-day</c>.</summary>
    public const string RateLimitLaterDay = "rate.limit.later-day";

    /// <summary>Phrase <c>rate.limit.day.high-risk</c>.</summary>
    public const string RateLimitDayHighRisk = "rate.limit.day.high-risk";

    /// <summary>Phrase <c>rate.limit.first-two-days</c>.</summary>
    public const string RateLimitFirstTwoDays = "rate.limit.first-two-days";

    /// <summary>Phrase <c>rate.limit.any-two-days</c>.</summary>
    public const string RateLimitAnyTwoDays = "rate.limit.any-two-days";

    /// <summary>Phrase <c>rate.limit.two-days.high-risk</c>.</summary>
    public const string RateLimitTwoDaysHighRisk = "rate.limit.two-days.high-risk";

    /// <summary>Phrase <c>rate.status.no-rise</c>.</summary>
    public const string RateStatusNoRise = "rate.status.no-rise";

    /// <summary>Phrase <c>rate.status.within</c>.</summary>
    public const string RateStatusWithin = "rate.status.within";

    /// <summary>Phrase <c>rate.status.approaching</c>.</summary>
    public const string RateStatusApproaching = "rate.status.approaching";

    /// <summary>Phrase <c>rate.status.at-or-past</c>.</summary>
    public const string RateStatusAtOrPast = "rate.status.at-or-past";

    /// <summary>Phrase <c>rate.window</c>.</summary>
    public const string RateWindow = "rate.window";

    /// <summary>Phrase <c>rate.window.heading</c>.</summary>
    public const string RateWindowHeading = "rate.window.heading";

    /// <summary>Phrase <c>rate.window.heading.longer</c>.</summary>
    public const string RateWindowHeadingLonger = "rate.window.heading.longer";

    /// <summary>Phrase <c>rate.window.span.anchored</c>.</summary>
    public const string RateWindowSpanAnchored = "rate.window.span.anchored";

    /// <summary>Phrase <c>rate.window.span.rolling</c>.</summary>
    public const string RateWindowSpanRolling = "rate.window.span.rolling";

    /// <summary>Phrase <c>rate.window.rise.single</c>.</summary>
    public const string RateWindowRiseSingle = "rate.window.rise.single";

    /// <summary>Phrase <c>rate.window.rise.too-short</c>.</summary>
    public const string RateWindowRiseTooShort = "rate.window.rise.too-short";

    /// <summary>Phrase <c>rate.window.rise</c>.</summary>
    public const string RateWindowRise = "rate.window.rise";

    /// <summary>Phrase <c>rate.window.by-projection</c>.</summary>
    public const string RateWindowByProjection = "rate.window.by-projection";

    /// <summary>Phrase <c>rate.window.allowance-left</c>.</summary>
    public const string RateWindowAllowanceLeft = "rate.window.allowance-left";

    /// <summary>Phrase <c>rate.window.hours-left</c>.</summary>
    public const string RateWindowHoursLeft = "rate.window.hours-left";

    /// <summary>Phrase <c>rate.window.ended</c>.</summary>
    public const string RateWindowEnded = "rate.window.ended";

    /// <summary>Phrase <c>rate.window.projection</c>.</summary>
    public const string RateWindowProjection = "rate.window.projection";

    /// <summary>Phrase <c>rate.window.mixed-specimens</c>.</summary>
    public const string RateWindowMixedSpecimens = "rate.window.mixed-specimens";

    /// <summary>Phrase <c>rate.high-risk.none</c>.</summary>
    public const string RateHighRiskNone = "rate.high-risk.none";

    /// <summary>Phrase <c>rate.high-risk.found</c>.</summary>
    public const string RateHighRiskFound = "rate.high-risk.found";

    /// <summary>Phrase <c>rate.high-risk.caution</c>.</summary>
    public const string RateHighRiskCaution = "rate.high-risk.caution";

    /// <summary>Phrase <c>rate.high-risk.caution.many</c>.</summary>
    public const string RateHighRiskCautionMany = "rate.high-risk.caution.many";

    /// <summary>Phrase <c>rate.high-risk.statement</c>.</summary>
    public const string RateHighRiskStatement = "rate.high-risk.statement";

    /// <summary>Phrase <c>rate.high-risk.step</c>.</summary>
    public const string RateHighRiskStep = "rate.high-risk.step";

    /// <summary>Phrase <c>rate.high-risk.next</c>.</summary>
    public const string RateHighRiskNext = "rate.high-risk.next";

    /// <summary>Phrase <c>rate.high-risk.action</c>.</summary>
    public const string RateHighRiskAction = "rate.high-risk.action";

    /// <summary>Phrase <c>rate.factor.nadir</c>.</summary>
    public const string RateFactorNadir = "rate.factor.nadir";

    /// <summary>Phrase <c>rate.factor.nadir.name</c>.</summary>
    public const string RateFactorNadirName = "rate.factor.nadir.name";

    /// <summary>Phrase <c>rate.factor.potassium.laboratory</c>.</summary>
    public const string RateFactorPotassiumLaboratory = "rate.factor.potassium.laboratory";

    /// <summary>Phrase <c>rate.factor.potassium.configured</c>.</summary>
    public const string RateFactorPotassiumConfigured = "rate.factor.potassium.configured";

    /// <summary>Phrase <c>rate.factor.potassium.name</c>.</summary>
    public const string RateFactorPotassiumName = "rate.factor.potassium.name";

    /// <summary>Phrase <c>rate.factor.condition</c>.</summary>
    public const string RateFactorCondition = "rate.factor.condition";

    /// <summary>Phrase <c>rate.factor.condition.untitled</c>.</summary>
    public const string RateFactorConditionUntitled = "rate.factor.condition.untitled";

    /// <summary>Phrase <c>rate.factor.alcohol</c>.</summary>
    public const string RateFactorAlcohol = "rate.factor.alcohol";

    /// <summary>Phrase <c>rate.factor.malnutrition</c>.</summary>
    public const string RateFactorMalnutrition = "rate.factor.malnutrition";

    /// <summary>Phrase <c>rate.factor.liver</c>.</summary>
    public const string RateFactorLiver = "rate.factor.liver";

    /// <summary>Phrase <c>rate.stale</c>.</summary>
    public const string RateStale = "rate.stale";

    /// <summary>Phrase <c>rate.stale.step</c>.</summary>
    public const string RateStaleStep = "rate.stale.step";

    /// <summary>Phrase <c>rate.fast.summary.passed</c>.</summary>
    public const string RateFastSummaryPassed = "rate.fast.summary.passed";

    /// <summary>Phrase <c>rate.fast.summary.past</c>.</summary>
    public const string RateFastSummaryPast = "rate.fast.summary.past";

    /// <summary>Phrase <c>rate.fast.summary.approaching</c>.</summary>
    public const string RateFastSummaryApproaching = "rate.fast.summary.approaching";

    /// <summary>Phrase <c>rate.fast.headline.passed</c>.</summary>
    public const string RateFastHeadlinePassed = "rate.fast.headline.passed";

    /// <summary>Phrase <c>rate.fast.headline.past</c>.</summary>
    public const string RateFastHeadlinePast = "rate.fast.headline.past";

    /// <summary>Phrase <c>rate.fast.headline.approaching</c>.</summary>
    public const string RateFastHeadlineApproaching = "rate.fast.headline.approaching";

    /// <summary>Phrase <c>rate.fast.nadir</c>.</summary>
    public const string RateFastNadir = "rate.fast.nadir";

    /// <summary>Phrase <c>rate.latest</c>.</summary>
    public const string RateLatest = "rate.latest";

    /// <summary>Phrase <c>rate.fast.rise-since-nadir</c>.</summary>
    public const string RateFastRiseSinceNadir = "rate.fast.rise-since-nadir";

    /// <summary>Phrase <c>rate.fast.limit</c>.</summary>
    public const string RateFastLimit = "rate.fast.limit";

    /// <summary>Phrase <c>rate.fast.passed</c>.</summary>
    public const string RateFastPassed = "rate.fast.passed";

    /// <summary>Phrase <c>rate.fast.hours-left</c>.</summary>
    public const string RateFastHoursLeft = "rate.fast.hours-left";

    /// <summary>Phrase <c>rate.fast.window-ended</c>.</summary>
    public const string RateFastWindowEnded = "rate.fast.window-ended";

    /// <summary>Phrase <c>rate.fast.projection</c>.</summary>
    public const string RateFastProjection = "rate.fast.projection";

    /// <summary>Phrase <c>rate.fast.step.nadir</c>.</summary>
    public const string RateFastStepNadir = "rate.fast.step.nadir";

    /// <summary>Phrase <c>rate.fast.step.rise</c>.</summary>
    public const string RateFastStepRise = "rate.fast.step.rise";

    /// <summary>Phrase <c>rate.fast.step.same-time</c>.</summary>
    public const string RateFastStepSameTime = "rate.fast.step.same-time";

    /// <summary>Phrase <c>rate.fast.step.same-time.other</c>.</summary>
    public const string RateFastStepSameTimeOther = "rate.fast.step.same-time.other";

    /// <summary>Phrase <c>rate.fast.step.results</c>.</summary>
    public const string RateFastStepResults = "rate.fast.step.results";

    /// <summary>Phrase <c>rate.fast.next.pause</c>.</summary>
    public const string RateFastNextPause = "rate.fast.next.pause";

    /// <summary>Phrase <c>rate.fast.next.pause.what</c>.</summary>
    public const string RateFastNextPauseWhat = "rate.fast.next.pause.what";

    /// <summary>Phrase <c>rate.fast.next.relower</c>.</summary>
    public const string RateFastNextRelower = "rate.fast.next.relower";

    /// <summary>Phrase <c>rate.fast.next.slow</c>.</summary>
    public const string RateFastNextSlow = "rate.fast.next.slow";

    /// <summary>Phrase <c>rate.fast.next.recheck</c>.</summary>
    public const string RateFastNextRecheck = "rate.fast.next.recheck";

    /// <summary>Phrase <c>rate.fast.next.chronic</c>.</summary>
    public const string RateFastNextChronic = "rate.fast.next.chronic";

    /// <summary>Phrase <c>rate.fast.recheck-reason</c>.</summary>
    public const string RateFastRecheckReason = "rate.fast.recheck-reason";

    /// <summary>Phrase <c>rate.slow.summary.rose</c>.</summary>
    public const string RateSlowSummaryRose = "rate.slow.summary.rose";

    /// <summary>Phrase <c>rate.slow.summary.fell</c>.</summary>
    public const string RateSlowSummaryFell = "rate.slow.summary.fell";

    /// <summary>Phrase <c>rate.slow.summary.unchanged</c>.</summary>
    public const string RateSlowSummaryUnchanged = "rate.slow.summary.unchanged";

    /// <summary>Phrase <c>rate.slow.headline</c>.</summary>
    public const string RateSlowHeadline = "rate.slow.headline";

    /// <summary>Phrase <c>rate.slow.earlier</c>.</summary>
    public const string RateSlowEarlier = "rate.slow.earlier";

    /// <summary>Phrase <c>rate.slow.band</c>.</summary>
    public const string RateSlowBand = "rate.slow.band";

    /// <summary>Phrase <c>rate.slow.step.change</c>.</summary>
    public const string RateSlowStepChange = "rate.slow.step.change";

    /// <summary>Phrase <c>rate.slow.step.per-day</c>.</summary>
    public const string RateSlowStepPerDay = "rate.slow.step.per-day";

    /// <summary>Phrase <c>rate.slow.step.per-day.high-risk</c>.</summary>
    public const string RateSlowStepPerDayHighRisk = "rate.slow.step.per-day.high-risk";

    /// <summary>Phrase <c>rate.slow.next.treatment</c>.</summary>
    public const string RateSlowNextTreatment = "rate.slow.next.treatment";

    /// <summary>Phrase <c>rate.slow.next.recheck</c>.</summary>
    public const string RateSlowNextRecheck = "rate.slow.next.recheck";

    /// <summary>Phrase <c>rate.allowance.no-rise</c>.</summary>
    public const string RateAllowanceNoRise = "rate.allowance.no-rise";

    /// <summary>Phrase <c>rate.allowance.left</c>.</summary>
    public const string RateAllowanceLeft = "rate.allowance.left";

    /// <summary>Phrase <c>rate.infusate.saline09</c>.</summary>
    public const string RateInfusateSaline09 = "rate.infusate.saline09";

    /// <summary>Phrase <c>rate.infusate.saline09.start</c>.</summary>
    public const string RateInfusateSaline09Start = "rate.infusate.saline09.start";

    /// <summary>Phrase <c>rate.infusate.saline3</c>.</summary>
    public const string RateInfusateSaline3 = "rate.infusate.saline3";

    /// <summary>Phrase <c>rate.infusate.saline3.start</c>.</summary>
    public const string RateInfusateSaline3Start = "rate.infusate.saline3.start";

    /// <summary>Phrase <c>rate.infusate.saline045</c>.</summary>
    public const string RateInfusateSaline045 = "rate.infusate.saline045";

    /// <summary>Phrase <c>rate.infusate.saline045.start</c>.</summary>
    public const string RateInfusateSaline045Start = "rate.infusate.saline045.start";

    /// <summary>Phrase <c>rate.infusate.ringers-lactate</c>.</summary>
    public const string RateInfusateRingersLactate = "rate.infusate.ringers-lactate";

    /// <summary>Phrase <c>rate.infusate.ringers-lactate.start</c>.</summary>
    public const string RateInfusateRingersLactateStart = "rate.infusate.ringers-lactate.start";

    /// <summary>Phrase <c>rate.infusate.unread.start</c>.</summary>
    public const string RateInfusateUnreadStart = "rate.infusate.unread.start";

    /// <summary>Phrase <c>rate.water.child</c>.</summary>
    public const string RateWaterChild = "rate.water.child";

    /// <summary>Phrase <c>rate.water.man</c>.</summary>
    public const string RateWaterMan = "rate.water.man";

    /// <summary>Phrase <c>rate.water.woman</c>.</summary>
    public const string RateWaterWoman = "rate.water.woman";

    /// <summary>Phrase <c>rate.water.man.age-unknown</c>.</summary>
    public const string RateWaterManAgeUnknown = "rate.water.man.age-unknown";

    /// <summary>Phrase <c>rate.water.woman.age-unknown</c>.</summary>
    public const string RateWaterWomanAgeUnknown = "rate.water.woman.age-unknown";

    /// <summary>Phrase <c>rate.water.sex-unknown</c>.</summary>
    public const string RateWaterSexUnknown = "rate.water.sex-unknown";

    /// <summary>Phrase <c>rate.water.sex-unknown.age-unknown</c>.</summary>
    public const string RateWaterSexUnknownAgeUnknown = "rate.water.sex-unknown.age-unknown";

    /// <summary>Phrase <c>rate.urine.osmolality.above</c>.</summary>
    public const string RateUrineOsmolalityAbove = "rate.urine.osmolality.above";

    /// <summary>Phrase <c>rate.urine.osmolality.not-above</c>.</summary>
    public const string RateUrineOsmolalityNotAbove = "rate.urine.osmolality.not-above";

    /// <summary>Phrase <c>rate.urine.sum.above</c>.</summary>
    public const string RateUrineSumAbove = "rate.urine.sum.above";

    /// <summary>Phrase <c>rate.urine.sum.not-above</c>.</summary>
    public const string RateUrineSumNotAbove = "rate.urine.sum.not-above";

    /// <summary>Phrase <c>rate.urine.sodium-alone.above</c>.</summary>
    public const string RateUrineSodiumAloneAbove = "rate.urine.sodium-alone.above";

    /// <summary>Phrase <c>rate.urine.sodium-alone.not-above</c>.</summary>
    public const string RateUrineSodiumAloneNotAbove = "rate.urine.sodium-alone.not-above";

    /// <summary>Phrase <c>rate.infusion.summary.predicted</c>.</summary>
    public const string RateInfusionSummaryPredicted = "rate.infusion.summary.predicted";

    /// <summary>Phrase <c>rate.infusion.summary.unpredicted</c>.</summary>
    public const string RateInfusionSummaryUnpredicted = "rate.infusion.summary.unpredicted";

    /// <summary>Phrase <c>rate.infusion.summary.may-fall.predicted</c>.</summary>
    public const string RateInfusionSummaryMayFallPredicted = "rate.infusion.summary.may-fall.predicted";

    /// <summary>Phrase <c>rate.infusion.summary.may-fall</c>.</summary>
    public const string RateInfusionSummaryMayFall = "rate.infusion.summary.may-fall";

    /// <summary>Phrase <c>rate.infusion.headline.predicted</c>.</summary>
    public const string RateInfusionHeadlinePredicted = "rate.infusion.headline.predicted";

    /// <summary>Phrase <c>rate.infusion.headline.unpredicted</c>.</summary>
    public const string RateInfusionHeadlineUnpredicted = "rate.infusion.headline.unpredicted";

    /// <summary>Phrase <c>rate.infusion.headline.may-fall</c>.</summary>
    public const string RateInfusionHeadlineMayFall = "rate.infusion.headline.may-fall";

    /// <summary>Phrase <c>rate.infusion.verdict.limit-reached</c>.</summary>
    public const string RateInfusionVerdictLimitReached = "rate.infusion.verdict.limit-reached";

    /// <summary>Phrase <c>rate.infusion.verdict.exceed</c>.</summary>
    public const string RateInfusionVerdictExceed = "rate.infusion.verdict.exceed";

    /// <summary>Phrase <c>rate.infusion.verdict.lowers</c>.</summary>
    public const string RateInfusionVerdictLowers = "rate.infusion.verdict.lowers";

    /// <summary>Phrase <c>rate.infusion.verdict.close</c>.</summary>
    public const string RateInfusionVerdictClose = "rate.infusion.verdict.close";

    /// <summary>Phrase <c>rate.infusion.verdict.within</c>.</summary>
    public const string RateInfusionVerdictWithin = "rate.infusion.verdict.within";

    /// <summary>Phrase <c>rate.infusion.verdict.no-weight</c>.</summary>
    public const string RateInfusionVerdictNoWeight = "rate.infusion.verdict.no-weight";

    /// <summary>Phrase <c>rate.infusion.verdict.per-litre</c>.</summary>
    public const string RateInfusionVerdictPerLitre = "rate.infusion.verdict.per-litre";

    /// <summary>Phrase <c>rate.infusion.verdict.none</c>.</summary>
    public const string RateInfusionVerdictNone = "rate.infusion.verdict.none";

    /// <summary>Phrase <c>rate.infusion.no-weight</c>.</summary>
    public const string RateInfusionNoWeight = "rate.infusion.no-weight";

    /// <summary>Phrase <c>rate.infusion.weight-implausible</c>.</summary>
    public const string RateInfusionWeightImplausible = "rate.infusion.weight-implausible";

    /// <summary>Phrase <c>rate.infusion.serum</c>.</summary>
    public const string RateInfusionSerum = "rate.infusion.serum";

    /// <summary>Phrase <c>rate.infusion.serum-stale</c>.</summary>
    public const string RateInfusionSerumStale = "rate.infusion.serum-stale";

    /// <summary>Phrase <c>rate.infusion.serum-stale.step</c>.</summary>
    public const string RateInfusionSerumStaleStep = "rate.infusion.serum-stale.step";

    /// <summary>Phrase <c>rate.infusion.no-serum</c>.</summary>
    public const string RateInfusionNoSerum = "rate.infusion.no-serum";

    /// <summary>Phrase <c>rate.infusion.predicted.one</c>.</summary>
    public const string RateInfusionPredictedOne = "rate.infusion.predicted.one";

    /// <summary>Phrase <c>rate.infusion.predicted.many</c>.</summary>
    public const string RateInfusionPredictedMany = "rate.infusion.predicted.many";

    /// <summary>Phrase <c>rate.infusion.urine.none</c>.</summary>
    public const string RateInfusionUrineNone = "rate.infusion.urine.none";

    /// <summary>Phrase <c>rate.infusion.urine.may-fall</c>.</summary>
    public const string RateInfusionUrineMayFall = "rate.infusion.urine.may-fall";

    /// <summary>Phrase <c>rate.infusion.urine.may-fall.why</c>.</summary>
    public const string RateInfusionUrineMayFallWhy = "rate.infusion.urine.may-fall.why";

    /// <summary>Phrase <c>rate.infusion.urine.holds</c>.</summary>
    public const string RateInfusionUrineHolds = "rate.infusion.urine.holds";

    /// <summary>Phrase <c>rate.infusion.step.water</c>.</summary>
    public const string RateInfusionStepWater = "rate.infusion.step.water";

    /// <summary>Phrase <c>rate.infusion.step.unread</c>.</summary>
    public const string RateInfusionStepUnread = "rate.infusion.step.unread";

    /// <summary>Phrase <c>rate.infusion.step.order</c>.</summary>
    public const string RateInfusionStepOrder = "rate.infusion.step.order";

    /// <summary>Phrase <c>rate.infusion.route.not-stated</c>.</summary>
    public const string RateInfusionRouteNotStated = "rate.infusion.route.not-stated";

    /// <summary>Phrase <c>rate.infusion.volume</c>.</summary>
    public const string RateInfusionVolume = "rate.infusion.volume";

    /// <summary>Phrase <c>rate.infusion.volume.unusable</c>.</summary>
    public const string RateInfusionVolumeUnusable = "rate.infusion.volume.unusable";

    /// <summary>Phrase <c>rate.infusion.volume.none</c>.</summary>
    public const string RateInfusionVolumeNone = "rate.infusion.volume.none";

    /// <summary>Phrase <c>rate.infusion.prediction.no-serum</c>.</summary>
    public const string RateInfusionPredictionNoSerum = "rate.infusion.prediction.no-serum";

    /// <summary>Phrase <c>rate.infusion.prediction.example</c>.</summary>
    public const string RateInfusionPredictionExample = "rate.infusion.prediction.example";

    /// <summary>Phrase <c>rate.infusion.prediction.volume</c>.</summary>
    public const string RateInfusionPredictionVolume = "rate.infusion.prediction.volume";

    /// <summary>Phrase <c>rate.infusion.prediction.per-litre</c>.</summary>
    public const string RateInfusionPredictionPerLitre = "rate.infusion.prediction.per-litre";

    /// <summary>Phrase <c>rate.infusion.next.weight</c>.</summary>
    public const string RateInfusionNextWeight = "rate.infusion.next.weight";

    /// <summary>Phrase <c>rate.infusion.next.fit</c>.</summary>
    public const string RateInfusionNextFit = "rate.infusion.next.fit";

    /// <summary>Phrase <c>rate.infusion.next.recheck</c>.</summary>
    public const string RateInfusionNextRecheck = "rate.infusion.next.recheck";

    /// <summary>Phrase <c>rate.infusion.next.urine</c>.</summary>
    public const string RateInfusionNextUrine = "rate.infusion.next.urine";

    /// <summary>Phrase <c>rate.order.drug</c>.</summary>
    public const string RateOrderDrug = "rate.order.drug";

    /// <summary>Phrase <c>rate.order.latest</c>.</summary>
    public const string RateOrderLatest = "rate.order.latest";

    /// <summary>Phrase <c>rate.order.no-sodium</c>.</summary>
    public const string RateOrderNoSodium = "rate.order.no-sodium";

    /// <summary>Phrase <c>rate.vaptan.summary.advised-against</c>.</summary>
    public const string RateVaptanSummaryAdvisedAgainst = "rate.vaptan.summary.advised-against";

    /// <summary>Phrase <c>rate.vaptan.summary</c>.</summary>
    public const string RateVaptanSummary = "rate.vaptan.summary";

    /// <summary>Phrase <c>rate.vaptan.headline</c>.</summary>
    public const string RateVaptanHeadline = "rate.vaptan.headline";

    /// <summary>Phrase <c>rate.vaptan.rate</c>.</summary>
    public const string RateVaptanRate = "rate.vaptan.rate";

    /// <summary>Phrase <c>rate.vaptan.liver</c>.</summary>
    public const string RateVaptanLiver = "rate.vaptan.liver";

    /// <summary>Phrase <c>rate.vaptan.liver-disease</c>.</summary>
    public const string RateVaptanLiverDisease = "rate.vaptan.liver-disease";

    /// <summary>Phrase <c>rate.vaptan.liver-disease.untitled</c>.</summary>
    public const string RateVaptanLiverDiseaseUntitled = "rate.vaptan.liver-disease.untitled";

    /// <summary>Phrase <c>rate.vaptan.guideline.band</c>.</summary>
    public const string RateVaptanGuidelineBand = "rate.vaptan.guideline.band";

    /// <summary>Phrase <c>rate.vaptan.guideline</c>.</summary>
    public const string RateVaptanGuideline = "rate.vaptan.guideline";

    /// <summary>Phrase <c>rate.vaptan.next.whether</c>.</summary>
    public const string RateVaptanNextWhether = "rate.vaptan.next.whether";

    /// <summary>Phrase <c>rate.vaptan.next.if-given</c>.</summary>
    public const string RateVaptanNextIfGiven = "rate.vaptan.next.if-given";

    /// <summary>Phrase <c>rate.desmopressin.summary.relowering</c>.</summary>
    public const string RateDesmopressinSummaryRelowering = "rate.desmopressin.summary.relowering";

    /// <summary>Phrase <c>rate.desmopressin.summary</c>.</summary>
    public const string RateDesmopressinSummary = "rate.desmopressin.summary";

    /// <summary>Phrase <c>rate.desmopressin.headline</c>.</summary>
    public const string RateDesmopressinHeadline = "rate.desmopressin.headline";

    /// <summary>Phrase <c>rate.desmopressin.headline.relowering</c>.</summary>
    public const string RateDesmopressinHeadlineRelowering = "rate.desmopressin.headline.relowering";

    /// <summary>Phrase <c>rate.desmopressin.lowers</c>.</summary>
    public const string RateDesmopressinLowers = "rate.desmopressin.lowers";

    /// <summary>Phrase <c>rate.desmopressin.relowering</c>.</summary>
    public const string RateDesmopressinRelowering = "rate.desmopressin.relowering";

    /// <summary>Phrase <c>rate.desmopressin.next.check</c>.</summary>
    public const string RateDesmopressinNextCheck = "rate.desmopressin.next.check";

    /// <summary>Phrase <c>rate.desmopressin.next.senior</c>.</summary>
    public const string RateDesmopressinNextSenior = "rate.desmopressin.next.senior";

    /// <summary>Phrase <c>rate.how.name</c>.</summary>
    public const string RateHowName = "rate.how.name";

    /// <summary>Phrase <c>rate.how.rxnorm</c>.</summary>
    public const string RateHowRxnorm = "rate.how.rxnorm";

    /// <summary>Phrase <c>rate.how.strength</c>.</summary>
    public const string RateHowStrength = "rate.how.strength";

    /// <summary>Phrase <c>rate.how.concentration</c>.</summary>
    public const string RateHowConcentration = "rate.how.concentration";

    /// <summary>Phrase <c>rate.how.matched</c>.</summary>
    public const string RateHowMatched = "rate.how.matched";
}
