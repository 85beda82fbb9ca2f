using CdsNatremia.Core.Cards;

namespace CdsNatremia.Core.Engine;

/// <summary>The card indicator for each severity band (configurable; defaults are common practice).</summary>
public sealed class IndicatorOptions
{
    /// <summary>Mild hyponatremia. Default info.</summary>
    public CardIndicator Mild { get; set; } = CardIndicator.Info;

    /// <summary>Moderate hyponatremia. Default warning.</summary>
    public CardIndicator Moderate { get; set; } = CardIndicator.Warning;

    /// <summary>Profound (severe) hyponatremia. Default critical.</summary>
    public CardIndicator Profound { get; set; } = CardIndicator.Critical;
}
