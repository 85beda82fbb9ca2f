using System.Globalization;

namespace CdsNatremia.Core.Text;

/// <summary>
/// The one formatting rule for clinical numbers on cards: <b>a number shown is the number used</b>. Every factor,
/// threshold and input is printed with the precision the computation used (up to <see cref="MaxDecimals"/> decimals,
/// trailing zeros dropped), so a total body water fraction of 0.45 prints "0.45", never "0.5", and a potassium of 3.45
/// is never printed as the 3.5 it was compared with. A result a card states as rounded is rounded explicitly with
/// <see cref="Rounded"/> before it is printed, and only results are rounded: never an input.
/// Culture-invariant; pure; thread-safe.
/// </summary>
public static class ClinicalNumber
{
    /// <summary>
    /// The most decimals printed: three, finer than any clinical input the service reads (laboratories report sodium to
    /// 0 or 1 decimal, potassium and fractions to 2), so in practice nothing is lost.
    /// </summary>
    public const int MaxDecimals = 3;

    /// <summary>An input, factor or threshold exactly as used, e.g. 0.45, 124, 3.45, 27.9.</summary>
    public static string Format(double value)
    {
        if (!double.IsFinite(value))
        {
            return value.ToString(CultureInfo.InvariantCulture);
        }

        var text = Math.Round(value, MaxDecimals, MidpointRounding.AwayFromZero).ToString("0.###", CultureInfo.InvariantCulture);
        return text == "-0" ? "0" : text;
    }

    /// <summary>A computed result rounded to <paramref name="decimals"/> (away from zero at the midpoint), then printed.</summary>
    public static string Rounded(double value, int decimals)
    {
        if (decimals < 0 || decimals > MaxDecimals)
        {
            throw new ArgumentOutOfRangeException(nameof(decimals), decimals, "Between 0 and 3 decimals.");
        }

        return Format(Math.Round(value, decimals, MidpointRounding.AwayFromZero));
    }
}
