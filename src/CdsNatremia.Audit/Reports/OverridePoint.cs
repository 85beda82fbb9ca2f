namespace CdsNatremia.Audit.Reports;

/// <summary>One time bucket of a rule's series.</summary>
/// <param name="Start">Start of the bucket (UTC).</param>
/// <param name="Shown">Cards of the rule issued in the bucket.</param>
/// <param name="Overridden">Of those, cards overridden.</param>
public sealed record OverridePoint(DateTimeOffset Start, int Shown, int Overridden)
{
    /// <summary>Overridden ÷ shown, or null when nothing was shown in the bucket.</summary>
    public double? OverrideRate => Shown == 0 ? null : (double)Overridden / Shown;
}
