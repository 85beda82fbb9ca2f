namespace CdsNatremia.Core.CorrectionRate;

/// <summary>Where a measured rise stands against its limit.</summary>
public enum RateStatus
{
    /// <summary>No rise (steady or falling sodium).</summary>
    NoRise,
    /// <summary>Rising, within the limit and not near it.</summary>
    Within,
    /// <summary>Within the approaching margin of the limit, or projected to pass it by the window's end.</summary>
    Approaching,
    /// <summary>At or past the limit.</summary>
    AtOrPast,
}
