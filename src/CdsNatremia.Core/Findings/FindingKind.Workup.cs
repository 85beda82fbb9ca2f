namespace CdsNatremia.Core.Findings;

/// <summary>Finding kinds of the work-up (phrases in Phrases/work-up.resx); generated from the phrase list, one constant per phrase.</summary>
public static partial class FindingKind
{
    /// <summary>Phrase <c>severity.finding</c>.</summary>
    public const string SeverityFinding = "severity.finding";

    /// <summary>Phrase <c>severity.step</c>.</summary>
    public const string SeverityStep = "severity.step";

    /// <summary>Phrase <c>severity.stale.step</c>.</summary>
    public const string SeverityStaleStep = "severity.stale.step";

    /// <summary>Phrase <c>severity.stale.caution</c>.</summary>
    public const string SeverityStaleCaution = "severity.stale.caution";

    /// <summary>Phrase <c>severity.stale.action</c>.</summary>
    public const string SeverityStaleAction = "severity.stale.action";

    /// <summary>Phrase <c>severity.stale.order</c>.</summary>
    public const string SeverityStaleOrder = "severity.stale.order";

    /// <summary>Phrase <c>severity.preliminary.step</c>.</summary>
    public const string SeverityPreliminaryStep = "severity.preliminary.step";

    /// <summary>Phrase <c>severity.whole-blood.step</c>.</summary>
    public const string SeverityWholeBloodStep = "severity.whole-blood.step";

    /// <summary>Phrase <c>severity.newer-unused.step</c>.</summary>
    public const string SeverityNewerUnusedStep = "severity.newer-unused.step";

    /// <summary>Phrase <c>severity.newer-unused.finding</c>.</summary>
    public const string SeverityNewerUnusedFinding = "severity.newer-unused.finding";

    /// <summary>Phrase <c>severity.newer-unused.order</c>.</summary>
    public const string SeverityNewerUnusedOrder = "severity.newer-unused.order";

    /// <summary>Phrase <c>severity.newer-unused.action</c>.</summary>
    public const string SeverityNewerUnusedAction = "severity.newer-unused.action";

    /// <summary>Phrase <c>severity.profound.next</c>.</summary>
    public const string SeverityProfoundNext = "severity.profound.next";

    /// <summary>Phrase <c>severity.profound.action</c>.</summary>
    public const string SeverityProfoundAction = "severity.profound.action";

    /// <summary>Phrase <c>severity.moderate.next</c>.</summary>
    public const string SeverityModerateNext = "severity.moderate.next";

    /// <summary>Phrase <c>severity.moderate.action</c>.</summary>
    public const string SeverityModerateAction = "severity.moderate.action";

    /// <summary>Phrase <c>severity.mild.next</c>.</summary>
    public const string SeverityMildNext = "severity.mild.next";

    /// <summary>Phrase <c>severity.mild.action</c>.</summary>
    public const string SeverityMildAction = "severity.mild.action";

    /// <summary>Phrase <c>paediatric.step</c>.</summary>
    public const string PaediatricStep = "paediatric.step";

    /// <summary>Phrase <c>paediatric.next</c>.</summary>
    public const string PaediatricNext = "paediatric.next";

    /// <summary>Phrase <c>paediatric.action</c>.</summary>
    public const string PaediatricAction = "paediatric.action";

    /// <summary>Phrase <c>cortisol.basis.laboratory</c>.</summary>
    public const string CortisolBasisLaboratory = "cortisol.basis.laboratory";

    /// <summary>Phrase <c>cortisol.basis.default</c>.</summary>
    public const string CortisolBasisDefault = "cortisol.basis.default";

    /// <summary>Phrase <c>cortisol.finding</c>.</summary>
    public const string CortisolFinding = "cortisol.finding";

    /// <summary>Phrase <c>cortisol.step</c>.</summary>
    public const string CortisolStep = "cortisol.step";

    /// <summary>Phrase <c>cortisol.cause</c>.</summary>
    public const string CortisolCause = "cortisol.cause";

    /// <summary>Phrase <c>cortisol.next</c>.</summary>
    public const string CortisolNext = "cortisol.next";

    /// <summary>Phrase <c>cortisol.next.replacement</c>.</summary>
    public const string CortisolNextReplacement = "cortisol.next.replacement";

    /// <summary>Phrase <c>cortisol.action</c>.</summary>
    public const string CortisolAction = "cortisol.action";

    /// <summary>Phrase <c>missing.serum-osmolality</c>.</summary>
    public const string MissingSerumOsmolality = "missing.serum-osmolality";

    /// <summary>Phrase <c>missing.glucose</c>.</summary>
    public const string MissingGlucose = "missing.glucose";

    /// <summary>Phrase <c>missing.urine-osmolality</c>.</summary>
    public const string MissingUrineOsmolality = "missing.urine-osmolality";

    /// <summary>Phrase <c>missing.urine-sodium</c>.</summary>
    public const string MissingUrineSodium = "missing.urine-sodium";

    /// <summary>Phrase <c>missing.tsh</c>.</summary>
    public const string MissingTsh = "missing.tsh";

