namespace CdsNatremia.Cli.Conformance;

/// <summary>The outcome of a conformance run.</summary>
/// <param name="Violations">Every violation found, in the order found.</param>
/// <param name="ServicesChecked">Services listed by discovery.</param>
/// <param name="RequestsSent">Hook requests sent (scenarios plus the 412 probes).</param>
/// <param name="Notes">Things not checked, and why.</param>
internal sealed record ConformanceReport(IReadOnlyList<Violation> Violations, int ServicesChecked, int RequestsSent, IReadOnlyList<string> Notes)
{
    /// <summary>True when nothing broke a rule.</summary>
    public bool Passed => Violations.Count == 0;
}
