using CdsNatremia.Core.CorrectionRate;
using CdsNatremia.Core.Drugs;
using CdsNatremia.Core.Sodium;
using CdsNatremia.Core.Workup;

namespace CdsNatremia.Core.Engine;

/// <summary>
/// Every threshold the rules use, grouped by rule. Bound from the "Natremia:Rules" configuration section;
/// each default's source is in the doc comment of the property that holds it.
/// </summary>
public sealed class RuleOptions
{
    /// <summary>Severity bands.</summary>
    public SeverityOptions Severity { get; set; } = new();

    /// <summary>Stale and future-time handling of results.</summary>
    public SodiumReadingOptions Reading { get; set; } = new();

    /// <summary>Card indicator per band.</summary>
    public IndicatorOptions Indicators { get; set; } = new();

    /// <summary>The hyponatremia work-up (tonicity, glucose, onset, urine studies, SIADH checklist).</summary>
    public WorkupOptions Workup { get; set; } = new();

    /// <summary>Correction-rate limits and the high-risk criteria.</summary>
    public CorrectionRateOptions CorrectionRate { get; set; } = new();

    /// <summary>Infusate content and body-water fractions for infusion predictions.</summary>
    public InfusionOptions Infusion { get; set; } = new();

    /// <summary>Drug-cause reasoning and the prescribing warning.</summary>
    public DrugCauseOptions DrugCause { get; set; } = new();
}
