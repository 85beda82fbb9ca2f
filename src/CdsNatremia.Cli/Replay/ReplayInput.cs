using System.Text.Json.Nodes;
using CdsNatremia.Cli.Prefetch;
using CdsNatremia.Scenarios;

namespace CdsNatremia.Cli.Replay;

/// <summary>
/// A patient's data to replay: the resources of a Bundle (dates already moved to the replay's "now"), who the patient is,
/// and the hook-specific parts (draft orders, selections, newly arrived results).
/// </summary>
internal sealed record ReplayInput
{
    /// <summary>The user the EHR would name in context.userId.</summary>
    public const string DefaultUserId = "Practitioner/toolkit-clinician";

    /// <summary>Where the input came from (scenario id or file name).</summary>
    public required string Name { get; init; }

    /// <summary>The scenario's hook ("patient-view", "result", "order-select", "order-sign"), when known.</summary>
    public string? ScenarioHook { get; init; }

    /// <summary>The patient's logical id.</summary>
    public required string PatientId { get; init; }

    /// <summary>Every resource of the patient's Bundle.</summary>
    public required IReadOnlyList<JsonObject> Resources { get; init; }

    /// <summary>Draft orders (a Bundle) for the order hooks.</summary>
    public JsonObject? DraftOrders { get; init; }

    /// <summary>Selected draft orders for order-select.</summary>
    public IReadOnlyList<string> Selections { get; init; } = [];

    /// <summary>Ids of the Observations that just arrived, for the result hook.</summary>
    public IReadOnlyList<string> NewResultIds { get; init; } = [];

    /// <summary>The scenario, when the input is one.</summary>
    public Scenario? Scenario { get; init; }

    /// <summary>A scenario with its dates moved by <paramref name="shift"/>.</summary>
    public static ReplayInput FromScenario(Scenario scenario, TimeSpan shift)
    {
        ArgumentNullException.ThrowIfNull(scenario);
        var bundle = JsonNode.Parse(DateShifter.Shift(scenario.BundleJson, shift))!;
        return new ReplayInput
        {
            Name = scenario.Id,
            ScenarioHook = scenario.Hook,
            PatientId = scenario.PatientId,
            Resources = FhirSearchEvaluator.ResourcesOf(bundle),
            DraftOrders = scenario.DraftOrdersJson is { } drafts ? JsonNode.Parse(DateShifter.Shift(drafts, shift))!.AsObject() : null,
            Selections = scenario.Selections,
            NewResultIds = scenario.NewResultIds,
            Scenario = scenario,
        };
    }

    /// <summary>
    /// A Bundle from a file. The patient is <paramref name="patientId"/> or the Bundle's only Patient; without
    /// <paramref name="resultIds"/> the result hook takes the newest Observation as the one that arrived.
    /// </summary>
    public static ReplayInput FromBundle(string name, string bundleJson, string? patientId, string? draftOrdersJson, IReadOnlyList<string> selections, IReadOnlyList<string> resultIds, TimeSpan shift)
    {
        JsonNode? bundle;
        try
        {
            bundle = JsonNode.Parse(shift == TimeSpan.Zero ? bundleJson : DateShifter.Shift(bundleJson, shift));
        }
        catch (System.Text.Json.JsonException ex)
        {
            throw new ToolException(ExitCodes.Usage, $"{name} is not JSON: {ex.Message}");
        }

        if (bundle is not JsonObject root || (string?)root["resourceType"] != "Bundle")
        {
            throw new ToolException(ExitCodes.Usage, $"{name} is not a FHIR Bundle.");
        }

        var resources = FhirSearchEvaluator.ResourcesOf(root);
        var patients = resources.Where(r => FhirSearchEvaluator.TypeOf(r) == "Patient").Select(FhirSearchEvaluator.IdOf).OfType<string>().ToList();
        var patient = patientId ?? (patients.Count == 1 ? patients[0] : throw new ToolException(ExitCodes.Usage,
            $"{name} holds {patients.Count} Patient resources; name the patient with --patient."));
        var newest = resources
            .Where(r => FhirSearchEvaluator.TypeOf(r) == "Observation")
            .OrderByDescending(r => (string?)r["effectiveDateTime"] ?? (string?)r["issued"] ?? string.Empty, StringComparer.Ordinal)
            .Select(FhirSearchEvaluator.IdOf)
            .OfType<string>()
            .Take(1)
            .ToList();
        return new ReplayInput
        {
            Name = name,
            PatientId = patient,
            Resources = resources,
            DraftOrders = draftOrdersJson is null ? null : JsonNode.Parse(shift == TimeSpan.Zero ? draftOrdersJson : DateShifter.Shift(draftOrdersJson, shift))?.AsObject(),
            Selections = selections,
            NewResultIds = resultIds.Count > 0 ? resultIds : newest,
        };
    }
}
