namespace CdsNatremia.Cli.Conformance;

/// <summary>How many times each rule was checked in a conformance run: the evidence behind "no violation".</summary>
internal sealed class RuleTally
{
    private readonly Dictionary<string, int> _checks = new(StringComparer.Ordinal);

    /// <summary>Checks per rule id (rules never checked are absent).</summary>
    public IReadOnlyDictionary<string, int> Checks => _checks;

    /// <summary>Notes one check of <paramref name="rule"/> (whatever its outcome).</summary>
    public void Checked(string rule)
    {
        if (!ConformanceRules.Text.ContainsKey(rule))
        {
            throw new ArgumentException($"No conformance rule '{rule}'.", nameof(rule));
        }

        _checks[rule] = _checks.GetValueOrDefault(rule) + 1;
    }
}
