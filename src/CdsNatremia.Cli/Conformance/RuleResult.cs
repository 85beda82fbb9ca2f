namespace CdsNatremia.Cli.Conformance;

/// <summary>One rule of the standard and how the service fared on it in a run.</summary>
/// <param name="Rule">Our identifier of the rule, e.g. "card.summary.length".</param>
/// <param name="Requirement">The rule as the standard states it.</param>
/// <param name="Checks">How many places it was checked (cards, suggestions, actions, responses...).</param>
/// <param name="Violations">How many of those broke it.</param>
/// <param name="Result">"pass", "fail", or "not exercised" (nothing the service sent was subject to it, e.g. no links).</param>
internal sealed record RuleResult(string Rule, string Requirement, int Checks, int Violations, string Result);
