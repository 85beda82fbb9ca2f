using System.Text.Json;
using CdsNatremia.Core.Facts;
using Hl7.Fhir.Model;

namespace CdsNatremia.Fhir.Reading;

/// <summary>
/// Reads a prefetch value (or a fetched search result): null, a Bundle, a single resource, or an OperationOutcome.
/// A Bundle is split into entries and each resource is parsed on its own, so one bad entry is set aside without
/// losing the others. Each resource is parsed from the request's own UTF-8 bytes (no copy to a string and back).
/// OperationOutcome entries (search mode "outcome") become notes, never data. With a <see cref="FastResourceReader"/>,
/// each resource is first offered to it; what it does not take (anything outside its scope) is parsed by the SDK as before.
/// </summary>
public sealed class BundleReader
{
    private readonly ResourceParser _parser;
    private readonly FastResourceReader? _fast;

    /// <summary>Creates a reader over a shared parser, and optionally the fast reader tried first for each resource.</summary>
    public BundleReader(ResourceParser parser, FastResourceReader? fast = null)
    {
        _parser = parser ?? throw new ArgumentNullException(nameof(parser));
        _fast = fast;
    }

    /// <summary>True when resources are offered to the fast reader first.</summary>
    public bool UsesFastReader => _fast is not null;

    /// <summary>The fast reader's model objects when it takes the resource, else the SDK's outcome.</summary>
    private Resource? Parse(JsonElement raw, out string? problem)
    {
        if (_fast?.TryRead(raw) is { } fast)
        {
            problem = null;
            return fast;
        }

        return _parser.TryParse(raw, out problem);
    }

    /// <summary>
    /// Reads one value: a prefetch key, a fetched query, or a hook context field (<paramref name="key"/> is then the field
    /// name). Problems name where the value came from: "prefetch 'sodium'", "FHIR server query 'sodium'", "context 'draftOrders'".
    /// </summary>
    public PrefetchValue Read(string key, JsonElement value, DataOrigin origin)
    {
        var source = origin switch
        {
            DataOrigin.FhirServer => $"FHIR server query '{key}'",
            DataOrigin.Context => $"context '{key}'",
            _ => $"prefetch '{key}'",
        };
        if (value.ValueKind is JsonValueKind.Null or JsonValueKind.Undefined)
        {
            return new PrefetchValue(key, PrefetchValueKind.Empty, [], []);
        }

        if (value.ValueKind != JsonValueKind.Object)
        {
            return Unusable(key, $"{source} is a JSON {value.ValueKind.ToString().ToLowerInvariant()}, not a FHIR resource");
        }

        var type = value.TryGetProperty("resourceType", out var rt) && rt.ValueKind == JsonValueKind.String ? rt.GetString() : null;
        switch (type)
        {
            case null:
                return Unusable(key, $"{source} has no resourceType");
            case "OperationOutcome":
                return new PrefetchValue(key, PrefetchValueKind.Failed, [], [$"{source}: the EHR returned an OperationOutcome{Diagnostics(value)}"]);
            case "Bundle":
                return ReadBundle(key, source, value, origin);
            default:
                var single = Parse(value, out var problem);
                return single is null
                    ? Unusable(key, $"{source}: the {type} could not be read as FHIR R4 ({problem})")
                    : new PrefetchValue(key, PrefetchValueKind.Data, [new ParsedResource(single, null, source, origin)], []);
        }
    }

    private PrefetchValue ReadBundle(string key, string source, JsonElement bundle, DataOrigin origin)
    {
        var resources = new List<ParsedResource>();
        var problems = new List<string>();
        var unreadable = new List<UnreadableObservation>();
        if (bundle.TryGetProperty("entry", out var entries))
        {
            if (entries.ValueKind != JsonValueKind.Array)
            {
                return Unusable(key, $"{source}: Bundle.entry is not an array");
            }

            var index = 0;
            foreach (var entry in entries.EnumerateArray())
            {
                ReadEntry(source, entry, index++, origin, resources, problems, unreadable);
            }
        }

        var next = NextLink(bundle);
        var kind = resources.Count > 0 || unreadable.Count > 0 ? PrefetchValueKind.Data : PrefetchValueKind.Empty;
        return new PrefetchValue(key, kind, resources, problems, next) { UnreadableObservations = unreadable };
    }