    /// <summary>Phrase <c>missing.cortisol</c>.</summary>
    public const string MissingCortisol = "missing.cortisol";

    /// <summary>Phrase <c>missing.triglyceride</c>.</summary>
    public const string MissingTriglyceride = "missing.triglyceride";

    /// <summary>Phrase <c>missing.total-protein</c>.</summary>
    public const string MissingTotalProtein = "missing.total-protein";

    /// <summary>Phrase <c>missing.serum-osmolality.order</c>.</summary>
    public const string MissingSerumOsmolalityOrder = "missing.serum-osmolality.order";

    /// <summary>Phrase <c>missing.glucose.order</c>.</summary>
    public const string MissingGlucoseOrder = "missing.glucose.order";

    /// <summary>Phrase <c>missing.urine-osmolality.order</c>.</summary>
    public const string MissingUrineOsmolalityOrder = "missing.urine-osmolality.order";

    /// <summary>Phrase <c>missing.urine-sodium.order</c>.</summary>
    public const string MissingUrineSodiumOrder = "missing.urine-sodium.order";

    /// <summary>Phrase <c>missing.tsh.order</c>.</summary>
    public const string MissingTshOrder = "missing.tsh.order";

    /// <summary>Phrase <c>missing.cortisol.order</c>.</summary>
    public const string MissingCortisolOrder = "missing.cortisol.order";

    /// <summary>Phrase <c>missing.triglyceride.order</c>.</summary>
    public const string MissingTriglycerideOrder = "missing.triglyceride.order";

    /// <summary>Phrase <c>missing.total-protein.order</c>.</summary>
    public const string MissingTotalProteinOrder = "missing.total-protein.order";

    /// <summary>Phrase <c>missing.next</c>.</summary>
    public const string MissingNext = "missing.next";

    /// <summary>Phrase <c>missing.next.labs-unreadable</c>.</summary>
    public const string MissingNextLabsUnreadable = "missing.next.labs-unreadable";

    /// <summary>Phrase <c>missing.finding</c>.</summary>
    public const string MissingFinding = "missing.finding";

    /// <summary>Phrase <c>volume.clue.condition</c>.</summary>
    public const string VolumeClueCondition = "volume.clue.condition";

    /// <summary>Phrase <c>volume.clue.condition-text</c>.</summary>
    public const string VolumeClueConditionText = "volume.clue.condition-text";

    /// <summary>Phrase <c>volume.clue.diuretic</c>.</summary>
    public const string VolumeClueDiuretic = "volume.clue.diuretic";

    /// <summary>Phrase <c>volume.clue.diuretic-stopped</c>.</summary>
    public const string VolumeClueDiureticStopped = "volume.clue.diuretic-stopped";

    /// <summary>Phrase <c>volume.clue.diuretic-unknown</c>.</summary>
    public const string VolumeClueDiureticUnknown = "volume.clue.diuretic-unknown";

    /// <summary>Phrase <c>volume.gap.conditions</c>.</summary>
    public const string VolumeGapConditions = "volume.gap.conditions";

    /// <summary>Phrase <c>volume.gap.medications</c>.</summary>
    public const string VolumeGapMedications = "volume.gap.medications";

    /// <summary>Phrase <c>volume.gap.both</c>.</summary>
    public const string VolumeGapBoth = "volume.gap.both";

    /// <summary>Phrase <c>volume.step</c>.</summary>
    public const string VolumeStep = "volume.step";

    /// <summary>Phrase <c>volume.step.none</c>.</summary>
    public const string VolumeStepNone = "volume.step.none";

    /// <summary>Phrase <c>volume.cause.low</c>.</summary>
    public const string VolumeCauseLow = "volume.cause.low";

    /// <summary>Phrase <c>volume.cause.normal</c>.</summary>
    public const string VolumeCauseNormal = "volume.cause.normal";

    /// <summary>Phrase <c>volume.cause.high</c>.</summary>
    public const string VolumeCauseHigh = "volume.cause.high";

    /// <summary>Phrase <c>volume.next</c>.</summary>
    public const string VolumeNext = "volume.next";

    /// <summary>Phrase <c>volume.meaning.heart-failure</c>.</summary>
    public const string VolumeMeaningHeartFailure = "volume.meaning.heart-failure";

    /// <summary>Phrase <c>volume.meaning.cirrhosis</c>.</summary>
    public const string VolumeMeaningCirrhosis = "volume.meaning.cirrhosis";

    /// <summary>Phrase <c>volume.meaning.nephrotic-syndrome</c>.</summary>
    public const string VolumeMeaningNephroticSyndrome = "volume.meaning.nephrotic-syndrome";

    /// <summary>Phrase <c>volume.meaning.chronic-kidney-disease</c>.</summary>
    public const string VolumeMeaningChronicKidneyDisease = "volume.meaning.chronic-kidney-disease";

    /// <summary>Phrase <c>volume.meaning.vomiting</c>.</summary>
    public const string VolumeMeaningVomiting = "volume.meaning.vomiting";

