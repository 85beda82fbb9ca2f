using System.Globalization;

namespace CdsNatremia.Core;

/// <summary>Culture-invariant formatting: a clinical number must read the same on every server.</summary>
public static class Invariant
{
    /// <summary>Formats an interpolated string with the invariant culture.</summary>
    public static string Format(FormattableString text) => Guard.NotNull(text, nameof(text)).ToString(CultureInfo.InvariantCulture);

    /// <summary>
    /// A clinical number printed with the precision it was used with (<see cref="Text.ClinicalNumber.Format"/>): 124,
    /// 124.5, 0.45. Round a computed result explicitly before printing it.
    /// </summary>
    public static string Number(double value) => Text.ClinicalNumber.Format(value);
}