    private void ReadEntry(
        string source,
        JsonElement entry,
        int index,
        DataOrigin origin,
        List<ParsedResource> resources,
        List<string> problems,
        List<UnreadableObservation> unreadable)
    {
        if (entry.ValueKind != JsonValueKind.Object || !entry.TryGetProperty("resource", out var raw) || raw.ValueKind != JsonValueKind.Object)
        {
            problems.Add($"{source}: entry {index} has no resource");
            return;
        }

        var fullUrl = entry.TryGetProperty("fullUrl", out var fu) && fu.ValueKind == JsonValueKind.String ? fu.GetString() : null;
        var resource = Parse(raw, out var problem);
        if (resource is null)
        {
            var type = raw.TryGetProperty("resourceType", out var rt) && rt.ValueKind == JsonValueKind.String ? rt.GetString() : "resource";
            var id = raw.TryGetProperty("id", out var rid) && rid.ValueKind == JsonValueKind.String ? $"{type}/{rid.GetString()}" : $"entry {index}";
            if (type == "Observation")
            {
                // Kept as a set-aside result (not only a note) so the rules know a result of that analyte and time exists
                // and could not be read: "the newest sodium could not be read" must never become silence.
                unreadable.Add(UnreadableObservation.From(raw, id, $"it could not be read as FHIR R4 ({problem})"));
                return;
            }

            // Whose it is cannot be told from a resource that did not parse, so neither its id nor the parser's words
            // (which may quote its values) are shown: another patient's data is never printed.
            problems.Add($"{source}: a {type} entry could not be read as FHIR R4; not used");
            return;
        }

        if (resource is OperationOutcome outcome)
        {
            var text = string.Join("; ", outcome.Issue.Select(i => i.Diagnostics ?? i.Details?.Text).Where(t => !string.IsNullOrWhiteSpace(t)).Take(3));
            problems.Add($"{source}: the server added an OperationOutcome{(text.Length > 0 ? ": " + text : string.Empty)}");
            return;
        }

        resources.Add(new ParsedResource(resource, fullUrl, source, origin));
    }

    private static string? NextLink(JsonElement bundle)
    {
        if (!bundle.TryGetProperty("link", out var links) || links.ValueKind != JsonValueKind.Array)
        {
            return null;
        }

        foreach (var link in links.EnumerateArray())
        {
            if (link.ValueKind == JsonValueKind.Object
                && link.TryGetProperty("relation", out var rel) && rel.ValueKind == JsonValueKind.String && rel.GetString() == "next"
                && link.TryGetProperty("url", out var url) && url.ValueKind == JsonValueKind.String)
            {
                return url.GetString();
            }
        }

        return null;
    }

    private static string Diagnostics(JsonElement outcome)
    {
        if (!outcome.TryGetProperty("issue", out var issues) || issues.ValueKind != JsonValueKind.Array)
        {
            return string.Empty;
        }

        var texts = issues.EnumerateArray()
            .Select(i => i.ValueKind == JsonValueKind.Object && i.TryGetProperty("diagnostics", out var d) && d.ValueKind == JsonValueKind.String ? d.GetString() : null)
            .Where(t => !string.IsNullOrWhiteSpace(t))
            .Take(3)
            .ToList();
        return texts.Count > 0 ? ": " + string.Join("; ", texts) : string.Empty;
    }

    private static PrefetchValue Unusable(string key, string reason) => new(key, PrefetchValueKind.Unusable, [], [reason]);
}
