using System.Text.Json.Nodes;

namespace CdsNatremia.Scenarios;

/// <summary>
/// Turns a scenario into a CDS Hooks request with full prefetch, splitting the Bundle by the service's prefetch keys
/// (patient, sodium, labs, weight, conditions, medicationStatements, medicationRequests).
/// </summary>
public static class HookRequestBuilder
{
    private static readonly HashSet<string> SodiumCodes = ["2951-2", "2947-0", "32717-1", "39791-9", "39792-7", "77139-4"];

    /// <summary>Builds the request body for a hook name; dates are shifted by <paramref name="shift"/>.</summary>
    public static JsonObject Build(Scenario scenario, string hookName, TimeSpan shift, Guid hookInstance, bool includePrefetch = true)
    {
        ArgumentNullException.ThrowIfNull(scenario);
        var bundle = JsonNode.Parse(DateShifter.Shift(scenario.BundleJson, shift))!.AsObject();
        var context = new JsonObject { ["userId"] = "Practitioner/demo-clinician", ["patientId"] = scenario.PatientId };
        var entries = bundle["entry"]?.AsArray().Select(e => e!["resource"]!.AsObject()).ToList() ?? [];
        if (scenario.Hook == "result")
        {
            var results = entries.Where(r => scenario.NewResultIds.Contains((string?)r["id"] ?? string.Empty)).ToList();
            context["results"] = Bundle("collection", results);
        }

        if (scenario.DraftOrdersJson is { } drafts)
        {
            context["draftOrders"] = JsonNode.Parse(DateShifter.Shift(drafts, shift));
            if (scenario.Hook == "order-select")
            {
                context["selections"] = new JsonArray(scenario.Selections.Select(s => (JsonNode)JsonValue.Create(s)).ToArray());
            }
        }

        var request = new JsonObject
        {
            ["hookInstance"] = hookInstance.ToString(),
            ["hook"] = hookName,
            ["context"] = context,
        };
        if (includePrefetch)
        {
            request["prefetch"] = Prefetch(entries);
        }

        return request;
    }

    /// <summary>Splits resources into the service's prefetch keys, each a searchset Bundle.</summary>
    public static JsonObject Prefetch(IReadOnlyList<JsonObject> resources)
    {
        ArgumentNullException.ThrowIfNull(resources);
        var patient = resources.FirstOrDefault(r => (string?)r["resourceType"] == "Patient");
        string? CodeOf(JsonObject r) => r["code"]?["coding"]?.AsArray().Select(c => (string?)c?["code"]).FirstOrDefault();
        bool IsObservation(JsonObject r) => (string?)r["resourceType"] == "Observation";
        return new JsonObject
        {
            ["patient"] = patient?.DeepClone(),
            ["sodium"] = Bundle("searchset", resources.Where(r => IsObservation(r) && SodiumCodes.Contains(CodeOf(r) ?? string.Empty))),
            ["labs"] = Bundle("searchset", resources.Where(r => IsObservation(r) && !SodiumCodes.Contains(CodeOf(r) ?? string.Empty) && CodeOf(r) != "29463-7")),
            ["weight"] = Bundle("searchset", resources.Where(r => IsObservation(r) && CodeOf(r) == "29463-7")),
            ["conditions"] = Bundle("searchset", resources.Where(r => (string?)r["resourceType"] == "Condition")),
            ["medicationStatements"] = Bundle("searchset", resources.Where(r => (string?)r["resourceType"] is "MedicationStatement" or "Medication")),
            ["medicationRequests"] = Bundle("searchset", resources.Where(r => (string?)r["resourceType"] is "MedicationRequest" or "Medication")),
        };
    }

    private static JsonObject Bundle(string type, IEnumerable<JsonObject> resources)
    {
        var entries = new JsonArray();
        foreach (var resource in resources)
        {
            entries.Add(new JsonObject
            {
                ["fullUrl"] = $"urn:uuid:{DeterministicGuid((string?)resource["resourceType"] + "/" + (string?)resource["id"])}",
                ["resource"] = resource.DeepClone(),
            });
        }

        var bundle = new JsonObject { ["resourceType"] = "Bundle", ["type"] = type };
        if (entries.Count > 0)
        {
            bundle["entry"] = entries;
        }

        return bundle;
    }

    private static Guid DeterministicGuid(string text)
    {
        var hash = System.Security.Cryptography.SHA256.HashData(System.Text.Encoding.UTF8.GetBytes(text));
        return new Guid(hash.AsSpan(0, 16));
    }
}
