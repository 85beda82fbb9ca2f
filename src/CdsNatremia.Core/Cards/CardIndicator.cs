namespace CdsNatremia.Core.Cards;

/// <summary>CDS Hooks card urgency. Ordered: a higher value is more urgent.</summary>
public enum CardIndicator
{
    /// <summary>info</summary>
    Info = 0,
    /// <summary>warning</summary>
    Warning = 1,
    /// <summary>critical</summary>
    Critical = 2,
}
