using System.ComponentModel.DataAnnotations;
using CdsNatremia.Core.Cards;
using CdsNatremia.Core.Engine;

namespace CdsNatremia.Core.Workup;

/// <summary>
/// Thresholds of the hyponatremia work-up rules (tonicity, glucose, onset, urine studies, SIADH checklist, missing tests).
/// Each default names its source with the reference sheet's status word. Bound from "Natremia:Rules:Workup".
/// </summary>
public sealed class WorkupOptions : IValidatableObject
{
    /// <summary>
    /// Effective serum osmolality below this is hypotonic, mOsm/kg. Default 275: "hypotonic serum: effective osmolality
    /// &lt; 275 mOsm/kg" (SIADH essential criteria as commonly listed after Schwartz–Bartter and Janicic &amp; Verbalis;
    /// the 2014 European guideline uses the same cut-off for measured osmolality; reference sheet, verified).
    /// </summary>
    [Range(250, 300)]
    public double HypotonicBelow { get; set; } = 275;

    /// <summary>
    /// Total (measured or calculated) serum osmolality above this is hypertonic, mOsm/kg. Default 295: the upper edge of
    /// the usual serum osmolality reference range of 275–295 mOsm/kg (common practice; laboratories differ). It applies to
    /// total osmolality because that is what the reference range describes; the hypotonic edge applies to effective osmolality.
    /// </summary>
    [Range(280, 340)]
    public double HypertonicAbove { get; set; } = 295;

    /// <summary>
    /// An osmolal gap (measured − calculated) above this is flagged, mOsm/kg. Default 10 (reference sheet, secondary).
    /// </summary>
    [Range(1, 50)]
    public double OsmolalGapAbove { get; set; } = 10;

    /// <summary>
    /// Glucose, urea, measured osmolality, triglyceride and total protein count with the sodium only when taken within this
    /// many hours of it, h. Default 12: values from about the same blood draw (common practice; an operator may narrow it).
    /// </summary>
    [Range(0.5, 72)]
    public double PairedWithinHours { get; set; } = 12;

    /// <summary>
    /// Glucose at or above this is "high" enough to explain raised tonicity and to show a glucose-corrected sodium, mmol/L.
    /// Default 11.1 (200 mg/dL), the usual hyperglycaemia cut-off (common practice).
    /// </summary>
    [Range(5.6, 50)]
    public double HighGlucoseFrom { get; set; } = 11.1;

    /// <summary>Which correction the summary uses (both are always shown). Default Hillier (reference sheet: verified).</summary>
    [EnumDataType(typeof(GlucoseCorrectionMethod))]
    public GlucoseCorrectionMethod GlucoseCorrection { get; set; } = GlucoseCorrectionMethod.Hillier;

    /// <summary>
    /// Triglyceride at or above this makes lipaemic pseudohyponatremia plausible, mmol/L. Default 11.3 (about 1000 mg/dL;
    /// from memory: the artefact is usually seen with triglycerides in the thousands of mg/dL).
    /// </summary>
    [Range(2, 100)]
    public double HighTriglycerideFrom { get; set; } = 11.3;

    /// <summary>
    /// Total protein at or above this makes protein-related pseudohyponatremia plausible, g/L. Default 100 (10 g/dL;
    /// from memory: paraproteinaemia, intravenous immunoglobulin).
    /// </summary>
    [Range(70, 200)]
    public double HighTotalProteinFrom { get; set; } = 100;

    /// <summary>
    /// A normal sodium less than this many hours before the low value makes the hyponatremia acute, h. Default 48
    /// (2014 European guideline: acute is documented &lt; 48 h; chronic is ≥ 48 h or unknown; reference sheet, verified).
    /// </summary>
    [Range(1, 168)]
    public double AcuteWithinHours { get; set; } = 48;

    /// <summary>The card indicator is raised at least to this for acute hyponatremia. Default warning (common practice: brain oedema risk is higher).</summary>
    [EnumDataType(typeof(CardIndicator))]
    public CardIndicator AcuteIndicator { get; set; } = CardIndicator.Warning;