    /// <summary>Phrase <c>volume.meaning.diarrhoea</c>.</summary>
    public const string VolumeMeaningDiarrhoea = "volume.meaning.diarrhoea";

    /// <summary>Phrase <c>volume.meaning.adrenal-insufficiency</c>.</summary>
    public const string VolumeMeaningAdrenalInsufficiency = "volume.meaning.adrenal-insufficiency";

    /// <summary>Phrase <c>volume.meaning.hypothyroidism</c>.</summary>
    public const string VolumeMeaningHypothyroidism = "volume.meaning.hypothyroidism";

    /// <summary>Phrase <c>volume.meaning.pneumonia</c>.</summary>
    public const string VolumeMeaningPneumonia = "volume.meaning.pneumonia";

    /// <summary>Phrase <c>volume.meaning.intracranial-disorder</c>.</summary>
    public const string VolumeMeaningIntracranialDisorder = "volume.meaning.intracranial-disorder";

    /// <summary>Phrase <c>volume.meaning.small-cell-lung-cancer</c>.</summary>
    public const string VolumeMeaningSmallCellLungCancer = "volume.meaning.small-cell-lung-cancer";

    /// <summary>Phrase <c>volume.meaning.alcohol-use-disorder</c>.</summary>
    public const string VolumeMeaningAlcoholUseDisorder = "volume.meaning.alcohol-use-disorder";

    /// <summary>Phrase <c>volume.meaning.malnutrition</c>.</summary>
    public const string VolumeMeaningMalnutrition = "volume.meaning.malnutrition";

    /// <summary>Phrase <c>onset.acute.step</c>.</summary>
    public const string OnsetAcuteStep = "onset.acute.step";

    /// <summary>Phrase <c>onset.acute.finding</c>.</summary>
    public const string OnsetAcuteFinding = "onset.acute.finding";

    /// <summary>Phrase <c>onset.acute.next</c>.</summary>
    public const string OnsetAcuteNext = "onset.acute.next";

    /// <summary>Phrase <c>onset.acute.caution</c>.</summary>
    public const string OnsetAcuteCaution = "onset.acute.caution";

    /// <summary>Phrase <c>onset.acute.action</c>.</summary>
    public const string OnsetAcuteAction = "onset.acute.action";

    /// <summary>Phrase <c>onset.chronic.no-normal</c>.</summary>
    public const string OnsetChronicNoNormal = "onset.chronic.no-normal";

    /// <summary>Phrase <c>onset.chronic.too-old-now</c>.</summary>
    public const string OnsetChronicTooOldNow = "onset.chronic.too-old-now";

    /// <summary>Phrase <c>onset.chronic.not-within</c>.</summary>
    public const string OnsetChronicNotWithin = "onset.chronic.not-within";

    /// <summary>Phrase <c>onset.chronic.step</c>.</summary>
    public const string OnsetChronicStep = "onset.chronic.step";

    /// <summary>Phrase <c>diuretic.describe</c>.</summary>
    public const string DiureticDescribe = "diuretic.describe";

    /// <summary>Phrase <c>diuretic.describe.intended</c>.</summary>
    public const string DiureticDescribeIntended = "diuretic.describe.intended";

    /// <summary>Phrase <c>diuretic.describe.stopped</c>.</summary>
    public const string DiureticDescribeStopped = "diuretic.describe.stopped";

    /// <summary>Phrase <c>diuretic.since</c>.</summary>
    public const string DiureticSince = "diuretic.since";

    /// <summary>Phrase <c>diuretic.since.unknown</c>.</summary>
    public const string DiureticSinceUnknown = "diuretic.since.unknown";

    /// <summary>Phrase <c>urine.cite</c>.</summary>
    public const string UrineCite = "urine.cite";

    /// <summary>Phrase <c>urine.cite.labelled</c>.</summary>
    public const string UrineCiteLabelled = "urine.cite.labelled";

    /// <summary>Phrase <c>urine.label.apart</c>.</summary>
    public const string UrineLabelApart = "urine.label.apart";

    /// <summary>Phrase <c>urine.label.diuretic</c>.</summary>
    public const string UrineLabelDiuretic = "urine.label.diuretic";

    /// <summary>Phrase <c>urine.offset.same</c>.</summary>
    public const string UrineOffsetSame = "urine.offset.same";

    /// <summary>Phrase <c>urine.offset.after</c>.</summary>
    public const string UrineOffsetAfter = "urine.offset.after";

    /// <summary>Phrase <c>urine.offset.before</c>.</summary>
    public const string UrineOffsetBefore = "urine.offset.before";

    /// <summary>Phrase <c>urine.osmolality.dilute.step</c>.</summary>
    public const string UrineOsmolalityDiluteStep = "urine.osmolality.dilute.step";

    /// <summary>Phrase <c>urine.osmolality.dilute.sodium-note</c>.</summary>
    public const string UrineOsmolalityDiluteSodiumNote = "urine.osmolality.dilute.sodium-note";

    /// <summary>Phrase <c>urine.osmolality.dilute.finding</c>.</summary>
    public const string UrineOsmolalityDiluteFinding = "urine.osmolality.dilute.finding";

