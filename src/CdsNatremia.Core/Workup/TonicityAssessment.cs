using CdsNatremia.Core.Text;
using CdsNatremia.Core.Assessment;
using CdsNatremia.Core.Engine;
using CdsNatremia.Core.Facts;

using CdsNatremia.Core.Findings;

namespace CdsNatremia.Core.Workup;

/// <summary>
/// The tonicity of a low sodium, computed once from the facts: measured osmolality first, else calculated; effective
/// osmolality (urea excluded); osmolal gap when both exist; and the band. Immutable; every work-up rule that needs the
/// band recomputes it from the same context, which gives the same answer (pure).
/// </summary>
public sealed record TonicityAssessment
{
    /// <summary>The sodium assessed (the latest usable one).</summary>
    public required LabResult Sodium { get; init; }

    /// <summary>Measured serum osmolality paired with the sodium, or null.</summary>
    public LabResult? Measured { get; init; }

    /// <summary>Glucose paired with the sodium, or null.</summary>
    public LabResult? Glucose { get; init; }

    /// <summary>Urea paired with the sodium, or null.</summary>
    public LabResult? Urea { get; init; }

    /// <summary>2 × Na + glucose + urea (mmol/L), or null when glucose or urea is missing.</summary>
    public double? Calculated { get; init; }

    /// <summary>2 × Na + glucose, the calculated effective osmolality, or null when glucose is missing.</summary>
    public double? CalculatedEffective { get; init; }

    /// <summary>The effective osmolality the band rests on (measured − urea, measured alone when urea is unknown, or calculated effective).</summary>
    public double? Effective { get; init; }

    /// <summary>The total osmolality the band rests on (measured, else calculated).</summary>
    public double? Total { get; init; }

    /// <summary>Measured − calculated, when both exist.</summary>
    public double? Gap { get; init; }

    /// <summary>The band.</summary>
    public required Tonicity Band { get; init; }

    /// <summary>Where the osmolality came from.</summary>
    public required OsmolalityMethod Method { get; init; }

    /// <summary>True when glucose and urea nitrogen were both reported in mg/dL, so the card shows the US-unit form.</summary>
    public bool ReportedInUsUnits { get; init; }

    /// <summary>
    /// Glucose in mg/dL (from the canonical value × 18.016), rounded to one decimal: the value the corrections use is the
    /// value the card shows (<see cref="Text.ClinicalNumber"/>). Null without glucose.
    /// </summary>
    public double? GlucoseMgPerDl => Glucose is null ? null : Shown(OsmolalityFormulas.GlucoseToMgPerDl(Glucose.Value));

    /// <summary>True when the paired glucose is at or above <see cref="WorkupOptions.HighGlucoseFrom"/>.</summary>
    public bool GlucoseIsHigh { get; init; }

    /// <summary>True when the gap is above <see cref="WorkupOptions.OsmolalGapAbove"/>.</summary>
    public bool GapIsHigh { get; init; }

    /// <summary>Computes the assessment for the context's latest sodium.</summary>
    public static TonicityAssessment From(DecisionContext context)
    {
        Guard.NotNull(context, nameof(context));
        var sodium = context.Sodium.Latest ?? throw new InvalidOperationException("The work-up needs a sodium result.");
        var options = context.Options.Workup;
        var facts = context.Request.Facts;
        var measured = WorkupData.Paired(facts, Analyte.SerumOsmolality, sodium.EffectiveAt, options.PairedWithinHours);
        var glucose = WorkupData.Paired(facts, Analyte.Glucose, sodium.EffectiveAt, options.PairedWithinHours);
        var urea = WorkupData.Paired(facts, Analyte.Urea, sodium.EffectiveAt, options.PairedWithinHours);
        return Compute(sodium, measured, glucose, urea, options);
    }

    /// <summary>Computes the assessment from the given results (exposed for tests and reuse).</summary>
    public static TonicityAssessment Compute(LabResult sodium, LabResult? measured, LabResult? glucose, LabResult? urea, WorkupOptions options)
    {
        Guard.NotNull(sodium, nameof(sodium));
        Guard.NotNull(options, nameof(options));
        // Computed osmolalities are rounded to one decimal once, here: the band and the gap rest on the values the card shows.
        double? calculatedEffective = glucose is null ? null : Shown((2 * sodium.Value) + glucose.Value);
        double? calculated = glucose is null || urea is null ? null : Shown(OsmolalityFormulas.CalculatedSi(sodium.Value, glucose.Value, urea.Value));

        double? effective;
        double? total;
        OsmolalityMethod method;
        if (measured is not null)
        {
            method = OsmolalityMethod.Measured;
            total = measured.Value;
            effective = urea is null ? measured.Value : Shown(OsmolalityFormulas.Effective(measured.Value, urea.Value));
        }
        else if (calculatedEffective is not null)
        {
            method = OsmolalityMethod.Calculated;
            total = calculated;
            effective = calculatedEffective;
        }
        else
        {
            method = OsmolalityMethod.None;
            total = null;
            effective = null;
        }

        var band = Classify(effective, total, options);
        double? gap = measured is not null && calculated is not null ? Shown(OsmolalityFormulas.OsmolalGap(measured.Value, calculated.Value)) : null;
        return new TonicityAssessment
        {
            Sodium = sodium,
            Measured = measured,
            Glucose = glucose,
            Urea = urea,
            Calculated = calculated,
            CalculatedEffective = calculatedEffective,
            Effective = effective,
            Total = total,
            Gap = gap,
            Band = band,
            Method = method,
            ReportedInUsUnits = IsMgPerDl(glucose) && IsMgPerDl(urea) && urea!.LoincCode == "3094-0",
            GlucoseIsHigh = glucose is not null && glucose.Value >= options.HighGlucoseFrom,
            GapIsHigh = gap > options.OsmolalGapAbove,
        };
    }

    /// <summary>
    /// The band: effective osmolality below the hypotonic edge is hypotonic; otherwise total osmolality above the hypertonic
    /// edge is hypertonic, and at or below it isotonic. Without a total (urea unknown, nothing measured) only "hypotonic" can
    /// be said; anything else is unknown.
    /// </summary>
    public static Tonicity Classify(double? effective, double? total, WorkupOptions options)
    {
        Guard.NotNull(options, nameof(options));
        if (effective is not { } e)
        {
            return Tonicity.Unknown;
        }

        if (e < options.HypotonicBelow)
        {
            return Tonicity.Hypotonic;
        }

        if (total is not { } t)
        {
            return Tonicity.Unknown;
        }

        return t > options.HypertonicAbove ? Tonicity.Hypertonic : Tonicity.Isotonic;
    }

    /// <summary>The band as a phrase.</summary>
    public static Finding NameOf(Tonicity band) => Finding.Of(band switch
    {
        Tonicity.Hypotonic => FindingKind.TonicityBandHypotonic,
        Tonicity.Isotonic => FindingKind.TonicityBandIsotonic,
        Tonicity.Hypertonic => FindingKind.TonicityBandHypertonic,
        _ => FindingKind.TonicityBandUnknown,
    });

    /// <summary>A computed value as cards show it and rules use it: one decimal, half away from zero.</summary>
    private static double Shown(double value) => Math.Round(value, 1, MidpointRounding.AwayFromZero);

    private static bool IsMgPerDl(LabResult? result)
        => result?.OriginalValue is not null && result.OriginalUnit is { } unit && string.Equals(unit.Trim(), "mg/dL", StringComparison.OrdinalIgnoreCase);
}
