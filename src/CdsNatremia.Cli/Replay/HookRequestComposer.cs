using System.Text.Json.Nodes;
using CdsNatremia.Cli.Prefetch;

namespace CdsNatremia.Cli.Replay;

/// <summary>
/// Builds a CDS Hooks request for any discovered service from a patient's data. The context follows the hook (patient-view,
/// order-select, order-sign, or an organisation-specific result hook carrying a <c>results</c> Bundle); prefetch is filled
/// by evaluating the service's own templates against the Bundle, or left out (optionally with a fhirServer to fetch from).
/// </summary>
internal static class HookRequestComposer
{
    /// <summary>Composes one request.</summary>
    public static ComposedRequest Compose(
        DiscoveredService service,
        ReplayInput input,
        PrefetchMode mode,
        Guid hookInstance,
        Uri? fhirServer = null,
        string? accessToken = null)
    {
        ArgumentNullException.ThrowIfNull(service);
        ArgumentNullException.ThrowIfNull(input);
        var notes = new List<string>();
        var context = new JsonObject { ["userId"] = ReplayInput.DefaultUserId, ["patientId"] = input.PatientId };
        switch (service.Hook)
        {
            case "patient-view":
                break;
            case "order-select" or "order-sign":
                var drafts = (JsonObject?)input.DraftOrders?.DeepClone() ?? DraftOrdersFrom(input.Resources);
                context["draftOrders"] = drafts;
                if (service.Hook == "order-select")
                {
                    var selections = input.Selections.Count > 0
                        ? input.Selections
                        : FhirSearchEvaluator.ResourcesOf(drafts).Select(r => $"{FhirSearchEvaluator.TypeOf(r)}/{FhirSearchEvaluator.IdOf(r)}").ToList();
                    context["selections"] = new JsonArray(selections.Select(s => (JsonNode)JsonValue.Create(s)).ToArray());
                }

                break;
            default:
                if (service.IsResultHook)
                {
                    var ids = input.NewResultIds.ToHashSet(StringComparer.Ordinal);
                    var results = input.Resources.Where(r => FhirSearchEvaluator.TypeOf(r) == "Observation" && ids.Contains(FhirSearchEvaluator.IdOf(r) ?? string.Empty));
                    context["results"] = Collection(results);
                }
                else
                {
                    notes.Add($"Hook '{service.Hook}' is not one this tool knows; only userId and patientId were put in context.");
                }

                break;
        }

        var body = new JsonObject
        {
            ["hookInstance"] = hookInstance.ToString(),
            ["hook"] = service.Hook,
            ["context"] = context,
        };

        var queries = new Dictionary<string, string>(StringComparer.Ordinal);
        switch (mode)
        {
            case PrefetchMode.Evaluate when service.Prefetch.Count > 0:
                body["prefetch"] = Prefetch(service, input, context, notes, queries);
                break;
            case PrefetchMode.FhirServer:
                body["fhirServer"] = (fhirServer ?? throw new ArgumentNullException(nameof(fhirServer))).ToString();
                body["fhirAuthorization"] = new JsonObject
                {
                    ["access_token"] = accessToken ?? throw new ArgumentNullException(nameof(accessToken)),
                    ["token_type"] = "Bearer",
                    ["expires_in"] = 300,
                    ["scope"] = "patient/Patient.read patient/Observation.read patient/Condition.read patient/MedicationStatement.read patient/MedicationRequest.read patient/Medication.read",
                    ["subject"] = "natremia-toolkit",
                    ["patient"] = input.PatientId,
                };
                break;
        }

        return new ComposedRequest(service.Id, body, notes) { PrefetchQueries = queries };
    }

    /// <summary>Evaluates every template of the service against the input's resources.</summary>
    public static JsonObject Prefetch(DiscoveredService service, ReplayInput input, JsonObject context, List<string> notes, Dictionary<string, string>? queries = null)
    {
        ArgumentNullException.ThrowIfNull(service);
        ArgumentNullException.ThrowIfNull(input);
        ArgumentNullException.ThrowIfNull(notes);
        var prefetch = new JsonObject();
        foreach (var (key, template) in service.Prefetch)
        {
            FhirQuery query;
            try
            {
                var text = PrefetchTokens.Substitute(template, context);
                queries?.Add(key, text);
                query = FhirQuery.Parse(text);
            }
            catch (FormatException ex)
            {
                notes.Add($"prefetch '{key}' left out: {ex.Message}");
                continue;
            }

            var outcome = FhirSearchEvaluator.Evaluate(query, input.Resources);
            notes.AddRange(outcome.Unsupported.Select(u => $"prefetch '{key}': {u}"));
            prefetch[key] = query.IsRead
                ? outcome.Matches.FirstOrDefault()?.DeepClone()
                : SearchsetBundle.Page(query, outcome);
            if (input.Scenario?.Misdirected.GetValueOrDefault(key) is { Count: > 0 } misdirected && prefetch[key] is JsonObject bundle)
            {
                // The scenario's EHR wrongly puts these into this key (a search would not return them): send them as it would.
                var entries = bundle["entry"] as JsonArray ?? [];
                bundle["entry"] = entries;
                foreach (var resource in input.Resources.Where(r => misdirected.Contains($"{FhirSearchEvaluator.TypeOf(r)}/{(string?)r["id"]}", StringComparer.Ordinal)))
                {
                    entries.Add(new JsonObject { ["resource"] = resource.DeepClone(), ["search"] = new JsonObject { ["mode"] = "match" } });
                }

                notes.Add($"prefetch '{key}': {misdirected.Count} resource(s) added as the scenario's EHR wrongly sends them");
            }
        }

        return prefetch;
    }

    private static JsonObject DraftOrdersFrom(IReadOnlyList<JsonObject> resources)
        => Collection(resources.Where(r => (string?)r["status"] == "draft" && FhirSearchEvaluator.TypeOf(r) is "MedicationRequest" or "ServiceRequest" or "NutritionOrder"));

    private static JsonObject Collection(IEnumerable<JsonObject> resources)
    {
        var entries = new JsonArray(resources.Select(r => (JsonNode)new JsonObject { ["resource"] = r.DeepClone() }).ToArray());
        var bundle = new JsonObject { ["resourceType"] = "Bundle", ["type"] = "collection" };
        if (entries.Count > 0)
        {
            bundle["entry"] = entries;
        }

        return bundle;
    }
}
