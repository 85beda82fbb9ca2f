using System.ComponentModel.DataAnnotations;
using CdsNatremia.Core.Cards;

namespace CdsNatremia.Core.Engine;

/// <summary>The card indicator for each severity band (configurable; defaults are common practice).</summary>
public sealed class IndicatorOptions
{
    /// <summary>Mild hyponatremia. Default info.</summary>
    [EnumDataType(typeof(CardIndicator))]
    public CardIndicator Mild { get; set; } = CardIndicator.Info;

    /// <summary>Moderate hyponatremia. Default warning.</summary>
    [EnumDataType(typeof(CardIndicator))]
    public CardIndicator Moderate { get; set; } = CardIndicator.Warning;

    /// <summary>Profound (severe) hyponatremia. Default critical.</summary>
    [EnumDataType(typeof(CardIndicator))]
    public CardIndicator Profound { get; set; } = CardIndicator.Critical;
}
