using System.Text.Json;
using CdsNatremia.Service.Hooks;
using Microsoft.AspNetCore.Http.HttpResults;

namespace CdsNatremia.Service.Endpoints;

/// <summary>
/// The checks every POST under /cds-services/{id} starts with, in one place so the hook and feedback endpoints answer
/// the same way: unknown service → 404, not JSON → 415, malformed, too deep or holding undecodable text → 400.
/// </summary>
internal static class CdsRequestReader
{
    /// <summary>The service and the parsed body (the caller disposes it), or the problem to answer with.</summary>
    public static async Task<(ServiceDefinition? Service, JsonDocument? Body, ProblemHttpResult? Problem)> ReadAsync(
        string id, HttpRequest http, ServiceCatalog catalog, int maxDepth, CancellationToken cancellationToken)
    {
        var service = catalog.Find(id);
        if (service is null)
        {
            return (null, null, Problems.Of(StatusCodes.Status404NotFound, "Unknown service", [$"No CDS service has the id '{Clip(id)}'. GET /cds-services lists the services."]));
        }

        if (!http.HasJsonContentType())
        {
            return (service, null, Problems.Of(StatusCodes.Status415UnsupportedMediaType, "Unsupported media type", ["The request body must be JSON (Content-Type: application/json)."]));
        }

        try
        {
            var document = await JsonDocument.ParseAsync(http.Body, new JsonDocumentOptions { MaxDepth = maxDepth }, cancellationToken).ConfigureAwait(false);
            if (!JsonStrings.AllDecodable(document.RootElement))
            {
                document.Dispose();
                return (service, null, Problems.Of(StatusCodes.Status400BadRequest, "Malformed JSON", ["The request body holds a string with an invalid Unicode escape (a lone UTF-16 surrogate such as \\ud800)."]));
            }

            return (service, document, null);
        }
        catch (JsonException ex)
        {
            var where = ex.LineNumber is { } line ? $" (line {line + 1}, position {ex.BytePositionInLine + 1})" : string.Empty;
            var depth = ex.Message.Contains("depth", StringComparison.OrdinalIgnoreCase) ? $" JSON nesting deeper than {maxDepth} levels is refused." : string.Empty;
            return (service, null, Problems.Of(StatusCodes.Status400BadRequest, "Malformed JSON", [$"The request body is not valid JSON{where}.{depth}"]));
        }
    }

    private static string Clip(string text) => text.Length <= 64 ? text : text[..64] + "…";
}
