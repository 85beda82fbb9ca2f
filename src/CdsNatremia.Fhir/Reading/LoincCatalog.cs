using System.Collections.Frozen;
using CdsNatremia.Core.Facts;

namespace CdsNatremia.Fhir.Reading;

/// <summary>
/// The LOINC codes the service reads, with what each measures. Every code is from the clinical reference sheet,
/// where each carries its status (mostly verified against LOINC; 29463-7 body weight from memory).
/// Urine sodium is never serum sodium; 24-hour urine sodium (2956-1) is a rate, not a concentration, and is set aside.
/// </summary>
public static class LoincCatalog
{
    /// <summary>A LOINC code's meaning for the rules.</summary>
    /// <param name="Analyte">What it measures.</param>
    /// <param name="Specimen">Its specimen.</param>
    public readonly record struct Entry(Analyte Analyte, SpecimenKind Specimen);

    private static readonly Dictionary<string, Entry> Codes = new(StringComparer.Ordinal)
    {
        ["2951-2"] = new(Analyte.Sodium, SpecimenKind.SerumOrPlasma),
        ["2947-0"] = new(Analyte.Sodium, SpecimenKind.Blood),
        ["32717-1"] = new(Analyte.Sodium, SpecimenKind.ArterialBlood),
        ["39791-9"] = new(Analyte.Sodium, SpecimenKind.VenousBlood),
        ["39792-7"] = new(Analyte.Sodium, SpecimenKind.CapillaryBlood),
        ["77139-4"] = new(Analyte.Sodium, SpecimenKind.SerumPlasmaOrBlood),
        ["2955-3"] = new(Analyte.UrineSodium, SpecimenKind.Urine),
        ["2692-2"] = new(Analyte.SerumOsmolality, SpecimenKind.SerumOrPlasma),
        ["2695-5"] = new(Analyte.UrineOsmolality, SpecimenKind.Urine),
        ["2345-7"] = new(Analyte.Glucose, SpecimenKind.SerumOrPlasma),
        ["2339-0"] = new(Analyte.Glucose, SpecimenKind.Blood),
        ["14749-6"] = new(Analyte.Glucose, SpecimenKind.SerumOrPlasma),
        ["3094-0"] = new(Analyte.Urea, SpecimenKind.SerumOrPlasma),
        ["14937-7"] = new(Analyte.Urea, SpecimenKind.SerumOrPlasma),
        ["22664-7"] = new(Analyte.Urea, SpecimenKind.SerumOrPlasma),
        ["3091-6"] = new(Analyte.Urea, SpecimenKind.SerumOrPlasma),
        ["2823-3"] = new(Analyte.Potassium, SpecimenKind.SerumOrPlasma),
        ["2828-2"] = new(Analyte.UrinePotassium, SpecimenKind.Urine),
        ["2160-0"] = new(Analyte.Creatinine, SpecimenKind.SerumOrPlasma),
        ["2571-8"] = new(Analyte.Triglyceride, SpecimenKind.SerumOrPlasma),
        ["2885-2"] = new(Analyte.TotalProtein, SpecimenKind.SerumOrPlasma),
        ["1751-7"] = new(Analyte.Albumin, SpecimenKind.SerumOrPlasma),
        ["3016-3"] = new(Analyte.Thyrotropin, SpecimenKind.SerumOrPlasma),
        ["11579-0"] = new(Analyte.Thyrotropin, SpecimenKind.SerumOrPlasma),
        ["11580-8"] = new(Analyte.Thyrotropin, SpecimenKind.SerumOrPlasma),
        ["2143-6"] = new(Analyte.Cortisol, SpecimenKind.SerumOrPlasma),
        ["29463-7"] = new(Analyte.BodyWeight, SpecimenKind.NotApplicable),
    };

    /// <summary>Codes that are recognised but never used, with the reason.</summary>
    private static readonly FrozenDictionary<string, (Analyte Analyte, string Reason)> Refused = new Dictionary<string, (Analyte Analyte, string Reason)>(StringComparer.Ordinal)
    {
        ["2956-1"] = (Analyte.UrineSodium, "24-hour urine sodium is a rate (mmol/24 h), not a concentration; the rules use spot urine sodium (LOINC 2955-3)"),
    }.ToFrozenDictionary(StringComparer.Ordinal);

    /// <summary>The same codes as a frozen look-up (read on every Observation); <see cref="Codes"/> keeps their order for listings.</summary>
    private static readonly FrozenDictionary<string, Entry> Lookup = Codes.ToFrozenDictionary(StringComparer.Ordinal);

    /// <summary>Every LOINC code the service reads.</summary>
    public static IReadOnlyCollection<string> KnownCodes => Codes.Keys;

    /// <summary>Sodium codes for serum, plasma and blood (the sodium prefetch query).</summary>
    public static IEnumerable<string> SodiumCodes => Codes.Where(kv => kv.Value.Analyte == Analyte.Sodium).Select(kv => kv.Key);

    /// <summary>Looks up a code the rules use.</summary>
    public static bool TryGet(string code, out Entry entry) => Lookup.TryGetValue(code, out entry);

    /// <summary>Looks up a code that is recognised but set aside.</summary>
    public static bool IsRefused(string code, out Analyte analyte, out string reason)
    {
        if (Refused.TryGetValue(code, out var refused))
        {
            (analyte, reason) = refused;
            return true;
        }

        analyte = default;
        reason = string.Empty;
        return false;
    }
}
