namespace CdsNatremia.Core.Findings;

/// <summary>
/// How much a finding matters to the short card, which shows the three weightiest reasons (the full report shows all).
/// The order is a clinical judgement of what changes the next decision most (common practice): what can be acted on
/// now (a likely drug cause, a not-hypotonic picture, low cortisol), then what changes the pace (acute onset, data that
/// could not be read), then what narrows the cause (SIADH picture, urine studies), then context (tonicity, severity,
/// which the headline already states).
/// </summary>
public static class Weights
{
    /// <summary>An urgent alternative cause (e.g. low cortisol).</summary>
    public const int Urgent = 100;

    /// <summary>A likely drug cause, or a picture that changes the whole reading (not hypotonic).</summary>
    public const int Culprit = 90;

    /// <summary>The pace: acute onset, high risk of over-correction.</summary>
    public const int Pace = 80;

    /// <summary>Data that could not be read or obtained, which limits a conclusion.</summary>
    public const int DataGap = 70;

    /// <summary>What narrows the cause (SIADH picture, urine studies, volume clues).</summary>
    public const int Cause = 60;

    /// <summary>Missing tests.</summary>
    public const int Missing = 50;

    /// <summary>Context (tonicity).</summary>
    public const int Context = 40;

    /// <summary>What the headline already states (severity): shown only when little else is known.</summary>
    public const int Stated = 10;
}
