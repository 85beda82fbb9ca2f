using System.ComponentModel.DataAnnotations;
using CdsNatremia.Core.Engine;

namespace CdsNatremia.Core.Sodium;

/// <summary>
/// Thresholds that place a serum sodium in a severity band. A band's lower edge is inclusive:
/// with the defaults, 125.0 is moderate and 124.9 is profound; 135.0 is normal.
/// Unless <see cref="Preset"/> is <see cref="SeverityPreset.Custom"/>, the preset's values replace the numbers below.
/// </summary>
public sealed class SeverityOptions : IValidatableObject
{
    /// <summary>Which threshold set to use. Default <see cref="SeverityPreset.European2014"/>.</summary>
    [EnumDataType(typeof(SeverityPreset))]
    public SeverityPreset Preset { get; set; } = SeverityPreset.European2014;

    /// <summary>
    /// Lower limit of normal, mmol/L. Default 135: the common reference range is 135 (or 136) to 145 mmol/L
    /// (common practice; laboratories differ), and the 2014 European guideline defines hyponatremia as &lt; 135.
    /// </summary>
    [Range(100, 160)]
    public double NormalFrom { get; set; } = 135;

    /// <summary>Upper limit of normal, mmol/L. Default 145 (common practice). Above it: out of scope, no card.</summary>
    [Range(100, 200)]
    public double NormalTo { get; set; } = 145;

    /// <summary>Mild band starts here (inclusive), mmol/L. Default 130 (2014 European guideline: mild 130–135).</summary>
    [Range(90, 160)]
    public double MildFrom { get; set; } = 130;

    /// <summary>Moderate band starts here (inclusive), mmol/L. Default 125 (2014 European guideline: moderate 125–129).</summary>
    [Range(90, 160)]
    public double ModerateFrom { get; set; } = 125;

    /// <summary>The word cards use for the lowest band. Default "profound" (2014 European guideline); the older preset says "severe".</summary>
    public string LowestBandName { get; set; } = "profound";

    /// <summary>
    /// Age in years from which the patient is an adult. Below it, every card that gives thresholds or correction limits says
    /// that these are adult values that may not apply and defers to paediatric protocols. Default 18: the 2014 European
    /// guideline covers adults (Spasovski et al. 2014, its stated scope), and 18 is the usual age of adulthood (common practice).
    /// </summary>
    [Range(1, 30)]
    public int AdultFromAgeYears { get; set; } = 18;

    /// <summary>Citation shown on cards for the band thresholds.</summary>
    public string Source { get; set; } = "2014 European clinical practice guideline on hyponatraemia (Spasovski et al., Eur J Endocrinol 2014;170:G1)";

    /// <summary>The effective thresholds after applying <see cref="Preset"/>.</summary>
    public SeverityThresholds Resolve() => Preset switch
    {
        SeverityPreset.European2014 => new SeverityThresholds(135, 145, 130, 125, "profound",
            "2014 European clinical practice guideline on hyponatraemia (Spasovski et al., Eur J Endocrinol 2014;170:G1)"),
        SeverityPreset.SevereBelow120 => new SeverityThresholds(135, 145, 130, 120, "severe",
            "older teaching cut-off: severe below 120 mmol/L (common practice)"),
        _ => new SeverityThresholds(NormalFrom, NormalTo, MildFrom, ModerateFrom, LowestBandName, Source),
    };

    /// <summary>Checks across settings: the resolved thresholds must rise.</summary>
    public IEnumerable<ValidationResult> Validate(ValidationContext validationContext)
    {
        var t = Resolve();
        if (!(t.ModerateFrom < t.MildFrom && t.MildFrom < t.NormalFrom && t.NormalFrom < t.NormalTo))
        {
            yield return new ValidationResult($"{OptionsPath.Of(validationContext)}: thresholds must rise: ModerateFrom < MildFrom < NormalFrom < NormalTo.", [nameof(ModerateFrom)]);
        }
    }
}
