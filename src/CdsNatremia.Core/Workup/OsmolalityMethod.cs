namespace CdsNatremia.Core.Workup;

/// <summary>Where the osmolality a tonicity band rests on came from.</summary>
public enum OsmolalityMethod
{
    /// <summary>No osmolality: neither measured nor calculable.</summary>
    None,

    /// <summary>Measured serum or plasma osmolality (LOINC 2692-2), the preferred source.</summary>
    Measured,

    /// <summary>Calculated from sodium, glucose and (when known) urea.</summary>
    Calculated,
}
