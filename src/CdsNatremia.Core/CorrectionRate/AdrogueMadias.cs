namespace CdsNatremia.Core.CorrectionRate;

/// <summary>
/// The Adrogué–Madias formula (Adrogué &amp; Madias, N Engl J Med 2000;342:1581; reference sheet: formula verified in
/// secondary sources): the change in serum sodium after one litre of an infusate is
/// (infusate sodium + infusate potassium − serum sodium) / (total body water + 1), all in mmol/L and litres.
/// A smaller volume is scaled linearly, as the formula's users commonly do. It assumes no other gains or losses of water
/// or salt (urine output in particular), so the real change can be larger. Pure.
/// </summary>
public static class AdrogueMadias
{
    /// <summary>Change in serum sodium, mmol/L, per litre of infusate.</summary>
    /// <param name="infusateSodium">Infusate sodium, mmol/L.</param>
    /// <param name="infusatePotassium">Infusate potassium, mmol/L.</param>
    /// <param name="serumSodium">Serum sodium now, mmol/L.</param>
    /// <param name="totalBodyWaterLitres">Total body water, L (must be positive).</param>
    public static double ChangePerLitre(double infusateSodium, double infusatePotassium, double serumSodium, double totalBodyWaterLitres)
    {
        Guard.Finite(infusateSodium, nameof(infusateSodium));
        Guard.Finite(infusatePotassium, nameof(infusatePotassium));
        Guard.Finite(serumSodium, nameof(serumSodium));
        if (!(totalBodyWaterLitres > 0) || !double.IsFinite(totalBodyWaterLitres))
        {
            throw new ArgumentOutOfRangeException(nameof(totalBodyWaterLitres), totalBodyWaterLitres, "Total body water must be a positive number of litres.");
        }

        return (infusateSodium + infusatePotassium - serumSodium) / (totalBodyWaterLitres + 1);
    }

    /// <summary>Change in serum sodium, mmol/L, for a volume in mL, scaling the per-litre change linearly.</summary>
    public static double ChangeForVolume(double changePerLitre, double volumeMilliliters)
    {
        Guard.Finite(changePerLitre, nameof(changePerLitre));
        if (!(volumeMilliliters >= 0) || !double.IsFinite(volumeMilliliters))
        {
            throw new ArgumentOutOfRangeException(nameof(volumeMilliliters), volumeMilliliters, "Volume must be zero or more millilitres.");
        }

        return changePerLitre * volumeMilliliters / 1000;
    }
}
