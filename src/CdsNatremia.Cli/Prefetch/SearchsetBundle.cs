using System.Globalization;
using System.Text.Json.Nodes;

namespace CdsNatremia.Cli.Prefetch;

/// <summary>Writes a <see cref="SearchOutcome"/> as a FHIR searchset Bundle, one page at a time.</summary>
internal static class SearchsetBundle
{
    /// <summary>Parameter our loopback FHIR server uses for the offset of a page (our own name; FHIR leaves paging to the server).</summary>
    public const string OffsetParameter = "_page-offset";

    /// <summary>
    /// A page of results: matches from <paramref name="offset"/>, at most the query's <c>_count</c>, with included
    /// resources, an OperationOutcome entry listing unsupported parameters, and self/next links when a base URL is given.
    /// </summary>
    public static JsonObject Page(FhirQuery query, SearchOutcome outcome, int offset = 0, string? baseUrl = null)
    {
        ArgumentNullException.ThrowIfNull(query);
        ArgumentNullException.ThrowIfNull(outcome);
        var size = outcome.PageSize ?? int.MaxValue;
        var page = outcome.Matches.Skip(offset).Take(size).ToList();
        var entries = new JsonArray();
        foreach (var resource in page)
        {
            entries.Add(Entry(resource, "match", baseUrl));
        }

        foreach (var resource in outcome.Included)
        {
            entries.Add(Entry(resource, "include", baseUrl));
        }

        if (outcome.Unsupported.Count > 0)
        {
            var issues = new JsonArray(outcome.Unsupported.Select(u => (JsonNode)new JsonObject
            {
                ["severity"] = "warning",
                ["code"] = "not-supported",
                ["diagnostics"] = u,
            }).ToArray());
            entries.Add(new JsonObject
            {
                ["resource"] = new JsonObject { ["resourceType"] = "OperationOutcome", ["issue"] = issues },
                ["search"] = new JsonObject { ["mode"] = "outcome" },
            });
        }

        var bundle = new JsonObject
        {
            ["resourceType"] = "Bundle",
            ["type"] = "searchset",
            ["total"] = outcome.Matches.Count,
        };
        if (baseUrl is not null)
        {
            var links = new JsonArray { Link("self", baseUrl, query, offset) };
            if (offset + page.Count < outcome.Matches.Count && page.Count > 0)
            {
                links.Add(Link("next", baseUrl, query, offset + page.Count));
            }

            bundle["link"] = links;
        }

        if (entries.Count > 0)
        {
            bundle["entry"] = entries;
        }

        return bundle;
    }

    private static JsonObject Entry(JsonObject resource, string mode, string? baseUrl)
    {
        var entry = new JsonObject();
        if (baseUrl is not null)
        {
            entry["fullUrl"] = $"{baseUrl.TrimEnd('/')}/{FhirSearchEvaluator.TypeOf(resource)}/{FhirSearchEvaluator.IdOf(resource)}";
        }

        entry["resource"] = resource.DeepClone();
        entry["search"] = new JsonObject { ["mode"] = mode };
        return entry;
    }

    private static JsonObject Link(string relation, string baseUrl, FhirQuery query, int offset)
    {
        var parameters = query.Parameters.Where(p => p.Key != OffsetParameter).ToList();
        if (offset > 0)
        {
            parameters.Add(new(OffsetParameter, offset.ToString(CultureInfo.InvariantCulture)));
        }

        return new JsonObject { ["relation"] = relation, ["url"] = $"{baseUrl.TrimEnd('/')}/{query with { Parameters = parameters }}" };
    }
}
