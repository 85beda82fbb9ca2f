namespace CdsNatremia.Cli.Conformance;

/// <summary>One place where a service breaks a rule of the CDS Hooks 2.0 standard.</summary>
/// <param name="Rule">Our identifier of the rule, e.g. "card.summary.length".</param>
/// <param name="Requirement">The rule as the standard states it.</param>
/// <param name="Where">What was checked: "discovery", or "natremia-chart-review / 01-… / cards[0].summary".</param>
/// <param name="Found">What was found instead.</param>
internal sealed record Violation(string Rule, string Requirement, string Where, string Found);