    /// <summary>Phrase <c>urine.osmolality.dilute.cause</c>.</summary>
    public const string UrineOsmolalityDiluteCause = "urine.osmolality.dilute.cause";

    /// <summary>Phrase <c>urine.osmolality.dilute.next</c>.</summary>
    public const string UrineOsmolalityDiluteNext = "urine.osmolality.dilute.next";

    /// <summary>Phrase <c>urine.osmolality.concentrated.step</c>.</summary>
    public const string UrineOsmolalityConcentratedStep = "urine.osmolality.concentrated.step";

    /// <summary>Phrase <c>urine.osmolality.missing.step</c>.</summary>
    public const string UrineOsmolalityMissingStep = "urine.osmolality.missing.step";

    /// <summary>Phrase <c>urine.sodium.missing.step</c>.</summary>
    public const string UrineSodiumMissingStep = "urine.sodium.missing.step";

    /// <summary>Phrase <c>urine.sodium.low.step</c>.</summary>
    public const string UrineSodiumLowStep = "urine.sodium.low.step";

    /// <summary>Phrase <c>urine.sodium.low.diuretic-note</c>.</summary>
    public const string UrineSodiumLowDiureticNote = "urine.sodium.low.diuretic-note";

    /// <summary>Phrase <c>urine.sodium.low.finding</c>.</summary>
    public const string UrineSodiumLowFinding = "urine.sodium.low.finding";

    /// <summary>Phrase <c>urine.sodium.low.cause</c>.</summary>
    public const string UrineSodiumLowCause = "urine.sodium.low.cause";

    /// <summary>Phrase <c>urine.sodium.high.step</c>.</summary>
    public const string UrineSodiumHighStep = "urine.sodium.high.step";

    /// <summary>Phrase <c>urine.sodium.high.diuretic-note</c>.</summary>
    public const string UrineSodiumHighDiureticNote = "urine.sodium.high.diuretic-note";

    /// <summary>Phrase <c>urine.sodium.high.finding</c>.</summary>
    public const string UrineSodiumHighFinding = "urine.sodium.high.finding";

    /// <summary>Phrase <c>urine.sodium.high.finding.diuretic</c>.</summary>
    public const string UrineSodiumHighFindingDiuretic = "urine.sodium.high.finding.diuretic";

    /// <summary>Phrase <c>urine.sodium.high.cause</c>.</summary>
    public const string UrineSodiumHighCause = "urine.sodium.high.cause";

    /// <summary>Phrase <c>urine.not-usable.absent</c>.</summary>
    public const string UrineNotUsableAbsent = "urine.not-usable.absent";

    /// <summary>Phrase <c>urine.not-usable.bound</c>.</summary>
    public const string UrineNotUsableBound = "urine.not-usable.bound";

    /// <summary>Phrase <c>urine.not-usable.unread</c>.</summary>
    public const string UrineNotUsableUnread = "urine.not-usable.unread";

    /// <summary>Phrase <c>siadh.name.effective</c>.</summary>
    public const string SiadhNameEffective = "siadh.name.effective";

    /// <summary>Phrase <c>siadh.name.urine-osmolality</c>.</summary>
    public const string SiadhNameUrineOsmolality = "siadh.name.urine-osmolality";

    /// <summary>Phrase <c>siadh.name.urine-sodium</c>.</summary>
    public const string SiadhNameUrineSodium = "siadh.name.urine-sodium";

    /// <summary>Phrase <c>siadh.name.euvolaemia</c>.</summary>
    public const string SiadhNameEuvolaemia = "siadh.name.euvolaemia";

    /// <summary>Phrase <c>siadh.name.thyroid</c>.</summary>
    public const string SiadhNameThyroid = "siadh.name.thyroid";

    /// <summary>Phrase <c>siadh.name.adrenal</c>.</summary>
    public const string SiadhNameAdrenal = "siadh.name.adrenal";

    /// <summary>Phrase <c>siadh.name.diuretics</c>.</summary>
    public const string SiadhNameDiuretics = "siadh.name.diuretics";

    /// <summary>Phrase <c>siadh.status.met</c>.</summary>
    public const string SiadhStatusMet = "siadh.status.met";

    /// <summary>Phrase <c>siadh.status.not-met</c>.</summary>
    public const string SiadhStatusNotMet = "siadh.status.not-met";

    /// <summary>Phrase <c>siadh.status.unknown</c>.</summary>
    public const string SiadhStatusUnknown = "siadh.status.unknown";

    /// <summary>Phrase <c>siadh.status.could-not-be-read</c>.</summary>
    public const string SiadhStatusCouldNotBeRead = "siadh.status.could-not-be-read";

    /// <summary>Phrase <c>siadh.status.clinician</c>.</summary>
    public const string SiadhStatusClinician = "siadh.status.clinician";

    /// <summary>Phrase <c>siadh.data.effective.measured</c>.</summary>
    public const string SiadhDataEffectiveMeasured = "siadh.data.effective.measured";

