using System.Text.Json;
using CdsNatremia.Scenarios;

namespace CdsNatremia.Cli.Replay;

/// <summary>What a field comparison reads: the scenario, the field's expected value, and the answer's cards.</summary>
/// <param name="Scenario">The scenario replayed.</param>
/// <param name="Expected">The manifest's value of the field.</param>
/// <param name="Answer">The answer's cards and their text.</param>
internal sealed record FieldCheck(Scenario Scenario, JsonElement Expected, AnswerText Answer)
{
    /// <summary>True for the order hooks, whose answer has no sodium assessment card.</summary>
    public bool IsOrderHook => Scenario.Hook is not ("patient-view" or "result");
}