    /// <summary>
    /// Urine osmolality at or below this means maximally dilute urine (relative excess water or low solute intake), mOsm/kg.
    /// Default 100 (2014 European guideline; reference sheet, verified).
    /// </summary>
    [Range(50, 300)]
    public double DiluteUrineAtOrBelow { get; set; } = 100;

    /// <summary>
    /// Urine sodium at or below this points to low effective arterial blood volume, mmol/L. Default 30
    /// (2014 European guideline; reference sheet, verified; an older SIADH criterion uses 40).
    /// </summary>
    [Range(10, 60)]
    public double LowUrineSodiumAtOrBelow { get; set; } = 30;

    /// <summary>
    /// A urine test taken more than this many hours before or after the serum sodium is labelled as not paired with it, h.
    /// Default 12 (common practice: serum and spot urine are sent together).
    /// </summary>
    [Range(1, 72)]
    public double UrineLabelAfterHours { get; set; } = 12;

    /// <summary>
    /// A urine test taken more than this many hours before the serum sodium is not used (it says nothing about today), h.
    /// Default 72, the same as the stale window for sodium (common practice).
    /// </summary>
    [Range(1, 24 * 30)]
    public double UrineUsableBeforeSodiumHours { get; set; } = 72;

    /// <summary>
    /// A Furst ratio, (urine sodium + urine potassium) / serum sodium, above this means fluid restriction is unlikely to
    /// work. Default 1 (Furst et al., Am J Med Sci 2000;319:240; reference sheet, secondary; the bands are from memory).
    /// </summary>
    [Range(0.1, 3)]
    public double FurstRestrictionUnlikelyAbove { get; set; } = 1;

    /// <summary>
    /// A Furst ratio from this up to <see cref="FurstRestrictionUnlikelyAbove"/> calls for a stricter fluid restriction; below
    /// it the usual restriction can be expected to work. Default 0.5 (same source; bands from memory).
    /// </summary>
    [Range(0.1, 3)]
    public double FurstStricterRestrictionFrom { get; set; } = 0.5;

    /// <summary>TSH and cortisol older than this many days are treated as missing, d. Default 30 (common practice).</summary>
    [Range(1, 365)]
    public double EndocrineTestMaxAgeDays { get; set; } = 30;

    /// <summary>Lower limit of normal TSH when the laboratory sends no range, mIU/L. Default 0.4 (from memory; laboratories differ).</summary>
    [Range(0, 5)]
    public double ThyrotropinNormalFrom { get; set; } = 0.4;

    /// <summary>Upper limit of normal TSH when the laboratory sends no range, mIU/L. Default 4.0 (from memory; laboratories differ).</summary>
    [Range(1, 20)]
    public double ThyrotropinNormalTo { get; set; } = 4.0;

    /// <summary>
    /// Cortisol below this counts as low when the laboratory sends no range, nmol/L. Default 138 (5 µg/dL, the lower end of
    /// a common morning reference range; from memory). A value above it does not exclude adrenal insufficiency.
    /// </summary>
    [Range(20, 600)]
    public double CortisolNormalFrom { get; set; } = 138;

    /// <summary>Checks across settings: the tonicity edges, the TSH range and the Furst bands must not overlap.</summary>
    public IEnumerable<ValidationResult> Validate(ValidationContext validationContext)
    {
        if (HypotonicBelow >= HypertonicAbove)
        {
            yield return new ValidationResult($"{OptionsPath.Of(validationContext)}: HypotonicBelow must be below HypertonicAbove.", [nameof(HypotonicBelow)]);
        }

        if (ThyrotropinNormalFrom >= ThyrotropinNormalTo)
        {
            yield return new ValidationResult($"{OptionsPath.Of(validationContext)}: ThyrotropinNormalFrom must be below ThyrotropinNormalTo.", [nameof(ThyrotropinNormalFrom)]);
        }

        if (FurstStricterRestrictionFrom > FurstRestrictionUnlikelyAbove)
        {
            yield return new ValidationResult($"{OptionsPath.Of(validationContext)}: FurstStricterRestrictionFrom must not exceed FurstRestrictionUnlikelyAbove.", [nameof(FurstStricterRestrictionFrom)]);
        }
    }
}