    /// <summary>Phrase <c>siadh.data.effective.calculated</c>.</summary>
    public const string SiadhDataEffectiveCalculated = "siadh.data.effective.calculated";

    /// <summary>Phrase <c>siadh.data.no-serum-osmolality</c>.</summary>
    public const string SiadhDataNoSerumOsmolality = "siadh.data.no-serum-osmolality";

    /// <summary>Phrase <c>siadh.data.result</c>.</summary>
    public const string SiadhDataResult = "siadh.data.result";

    /// <summary>Phrase <c>siadh.data.euvolaemia</c>.</summary>
    public const string SiadhDataEuvolaemia = "siadh.data.euvolaemia";

    /// <summary>Phrase <c>siadh.data.no-tsh</c>.</summary>
    public const string SiadhDataNoTsh = "siadh.data.no-tsh";

    /// <summary>Phrase <c>siadh.data.tsh</c>.</summary>
    public const string SiadhDataTsh = "siadh.data.tsh";

    /// <summary>Phrase <c>siadh.data.tsh.default</c>.</summary>
    public const string SiadhDataTshDefault = "siadh.data.tsh.default";

    /// <summary>Phrase <c>siadh.data.no-cortisol</c>.</summary>
    public const string SiadhDataNoCortisol = "siadh.data.no-cortisol";

    /// <summary>Phrase <c>siadh.data.cortisol</c>.</summary>
    public const string SiadhDataCortisol = "siadh.data.cortisol";

    /// <summary>Phrase <c>siadh.data.cortisol.default</c>.</summary>
    public const string SiadhDataCortisolDefault = "siadh.data.cortisol.default";

    /// <summary>Phrase <c>siadh.data.cortisol.caveat</c>.</summary>
    public const string SiadhDataCortisolCaveat = "siadh.data.cortisol.caveat";

    /// <summary>Phrase <c>siadh.data.diuretics-looked</c>.</summary>
    public const string SiadhDataDiureticsLooked = "siadh.data.diuretics-looked";

    /// <summary>Phrase <c>siadh.data.diuretics-found</c>.</summary>
    public const string SiadhDataDiureticsFound = "siadh.data.diuretics-found";

    /// <summary>Phrase <c>siadh.data.bound</c>.</summary>
    public const string SiadhDataBound = "siadh.data.bound";

    /// <summary>Phrase <c>siadh.data.bound.undecided</c>.</summary>
    public const string SiadhDataBoundUndecided = "siadh.data.bound.undecided";

    /// <summary>Phrase <c>siadh.data.bound.not-measured</c>.</summary>
    public const string SiadhDataBoundNotMeasured = "siadh.data.bound.not-measured";

    /// <summary>Phrase <c>siadh.data.unread</c>.</summary>
    public const string SiadhDataUnread = "siadh.data.unread";

    /// <summary>Phrase <c>siadh.data.unread.named</c>.</summary>
    public const string SiadhDataUnreadNamed = "siadh.data.unread.named";

    /// <summary>Phrase <c>siadh.data.no-urine-osmolality</c>.</summary>
    public const string SiadhDataNoUrineOsmolality = "siadh.data.no-urine-osmolality";

    /// <summary>Phrase <c>siadh.data.no-urine-sodium</c>.</summary>
    public const string SiadhDataNoUrineSodium = "siadh.data.no-urine-sodium";

    /// <summary>Phrase <c>siadh.line</c>.</summary>
    public const string SiadhLine = "siadh.line";

    /// <summary>Phrase <c>siadh.verdict.not-met</c>.</summary>
    public const string SiadhVerdictNotMet = "siadh.verdict.not-met";

    /// <summary>Phrase <c>siadh.verdict.unknown</c>.</summary>
    public const string SiadhVerdictUnknown = "siadh.verdict.unknown";

    /// <summary>Phrase <c>siadh.verdict.consistent</c>.</summary>
    public const string SiadhVerdictConsistent = "siadh.verdict.consistent";

    /// <summary>Phrase <c>siadh.step</c>.</summary>
    public const string SiadhStep = "siadh.step";

    /// <summary>Phrase <c>siadh.finding</c>.</summary>
    public const string SiadhFinding = "siadh.finding";

    /// <summary>Phrase <c>siadh.next</c>.</summary>
    public const string SiadhNext = "siadh.next";

    /// <summary>Phrase <c>furst.computation</c>.</summary>
    public const string FurstComputation = "furst.computation";

    /// <summary>Phrase <c>furst.computation.no-potassium</c>.</summary>
    public const string FurstComputationNoPotassium = "furst.computation.no-potassium";

    /// <summary>Phrase <c>furst.meaning.unlikely</c>.</summary>
    public const string FurstMeaningUnlikely = "furst.meaning.unlikely";

    /// <summary>Phrase <c>furst.meaning.stricter</c>.</summary>
    public const string FurstMeaningStricter = "furst.meaning.stricter";

    /// <summary>Phrase <c>furst.meaning.usual</c>.</summary>
    public const string FurstMeaningUsual = "furst.meaning.usual";

    /// <summary>Phrase <c>furst.restriction</c>.</summary>
    public const string FurstRestriction = "furst.restriction";

