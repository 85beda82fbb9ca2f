using System.Diagnostics;
using OpenTelemetry;

namespace CdsNatremia.Service.Telemetry;

/// <summary>
/// Runs before any exporter: strips from every span what could carry a patient identifier or a credential. An
/// outgoing FHIR call's URL names the patient (<c>Patient/123</c>, <c>?patient=123</c>), so <c>url.full</c> keeps
/// only the server's origin; a server span's path becomes its route template; query strings and database connection
/// strings are dropped.
/// </summary>
internal sealed class TelemetryScrubber : BaseProcessor<Activity>
{
    private static readonly string[] UrlTags = ["url.full", "http.url"];
    private static readonly string[] DroppedTags = ["url.query", "http.target", "db.connection_string", "db.user"];

    public override void OnEnd(Activity data)
    {
        ArgumentNullException.ThrowIfNull(data);
        foreach (var name in UrlTags)
        {
            if (data.GetTagItem(name) is string url)
            {
                data.SetTag(name, Uri.TryCreate(url, UriKind.Absolute, out var uri) ? uri.GetLeftPart(UriPartial.Authority) : null);
            }
        }

        if (data.GetTagItem("url.path") is not null)
        {
            // A path the client chose (an unknown service id, anything that matched no route) could carry anything:
            // keep the route template instead, or nothing.
            data.SetTag("url.path", data.GetTagItem("http.route") as string);
        }

        foreach (var name in DroppedTags)
        {
            if (data.GetTagItem(name) is not null)
            {
                data.SetTag(name, null);
            }
        }

        if (data.Kind == ActivityKind.Client && data.DisplayName.Contains('/', StringComparison.Ordinal))
        {
            // A client span named after its URL path would carry it: name it by method alone.
            data.DisplayName = data.GetTagItem("http.request.method") as string ?? "HTTP";
        }
    }
}
