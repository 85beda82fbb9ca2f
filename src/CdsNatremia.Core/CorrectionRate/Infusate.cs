using CdsNatremia.Core.Findings;

namespace CdsNatremia.Core.CorrectionRate;

/// <summary>A recognised infusate with its content, mmol/L.</summary>
/// <param name="Kind">Which fluid.</param>
/// <param name="Sodium">Sodium, mmol/L (from <see cref="InfusionOptions"/>).</param>
/// <param name="Potassium">Potassium, mmol/L (0 for plain saline).</param>
/// <param name="Osmolality">Osmolality, mOsm/kg (taken as equal to osmolarity for these dilute solutions): for sodium
/// chloride twice the sodium (sodium and chloride both count; 0.9% gives 308, the figure usually stated: from memory);
/// for Ringer's lactate <see cref="InfusionOptions.RingersLactateOsmolality"/>.</param>
public sealed record Infusate(InfusateKind Kind, double Sodium, double Potassium, double Osmolality)
{
    /// <summary>The name a card prints, e.g. "sodium chloride 3%" (a phrase of the catalogue).</summary>
    public Finding Name => Finding.Of(Kind switch
    {
        InfusateKind.Saline09 => FindingKind.RateInfusateSaline09,
        InfusateKind.Saline3 => FindingKind.RateInfusateSaline3,
        InfusateKind.Saline045 => FindingKind.RateInfusateSaline045,
        InfusateKind.RingersLactate => FindingKind.RateInfusateRingersLactate,
        _ => throw new InvalidOperationException("Unknown infusate kind."),
    });

    /// <summary>The same name opening a sentence, e.g. "Sodium chloride 3%".</summary>
    public Finding NameAtStart => Finding.Of(Kind switch
    {
        InfusateKind.Saline09 => FindingKind.RateInfusateSaline09Start,
        InfusateKind.Saline3 => FindingKind.RateInfusateSaline3Start,
        InfusateKind.Saline045 => FindingKind.RateInfusateSaline045Start,
        InfusateKind.RingersLactate => FindingKind.RateInfusateRingersLactateStart,
        _ => throw new InvalidOperationException("Unknown infusate kind."),
    });

    /// <summary>The infusate for a kind, with the configured content.</summary>
    public static Infusate Of(InfusateKind kind, InfusionOptions options)
    {
        Guard.NotNull(options, nameof(options));
        return kind switch
        {
            InfusateKind.Saline09 => new(kind, options.Saline09Sodium, 0, 2 * options.Saline09Sodium),
            InfusateKind.Saline3 => new(kind, options.Saline3Sodium, 0, 2 * options.Saline3Sodium),
            InfusateKind.Saline045 => new(kind, options.Saline045Sodium, 0, 2 * options.Saline045Sodium),
            InfusateKind.RingersLactate => new(kind, options.RingersLactateSodium, options.RingersLactatePotassium, options.RingersLactateOsmolality),
            _ => throw new ArgumentOutOfRangeException(nameof(kind), kind, null),
        };
    }
}