    /// <summary>Phrase <c>furst.restriction.unknown</c>.</summary>
    public const string FurstRestrictionUnknown = "furst.restriction.unknown";

    /// <summary>Phrase <c>furst.step.incomplete</c>.</summary>
    public const string FurstStepIncomplete = "furst.step.incomplete";

    /// <summary>Phrase <c>furst.step</c>.</summary>
    public const string FurstStep = "furst.step";

    /// <summary>Phrase <c>furst.finding</c>.</summary>
    public const string FurstFinding = "furst.finding";

    /// <summary>Phrase <c>furst.next</c>.</summary>
    public const string FurstNext = "furst.next";

    /// <summary>Phrase <c>hypertonic.glucose.steep</c>.</summary>
    public const string HypertonicGlucoseSteep = "hypertonic.glucose.steep";

    /// <summary>Phrase <c>hypertonic.glucose.step</c>.</summary>
    public const string HypertonicGlucoseStep = "hypertonic.glucose.step";

    /// <summary>Phrase <c>hypertonic.glucose.finding</c>.</summary>
    public const string HypertonicGlucoseFinding = "hypertonic.glucose.finding";

    /// <summary>Phrase <c>hypertonic.glucose.evidence</c>.</summary>
    public const string HypertonicGlucoseEvidence = "hypertonic.glucose.evidence";

    /// <summary>Phrase <c>hypertonic.glucose.not-hypotonic</c>.</summary>
    public const string HypertonicGlucoseNotHypotonic = "hypertonic.glucose.not-hypotonic";

    /// <summary>Phrase <c>hypertonic.glucose.next</c>.</summary>
    public const string HypertonicGlucoseNext = "hypertonic.glucose.next";

    /// <summary>Phrase <c>hypertonic.glucose.cause</c>.</summary>
    public const string HypertonicGlucoseCause = "hypertonic.glucose.cause";

    /// <summary>Phrase <c>hypertonic.glucose.action</c>.</summary>
    public const string HypertonicGlucoseAction = "hypertonic.glucose.action";

    /// <summary>Phrase <c>hypertonic.glucose.partial.next</c>.</summary>
    public const string HypertonicGlucosePartialNext = "hypertonic.glucose.partial.next";

    /// <summary>Phrase <c>pseudo.check.high</c>.</summary>
    public const string PseudoCheckHigh = "pseudo.check.high";

    /// <summary>Phrase <c>pseudo.check.not-high</c>.</summary>
    public const string PseudoCheckNotHigh = "pseudo.check.not-high";

    /// <summary>Phrase <c>pseudo.check.triglyceride-note</c>.</summary>
    public const string PseudoCheckTriglycerideNote = "pseudo.check.triglyceride-note";

    /// <summary>Phrase <c>pseudo.check.no-triglyceride</c>.</summary>
    public const string PseudoCheckNoTriglyceride = "pseudo.check.no-triglyceride";

    /// <summary>Phrase <c>pseudo.check.no-protein</c>.</summary>
    public const string PseudoCheckNoProtein = "pseudo.check.no-protein";

    /// <summary>Phrase <c>pseudo.clue.triglyceride</c>.</summary>
    public const string PseudoClueTriglyceride = "pseudo.clue.triglyceride";

    /// <summary>Phrase <c>pseudo.clue.protein</c>.</summary>
    public const string PseudoClueProtein = "pseudo.clue.protein";

    /// <summary>Phrase <c>pseudo.with</c>.</summary>
    public const string PseudoWith = "pseudo.with";

    /// <summary>Phrase <c>pseudo.step</c>.</summary>
    public const string PseudoStep = "pseudo.step";

    /// <summary>Phrase <c>pseudo.finding</c>.</summary>
    public const string PseudoFinding = "pseudo.finding";

    /// <summary>Phrase <c>pseudo.cause.artefact</c>.</summary>
    public const string PseudoCauseArtefact = "pseudo.cause.artefact";

    /// <summary>Phrase <c>pseudo.cause.isotonic</c>.</summary>
    public const string PseudoCauseIsotonic = "pseudo.cause.isotonic";

    /// <summary>Phrase <c>pseudo.direct.normal.step</c>.</summary>
    public const string PseudoDirectNormalStep = "pseudo.direct.normal.step";

    /// <summary>Phrase <c>pseudo.direct.low.step</c>.</summary>
    public const string PseudoDirectLowStep = "pseudo.direct.low.step";

    /// <summary>Phrase <c>pseudo.direct.low.action</c>.</summary>
    public const string PseudoDirectLowAction = "pseudo.direct.low.action";

    /// <summary>Phrase <c>pseudo.direct.order</c>.</summary>
    public const string PseudoDirectOrder = "pseudo.direct.order";

    /// <summary>Phrase <c>pseudo.next</c>.</summary>
    public const string PseudoNext = "pseudo.next";

    /// <summary>Phrase <c>pseudo.action</c>.</summary>
    public const string PseudoAction = "pseudo.action";

