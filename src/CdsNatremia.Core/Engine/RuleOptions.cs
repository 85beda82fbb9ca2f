using CdsNatremia.Core.CorrectionRate;
using CdsNatremia.Core.Drugs;
using CdsNatremia.Core.Sodium;
using CdsNatremia.Core.Workup;
using Microsoft.Extensions.Options;

namespace CdsNatremia.Core.Engine;

/// <summary>
/// Every threshold the rules use, grouped by rule. Bound from the "Natremia:Rules" configuration section;
/// each default's source is in the doc comment of the property that holds it. Every group is marked
/// <see cref="ValidateObjectMembersAttribute"/>, so the host's options validation checks each group's own attributes
/// ([Range], and <see cref="System.ComponentModel.DataAnnotations.IValidatableObject"/> for checks across settings);
/// a group added without it fails <c>RuleOptionsValidationTests</c>.
/// </summary>
public sealed class RuleOptions
{
    /// <summary>Severity bands.</summary>
    [ValidateObjectMembers]
    public SeverityOptions Severity { get; set; } = new();

    /// <summary>Stale and future-time handling of results.</summary>
    [ValidateObjectMembers]
    public SodiumReadingOptions Reading { get; set; } = new();

    /// <summary>Card indicator per band.</summary>
    [ValidateObjectMembers]
    public IndicatorOptions Indicators { get; set; } = new();

    /// <summary>The hyponatremia work-up (tonicity, glucose, onset, urine studies, SIADH checklist).</summary>
    [ValidateObjectMembers]
    public WorkupOptions Workup { get; set; } = new();

    /// <summary>Correction-rate limits and the high-risk criteria.</summary>
    [ValidateObjectMembers]
    public CorrectionRateOptions CorrectionRate { get; set; } = new();

    /// <summary>Infusate content and body-water fractions for infusion predictions.</summary>
    [ValidateObjectMembers]
    public InfusionOptions Infusion { get; set; } = new();

    /// <summary>Drug-cause reasoning and the prescribing warning.</summary>
    [ValidateObjectMembers]
    public DrugCauseOptions DrugCause { get; set; } = new();
}
