using System.Text.Json.Nodes;

namespace CdsNatremia.Cli.Replay;

/// <summary>Reads a CDS Hooks discovery document (GET {base}/cds-services).</summary>
internal static class Discovery
{
    /// <summary>Fetches and reads the services; throws <see cref="ToolException"/> when the document cannot be used.</summary>
    public static async Task<IReadOnlyList<DiscoveredService>> GetAsync(HttpClient client, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(client);
        using var response = await client.GetAsync(new Uri("cds-services", UriKind.Relative), cancellationToken).ConfigureAwait(false);
        var text = await response.Content.ReadAsStringAsync(cancellationToken).ConfigureAwait(false);
        if (!response.IsSuccessStatusCode)
        {
            throw new ToolException(ExitCodes.ServiceError, $"Discovery answered HTTP {(int)response.StatusCode}.");
        }

        return Read(text);
    }

    /// <summary>Reads the services of a discovery document's text, skipping entries without id or hook.</summary>
    public static IReadOnlyList<DiscoveredService> Read(string text)
    {
        JsonNode? root;
        try
        {
            root = JsonNode.Parse(text);
        }
        catch (System.Text.Json.JsonException ex)
        {
            throw new ToolException(ExitCodes.ServiceError, "Discovery did not answer JSON: " + ex.Message);
        }

        if (root?["services"] is not JsonArray services)
        {
            throw new ToolException(ExitCodes.ServiceError, "Discovery has no 'services' array.");
        }

        var list = new List<DiscoveredService>();
        foreach (var service in services.OfType<JsonObject>())
        {
            if (Text(service["id"]) is not { } id || Text(service["hook"]) is not { } hook)
            {
                continue;
            }

            var prefetch = new Dictionary<string, string>(StringComparer.Ordinal);
            if (service["prefetch"] is JsonObject templates)
            {
                foreach (var (key, value) in templates)
                {
                    if (Text(value) is { } template)
                    {
                        prefetch[key] = template;
                    }
                }
            }

            list.Add(new DiscoveredService(id, hook, Text(service["title"]), prefetch));
        }

        return list;
    }

    private static string? Text(JsonNode? node) => node is JsonValue v && v.TryGetValue<string>(out var s) && s.Length > 0 ? s : null;
}
