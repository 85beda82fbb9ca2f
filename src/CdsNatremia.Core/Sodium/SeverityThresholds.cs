namespace CdsNatremia.Core.Sodium;

/// <summary>Resolved severity thresholds, mmol/L; each lower edge inclusive.</summary>
/// <param name="NormalFrom">Lower limit of normal.</param>
/// <param name="NormalTo">Upper limit of normal.</param>
/// <param name="MildFrom">Lowest value still mild.</param>
/// <param name="ModerateFrom">Lowest value still moderate; below it, the lowest band.</param>
/// <param name="LowestBandName">"profound" or "severe".</param>
/// <param name="Source">Citation for the thresholds.</param>
public sealed record SeverityThresholds(double NormalFrom, double NormalTo, double MildFrom, double ModerateFrom, string LowestBandName, string Source)
{
    /// <summary>Places a sodium value (mmol/L) in its band.</summary>
    public SeverityBand Classify(double sodium)
    {
        Guard.Finite(sodium, nameof(sodium));
        if (sodium > NormalTo)
        {
            return SeverityBand.AboveRange;
        }

        if (sodium >= NormalFrom)
        {
            return SeverityBand.Normal;
        }

        if (sodium >= MildFrom)
        {
            return SeverityBand.Mild;
        }

        return sodium >= ModerateFrom ? SeverityBand.Moderate : SeverityBand.Profound;
    }

    /// <summary>The word for a band, as cards print it.</summary>
    public string NameOf(SeverityBand band) => band switch
    {
        SeverityBand.Normal => "normal",
        SeverityBand.Mild => "mild",
        SeverityBand.Moderate => "moderate",
        SeverityBand.Profound => LowestBandName,
        SeverityBand.AboveRange => "above the normal range",
        _ => throw new ArgumentOutOfRangeException(nameof(band), band, null),
    };

    /// <summary>The band's range for a person, e.g. "125–129.9 mmol/L" or "below 125 mmol/L".</summary>
    public string RangeOf(SeverityBand band) => band switch
    {
        SeverityBand.Normal => Invariant.Format($"{NormalFrom:0.#}–{NormalTo:0.#} mmol/L"),
        SeverityBand.Mild => Invariant.Format($"{MildFrom:0.#} to below {NormalFrom:0.#} mmol/L"),
        SeverityBand.Moderate => Invariant.Format($"{ModerateFrom:0.#} to below {MildFrom:0.#} mmol/L"),
        SeverityBand.Profound => Invariant.Format($"below {ModerateFrom:0.#} mmol/L"),
        SeverityBand.AboveRange => Invariant.Format($"above {NormalTo:0.#} mmol/L"),
        _ => throw new ArgumentOutOfRangeException(nameof(band), band, null),
    };
}
