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

    /// <summary>How many times each rule was checked.</summary>
    public IReadOnlyDictionary<string, int> Checks { get; init; } = new Dictionary<string, int>();

    /// <summary>Every rule of <see cref="ConformanceRules"/>, in its order, with its checks, violations and result.</summary>
    public IReadOnlyList<RuleResult> Rules => ConformanceRules.Text.Select(rule =>
    {
        var checks = Checks.GetValueOrDefault(rule.Key);
        var violations = Violations.Count(v => v.Rule == rule.Key);
        var result = violations > 0 ? "fail" : checks > 0 ? "pass" : "not exercised";
        return new RuleResult(rule.Key, rule.Value, checks, violations, result);
    }).ToList();
}
