namespace CdsNatremia.Core.Findings;

/// <summary>How certain a finding is.</summary>
public enum Certainty
{
    /// <summary>Shown by the data the rule used.</summary>
    Established,

    /// <summary>Likely: the data point to it but do not prove it (e.g. a likely drug cause).</summary>
    Likely,

    /// <summary>Possible: one of the explanations to consider.</summary>
    Possible,

    /// <summary>Unknown: the data needed were not there.</summary>
    Unknown,

    /// <summary>Unknown because data were received but could not be read or trusted.</summary>
    CouldNotBeRead,
}
