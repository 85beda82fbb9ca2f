using System.Collections.Frozen;
using CdsNatremia.Core.Facts;

namespace CdsNatremia.Fhir.Reading;

/// <summary>
/// The units accepted for each analyte and the factor to its canonical unit. A unit not listed is never guessed:
/// the result is set aside with the reason. Factors come from molar masses (UCUM-style unit arithmetic):
/// glucose 180.16 g/mol → 1 mmol/L = 18.016 mg/dL (reference sheet); urea nitrogen 28.014 g/mol per urea (two N) →
/// BUN mg/dL ÷ 2.8014 = urea mmol/L (the "BUN/2.8" of the US osmolality formula); urea 60.06 g/mol → ÷ 6.006;
/// creatinine 113.12 g/mol → mg/dL × 88.42 = µmol/L; triglyceride (as triolein, 885.7 g/mol) → mg/dL ÷ 88.57 = mmol/L;
/// cortisol 362.46 g/mol → µg/dL × 27.59 = nmol/L (molar masses: common practice, from memory where not on the sheet).
/// Sodium and potassium are monovalent, so mEq/L equals mmol/L.
/// </summary>
public static class UnitConversions
{
    private static readonly FrozenDictionary<Analyte, Dictionary<string, double>> Accepted = new Dictionary<Analyte, Dictionary<string, double>>
    {
        [Analyte.Sodium] = Units(("mmol/L", 1), ("meq/L", 1)),
        [Analyte.UrineSodium] = Units(("mmol/L", 1), ("meq/L", 1)),
        [Analyte.Potassium] = Units(("mmol/L", 1), ("meq/L", 1)),
        [Analyte.UrinePotassium] = Units(("mmol/L", 1), ("meq/L", 1)),
        [Analyte.SerumOsmolality] = Units(("mOsm/kg", 1), ("mOsm/kg{H2O}", 1), ("mOsm/kg H2O", 1), ("mmol/kg", 1)),
        [Analyte.UrineOsmolality] = Units(("mOsm/kg", 1), ("mOsm/kg{H2O}", 1), ("mOsm/kg H2O", 1), ("mmol/kg", 1)),
        [Analyte.Glucose] = Units(("mmol/L", 1), ("mg/dL", 1 / 18.016)),
        [Analyte.Creatinine] = Units(("umol/L", 1), ("µmol/L", 1), ("mg/dL", 88.42)),
        [Analyte.Triglyceride] = Units(("mmol/L", 1), ("mg/dL", 1 / 88.57)),
        [Analyte.TotalProtein] = Units(("g/L", 1), ("g/dL", 10)),
        [Analyte.Albumin] = Units(("g/L", 1), ("g/dL", 10)),
        [Analyte.Thyrotropin] = Units(("mIU/L", 1), ("m[IU]/L", 1), ("uIU/mL", 1), ("u[IU]/mL", 1), ("µIU/mL", 1)),
        [Analyte.Cortisol] = Units(("nmol/L", 1), ("ug/dL", 27.59), ("µg/dL", 27.59)),
        [Analyte.BodyWeight] = Units(("kg", 1), ("g", 0.001), ("[lb_av]", 0.45359237), ("lb", 0.45359237)),
    }.ToFrozenDictionary();

    /// <summary>Urea has code-dependent units: urea nitrogen (BUN) in mg/dL differs from urea in mg/dL.</summary>
    private static readonly FrozenDictionary<string, Dictionary<string, double>> UreaByCode = new Dictionary<string, Dictionary<string, double>>(StringComparer.Ordinal)
    {
        ["3094-0"] = Units(("mg/dL", 1 / 2.8014)),                // urea nitrogen, mass
        ["14937-7"] = Units(("mmol/L", 1)),                      // urea nitrogen, moles (reported as mmol/L of urea: common practice)
        ["22664-7"] = Units(("mmol/L", 1)),                      // urea, moles
        ["3091-6"] = Units(("mg/dL", 1 / 6.006), ("mg/L", 1 / 60.06)), // urea, mass
    }.ToFrozenDictionary(StringComparer.Ordinal);

    /// <summary>Values outside these canonical bounds are set aside as implausible (probably a unit or entry error; common practice).</summary>
    private static readonly FrozenDictionary<Analyte, (double Low, double High)> Plausible = new Dictionary<Analyte, (double Low, double High)>
    {
        [Analyte.Sodium] = (80, 200),
        [Analyte.UrineSodium] = (0, 400),
        [Analyte.Potassium] = (1, 10),
        [Analyte.UrinePotassium] = (0, 300),
        [Analyte.SerumOsmolality] = (180, 450),
        [Analyte.UrineOsmolality] = (20, 1500),
        [Analyte.Glucose] = (0.5, 120),
        [Analyte.Urea] = (0.2, 150),
        [Analyte.Creatinine] = (5, 3000),
        [Analyte.Triglyceride] = (0.05, 200),
        [Analyte.TotalProtein] = (10, 200),
        [Analyte.Albumin] = (5, 80),
        [Analyte.Thyrotropin] = (0, 1000),
        [Analyte.Cortisol] = (0, 5000),
        [Analyte.BodyWeight] = (0.3, 400),
    }.ToFrozenDictionary();

    // Frozen look-ups by analyte and code (read on every result); each unit table keeps its order, named in messages.

    /// <summary>Converts a value to the analyte's canonical unit, or says why it cannot.</summary>
    public static bool TryConvert(Analyte analyte, string loincCode, double value, string? unit, out double canonical, out string reason)
    {
        canonical = double.NaN;
        var table = analyte == Analyte.Urea && UreaByCode.TryGetValue(loincCode, out var urea) ? urea : Accepted[analyte];
        var key = unit?.Trim() ?? string.Empty;
        if (key.Length == 0)
        {
            reason = "no unit was given; the service never guesses a unit";
            return false;
        }

        if (!table.TryGetValue(key, out var factor))
        {
            reason = $"unit '{key}' is not one the service accepts for {AnalyteUnits.DisplayName(analyte).ToLowerInvariant()} ({string.Join(", ", table.Keys.Take(4))}); not converted, never guessed";
            return false;
        }

        canonical = value * factor;
        var (low, high) = Plausible[analyte];
        if (!double.IsFinite(canonical) || canonical < low || canonical > high)
        {
            reason = $"value is outside the plausible range for {AnalyteUnits.DisplayName(analyte).ToLowerInvariant()} ({low}–{high} {AnalyteUnits.CanonicalUnit(analyte)}): likely a unit or entry error";
            return false;
        }

        reason = string.Empty;
        return true;
    }

    /// <summary>Converts a reference-range bound with the same factor; null when the unit is not accepted.</summary>
    public static double? ConvertBound(Analyte analyte, string loincCode, double? value, string? unit)
    {
        if (value is not { } v)
        {
            return null;
        }

        var table = analyte == Analyte.Urea && UreaByCode.TryGetValue(loincCode, out var urea) ? urea : Accepted[analyte];
        return table.TryGetValue(unit?.Trim() ?? string.Empty, out var factor) ? v * factor : null;
    }

    private static Dictionary<string, double> Units(params (string Unit, double Factor)[] units)
        => units.ToDictionary(u => u.Unit, u => u.Factor, StringComparer.OrdinalIgnoreCase);
}
