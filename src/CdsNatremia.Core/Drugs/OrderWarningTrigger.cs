namespace CdsNatremia.Core.Drugs;

/// <summary>Why a draft order of a drug that can lower sodium gets a warning.</summary>
public enum OrderWarningTrigger
{
    /// <summary>The latest usable sodium is below the lower limit of normal.</summary>
    Low,
    /// <summary>The latest sodium is normal but has dropped by the meaningful drop within the falling window.</summary>
    Falling,
    /// <summary>No sodium within the recent window, for a patient at or above the configured age.</summary>
    AbsentOlderPatient,
}
