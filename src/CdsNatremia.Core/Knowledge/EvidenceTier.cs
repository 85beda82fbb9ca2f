namespace CdsNatremia.Core.Knowledge;

/// <summary>How strongly a drug group is linked to low sodium.</summary>
public enum EvidenceTier
{
    /// <summary>Well-established causes (thiazides, SSRIs, the carbamazepine family).</summary>
    Primary,
    /// <summary>Other known contributors, with a lower evidence weight.</summary>
    Secondary,
}