    /// <summary>Phrase <c>osmole.glucose.missing</c>.</summary>
    public const string OsmoleGlucoseMissing = "osmole.glucose.missing";

    /// <summary>Phrase <c>osmole.glucose.not-high</c>.</summary>
    public const string OsmoleGlucoseNotHigh = "osmole.glucose.not-high";

    /// <summary>Phrase <c>osmole.agent</c>.</summary>
    public const string OsmoleAgent = "osmole.agent";

    /// <summary>Phrase <c>osmole.agent-text</c>.</summary>
    public const string OsmoleAgentText = "osmole.agent-text";

    /// <summary>Phrase <c>osmole.named.none</c>.</summary>
    public const string OsmoleNamedNone = "osmole.named.none";

    /// <summary>Phrase <c>osmole.named</c>.</summary>
    public const string OsmoleNamed = "osmole.named";

    /// <summary>Phrase <c>osmole.osmolality.measured</c>.</summary>
    public const string OsmoleOsmolalityMeasured = "osmole.osmolality.measured";

    /// <summary>Phrase <c>osmole.osmolality.calculated</c>.</summary>
    public const string OsmoleOsmolalityCalculated = "osmole.osmolality.calculated";

    /// <summary>Phrase <c>osmole.osmolality.gap</c>.</summary>
    public const string OsmoleOsmolalityGap = "osmole.osmolality.gap";

    /// <summary>Phrase <c>osmole.step</c>.</summary>
    public const string OsmoleStep = "osmole.step";

    /// <summary>Phrase <c>osmole.finding.unnamed</c>.</summary>
    public const string OsmoleFindingUnnamed = "osmole.finding.unnamed";

    /// <summary>Phrase <c>osmole.finding.named</c>.</summary>
    public const string OsmoleFindingNamed = "osmole.finding.named";

    /// <summary>Phrase <c>osmole.cause</c>.</summary>
    public const string OsmoleCause = "osmole.cause";

    /// <summary>Phrase <c>osmole.next</c>.</summary>
    public const string OsmoleNext = "osmole.next";

    /// <summary>Phrase <c>osmole.action.unnamed</c>.</summary>
    public const string OsmoleActionUnnamed = "osmole.action.unnamed";

    /// <summary>Phrase <c>osmole.action.named</c>.</summary>
    public const string OsmoleActionNamed = "osmole.action.named";

    /// <summary>Phrase <c>osmole.action.isotonic</c>.</summary>
    public const string OsmoleActionIsotonic = "osmole.action.isotonic";

    /// <summary>Phrase <c>osmole.unknown.step</c>.</summary>
    public const string OsmoleUnknownStep = "osmole.unknown.step";

    /// <summary>Phrase <c>osmole.unknown.finding</c>.</summary>
    public const string OsmoleUnknownFinding = "osmole.unknown.finding";

    /// <summary>Phrase <c>osmole.unknown.action</c>.</summary>
    public const string OsmoleUnknownAction = "osmole.unknown.action";

    /// <summary>Phrase <c>tonicity.band.hypotonic</c>.</summary>
    public const string TonicityBandHypotonic = "tonicity.band.hypotonic";

    /// <summary>Phrase <c>tonicity.band.isotonic</c>.</summary>
    public const string TonicityBandIsotonic = "tonicity.band.isotonic";

    /// <summary>Phrase <c>tonicity.band.hypertonic</c>.</summary>
    public const string TonicityBandHypertonic = "tonicity.band.hypertonic";

    /// <summary>Phrase <c>tonicity.band.unknown</c>.</summary>
    public const string TonicityBandUnknown = "tonicity.band.unknown";

    /// <summary>Phrase <c>tonicity.edges</c>.</summary>
    public const string TonicityEdges = "tonicity.edges";

    /// <summary>Phrase <c>tonicity.measured.step</c>.</summary>
    public const string TonicityMeasuredStep = "tonicity.measured.step";

    /// <summary>Phrase <c>tonicity.measured.finding</c>.</summary>
    public const string TonicityMeasuredFinding = "tonicity.measured.finding";

    /// <summary>Phrase <c>tonicity.effective-short</c>.</summary>
    public const string TonicityEffectiveShort = "tonicity.effective-short";

    /// <summary>Phrase <c>tonicity.effective.no-urea</c>.</summary>
    public const string TonicityEffectiveNoUrea = "tonicity.effective.no-urea";

    /// <summary>Phrase <c>tonicity.effective</c>.</summary>
    public const string TonicityEffective = "tonicity.effective";

    /// <summary>Phrase <c>tonicity.calculated.step</c>.</summary>
    public const string TonicityCalculatedStep = "tonicity.calculated.step";

    /// <summary>Phrase <c>tonicity.calculated.finding</c>.</summary>
    public const string TonicityCalculatedFinding = "tonicity.calculated.finding";

    /// <summary>Phrase <c>tonicity.unknown.step</c>.</summary>
    public const string TonicityUnknownStep = "tonicity.unknown.step";

    /// <summary>Phrase <c>tonicity.unknown.finding</c>.</summary>
    public const string TonicityUnknownFinding = "tonicity.unknown.finding";

