namespace CdsNatremia.Core.Sodium;

/// <summary>How low a serum sodium is. Hyponatremia bands only: high sodium is out of scope (no card).</summary>
public enum SeverityBand
{
    /// <summary>At or above the lower limit of normal (and not above the upper limit).</summary>
    Normal,
    /// <summary>Mild hyponatremia.</summary>
    Mild,
    /// <summary>Moderate hyponatremia.</summary>
    Moderate,
    /// <summary>Profound (or, in the older preset, severe) hyponatremia.</summary>
    Profound,
    /// <summary>Above the upper limit of normal: hypernatremia, outside this service's scope.</summary>
    AboveRange,
}
