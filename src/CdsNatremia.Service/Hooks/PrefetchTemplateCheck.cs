using System.Text.Json;
using CdsNatremia.Core.Engine;

namespace CdsNatremia.Service.Hooks;

/// <summary>
/// Whether a prefetch value holds what its template asks for (<see cref="PrefetchKeys.Templates"/>): a read
/// ("Patient/{{context.patientId}}") asks for that resource type; a search ("Observation?…") asks for a Bundle of
/// that type (OperationOutcome entries, entries the server marks as search mode "include", and the Medication of a
/// medication search may come with it), or,
/// tolerated, a single resource of that type. A Patient, a Binary, an unknown resourceType or a Bundle of other types
/// under "sodium" is not the sodium series, whatever it contains: the caller treats it as absent.
/// </summary>
public static class PrefetchTemplateCheck
{
    /// <summary>
    /// Types a search may bring along besides its own: the Medication a MedicationRequest or MedicationStatement
    /// references (EHRs commonly include it, with or without search mode "include").
    /// </summary>
    private static readonly Dictionary<string, string[]> Companions = new(StringComparer.Ordinal)
    {
        ["MedicationRequest"] = ["Medication"],
        ["MedicationStatement"] = ["Medication"],
    };

    /// <summary>The resource type a key's template asks for, and whether it is a search (answered by a Bundle).</summary>
    public static (string Type, bool Search)? Expected(string key)
    {
        if (!PrefetchKeys.Templates.TryGetValue(key, out var template))
        {
            return null;
        }

        var end = template.IndexOfAny(['/', '?']);
        return end <= 0 ? null : (template[..end], template[end] == '?');
    }

    /// <summary>Null when the value fits the key's template (or is null, absent or not a JSON object: other checks say so); otherwise why not.</summary>
    public static string? Problem(string key, JsonElement value)
    {
        if (Expected(key) is not { } expected || value.ValueKind != JsonValueKind.Object)
        {
            return null;
        }

        var type = TypeOf(value);
        if (type is null or "OperationOutcome" || type == expected.Type)
        {
            return null; // missing resourceType and OperationOutcome are reported by the reader
        }

        var asked = expected.Search ? $"a Bundle of {expected.Type} (a search)" : $"a {expected.Type}";
        if (type != "Bundle")
        {
            return $"holds a {Clip(type)}, but its template asks for {asked}";
        }

        if (!value.TryGetProperty("entry", out var entries) || entries.ValueKind != JsonValueKind.Array)
        {
            return null; // an empty Bundle (or a malformed one, which the reader reports)
        }

        var others = new SortedSet<string>(StringComparer.Ordinal);
        foreach (var entry in entries.EnumerateArray())
        {
            if (entry.ValueKind != JsonValueKind.Object || !entry.TryGetProperty("resource", out var resource) || resource.ValueKind != JsonValueKind.Object)
            {
                continue; // reported per entry by the reader
            }

            var entryType = TypeOf(resource);
            if (entryType is null || entryType == expected.Type || entryType == "OperationOutcome" || IsIncluded(entry)
                || (Companions.TryGetValue(expected.Type, out var companions) && companions.Contains(entryType, StringComparer.Ordinal)))
            {
                continue;
            }

            others.Add(Clip(entryType));
        }

        return others.Count == 0
            ? null
            : $"is a Bundle holding {string.Join(", ", others.Take(5))}, but its template asks for {asked}";
    }

    private static bool IsIncluded(JsonElement entry)
        => entry.TryGetProperty("search", out var search) && search.ValueKind == JsonValueKind.Object
           && search.TryGetProperty("mode", out var mode) && mode.ValueKind == JsonValueKind.String && mode.GetString() == "include";

    private static string? TypeOf(JsonElement resource)
        => resource.TryGetProperty("resourceType", out var rt) && rt.ValueKind == JsonValueKind.String ? rt.GetString() : null;

    private static string Clip(string text) => text.Length <= 40 ? text : text[..40] + "…";
}
