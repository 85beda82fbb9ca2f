using System.Text.Json.Nodes;
using CdsNatremia.Cli.Prefetch;
using CdsNatremia.Cli.Replay;
using CdsNatremia.Scenarios;

namespace CdsNatremia.Cli.Tests.Support;

/// <summary>Test data: scenarios as replay inputs at their anchor, small resources for evaluator cases.</summary>
internal static class Inputs
{
    public static ReplayInput Scenario(string id) => ReplayInput.FromScenario(ScenarioLibrary.Find(id)!, TimeSpan.Zero);

    public static IReadOnlyList<ReplayInput> AllScenarios() => ScenarioLibrary.All.Select(s => ReplayInput.FromScenario(s, TimeSpan.Zero)).ToList();

    public static IReadOnlyList<JsonObject> Resources(string scenarioId) => FhirSearchEvaluator.ResourcesOf(JsonNode.Parse(ScenarioLibrary.Find(scenarioId)!.BundleJson)!);

    public static JsonObject Observation(string id, string code, string effective, string status = "final", string patient = "p1", string system = "http://loinc.org")
        => new()
        {
            ["resourceType"] = "Observation",
            ["id"] = id,
            ["status"] = status,
            ["code"] = new JsonObject { ["coding"] = new JsonArray(new JsonObject { ["system"] = system, ["code"] = code }) },
            ["subject"] = new JsonObject { ["reference"] = "Patient/" + patient },
            ["effectiveDateTime"] = effective,
        };

    public static IReadOnlyList<string> Ids(IEnumerable<JsonObject> resources) => resources.Select(r => (string)r["id"]!).ToList();
}
