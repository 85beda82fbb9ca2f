namespace CdsNatremia.Core.Workup;

/// <summary>The tonicity band of a low sodium. Only <see cref="Hypotonic"/> is "true" hyponatremia with water excess.</summary>
public enum Tonicity
{
    /// <summary>No measured osmolality and not enough data to calculate one.</summary>
    Unknown,

    /// <summary>Effective osmolality below <see cref="WorkupOptions.HypotonicBelow"/> (default 275 mOsm/kg).</summary>
    Hypotonic,

    /// <summary>Effective osmolality not low, total osmolality within the reference range.</summary>
    Isotonic,

    /// <summary>Effective osmolality not low, total osmolality above <see cref="WorkupOptions.HypertonicAbove"/> (default 295 mOsm/kg).</summary>
    Hypertonic,
}