    /// <summary>Phrase <c>tonicity.no-urea.step</c>.</summary>
    public const string TonicityNoUreaStep = "tonicity.no-urea.step";

    /// <summary>Phrase <c>tonicity.gap.raised</c>.</summary>
    public const string TonicityGapRaised = "tonicity.gap.raised";

    /// <summary>Phrase <c>tonicity.gap.normal</c>.</summary>
    public const string TonicityGapNormal = "tonicity.gap.normal";

    /// <summary>Phrase <c>tonicity.gap.step</c>.</summary>
    public const string TonicityGapStep = "tonicity.gap.step";

    /// <summary>Phrase <c>tonicity.gap.finding</c>.</summary>
    public const string TonicityGapFinding = "tonicity.gap.finding";

    /// <summary>Phrase <c>tonicity.calc.effective-only</c>.</summary>
    public const string TonicityCalcEffectiveOnly = "tonicity.calc.effective-only";

    /// <summary>Phrase <c>tonicity.calc.us</c>.</summary>
    public const string TonicityCalcUs = "tonicity.calc.us";

    /// <summary>Phrase <c>tonicity.calc.si</c>.</summary>
    public const string TonicityCalcSi = "tonicity.calc.si";

    /// <summary>Phrase <c>bounded.value</c>.</summary>
    public const string BoundedValue = "bounded.value";

    /// <summary>Phrase <c>bounded.cite</c>.</summary>
    public const string BoundedCite = "bounded.cite";

    /// <summary>Phrase <c>bounded.finding</c>.</summary>
    public const string BoundedFinding = "bounded.finding";

    /// <summary>Phrase <c>bounded.finding.at-least</c>.</summary>
    public const string BoundedFindingAtLeast = "bounded.finding.at-least";

    /// <summary>Phrase <c>bounded.step</c>.</summary>
    public const string BoundedStep = "bounded.step";

    /// <summary>Phrase <c>bounded.step.more-severe</c>.</summary>
    public const string BoundedStepMoreSevere = "bounded.step.more-severe";

    /// <summary>Phrase <c>bounded.summary</c>.</summary>
    public const string BoundedSummary = "bounded.summary";

    /// <summary>Phrase <c>bounded.summary.at-least</c>.</summary>
    public const string BoundedSummaryAtLeast = "bounded.summary.at-least";

    /// <summary>Phrase <c>bounded.headline</c>.</summary>
    public const string BoundedHeadline = "bounded.headline";

    /// <summary>Phrase <c>bounded.headline.at-least</c>.</summary>
    public const string BoundedHeadlineAtLeast = "bounded.headline.at-least";

    /// <summary>Phrase <c>bounded.unplaced.finding</c>.</summary>
    public const string BoundedUnplacedFinding = "bounded.unplaced.finding";

    /// <summary>Phrase <c>bounded.unplaced.step</c>.</summary>
    public const string BoundedUnplacedStep = "bounded.unplaced.step";

    /// <summary>Phrase <c>bounded.unplaced.summary</c>.</summary>
    public const string BoundedUnplacedSummary = "bounded.unplaced.summary";

    /// <summary>Phrase <c>bounded.unplaced.headline</c>.</summary>
    public const string BoundedUnplacedHeadline = "bounded.unplaced.headline";

    /// <summary>Phrase <c>bounded.no-rate.step</c>.</summary>
    public const string BoundedNoRateStep = "bounded.no-rate.step";

    /// <summary>Phrase <c>bounded.older.step</c>.</summary>
    public const string BoundedOlderStep = "bounded.older.step";

    /// <summary>Phrase <c>bounded.next.measure</c>.</summary>
    public const string BoundedNextMeasure = "bounded.next.measure";

    /// <summary>Phrase <c>bounded.next.workup</c>.</summary>
    public const string BoundedNextWorkup = "bounded.next.workup";

    /// <summary>Phrase <c>bounded.order</c>.</summary>
    public const string BoundedOrder = "bounded.order";

    /// <summary>Phrase <c>unreadable.step</c>.</summary>
    public const string UnreadableStep = "unreadable.step";

    /// <summary>Phrase <c>unreadable.latest.step</c>.</summary>
    public const string UnreadableLatestStep = "unreadable.latest.step";

    /// <summary>Phrase <c>unreadable.earlier-low.step</c>.</summary>
    public const string UnreadableEarlierLowStep = "unreadable.earlier-low.step";

    /// <summary>Phrase <c>unreadable.finding</c>.</summary>
    public const string UnreadableFinding = "unreadable.finding";

    /// <summary>Phrase <c>unreadable.next</c>.</summary>
    public const string UnreadableNext = "unreadable.next";

    /// <summary>Phrase <c>unreadable.summary</c>.</summary>
    public const string UnreadableSummary = "unreadable.summary";

    /// <summary>Phrase <c>unreadable.headline</c>.</summary>
    public const string UnreadableHeadline = "unreadable.headline";

    /// <summary>Phrase <c>unreadable.order</c>.</summary>
    public const string UnreadableOrder = "unreadable.order";
}
