using CdsNatremia.Scenarios;

namespace CdsNatremia.Cli.Replay;

/// <summary>
/// Compares a replayed answer with what the scenario manifest expects: a card or none; for the patient-view and result
/// hooks, the sodium assessment card's severity band (the summary names it, e.g. "(profound") and indicator; for the
/// order hooks, a card with the expected indicator.
/// </summary>
internal static class ScenarioExpectation
{
    /// <summary>Every way the answer differs from the manifest; empty when it matches.</summary>
    public static IReadOnlyList<string> Check(Scenario scenario, ReplayResult result)
    {
        ArgumentNullException.ThrowIfNull(scenario);
        ArgumentNullException.ThrowIfNull(result);
        var problems = new List<string>();
        if (result.Status != 200)
        {
            problems.Add($"expected HTTP 200, got {result.Status}");
            return problems;
        }

        if (scenario.Hook is not ("patient-view" or "result"))
        {
            if (scenario.ExpectsCard && result.Cards.Count == 0)
            {
                problems.Add("expected a card, got none");
            }
            else if (scenario.ExpectsCard && scenario.ExpectedIndicator is { } expected
                && result.Cards.All(c => (string?)c?["indicator"] != expected))
            {
                problems.Add($"expected a card with indicator {expected}, got {string.Join(", ", result.Cards.Select(c => (string?)c?["indicator"]))}");
            }

            return problems;
        }

        var card = result.AssessmentCard;
        if (!scenario.ExpectsCard)
        {
            if (card is not null)
            {
                problems.Add($"expected no assessment card, got \"{(string?)card["summary"]}\"");
            }

            return problems;
        }

        if (card is null)
        {
            problems.Add("expected a sodium assessment card, got none");
            return problems;
        }

        var summary = (string?)card["summary"] ?? string.Empty;
        if (scenario.ExpectedBand is { } band && !summary.Contains("(" + band, StringComparison.Ordinal))
        {
            problems.Add($"expected the {band} band, the summary reads \"{summary}\"");
        }

        if (scenario.ExpectedIndicator is { } indicator && (string?)card["indicator"] != indicator)
        {
            problems.Add($"expected indicator {indicator}, got {(string?)card["indicator"]}");
        }

        return problems;
    }
}
