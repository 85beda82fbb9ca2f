namespace CdsNatremia.Core.Drugs;

/// <summary>What the start of a drug, set against the sodium series, says about it as a cause.</summary>
public enum TimingVerdict
{
    /// <summary>Started before the fall: a likely contributor.</summary>
    Likely,
    /// <summary>Start unknown, or the fall's timing unknown: a possible contributor.</summary>
    Possible,
    /// <summary>Started after the sodium was already low (or not started yet): unlikely to have caused the fall.</summary>
    Unlikely,
}
