using System.Text;
using System.Text.Json.Nodes;
using CdsNatremia.Cli.FhirServer;

namespace CdsNatremia.Cli.Replay;

/// <summary>Sends replayed requests to a service: picks the service for the input's hook, composes, posts, reads the answer.</summary>
internal static class ReplayRunner
{
    /// <summary>
    /// The service for an input: <paramref name="serviceId"/> when given, else the one whose hook matches the
    /// scenario's hook ("result" means the organisation-specific result hook), else the patient-view service.
    /// </summary>
    public static DiscoveredService Choose(IReadOnlyList<DiscoveredService> services, ReplayInput input, string? serviceId)
    {
        ArgumentNullException.ThrowIfNull(services);
        ArgumentNullException.ThrowIfNull(input);
        if (serviceId is not null)
        {
            return services.FirstOrDefault(s => s.Id == serviceId)
                ?? throw new ToolException(ExitCodes.Usage, $"Discovery lists no service '{serviceId}' (it lists: {string.Join(", ", services.Select(s => s.Id))}).");
        }

        var hook = input.ScenarioHook ?? "patient-view";
        return services.FirstOrDefault(s => hook == "result" ? s.IsResultHook : s.Hook == hook)
            ?? throw new ToolException(ExitCodes.Usage, $"Discovery lists no service for the '{hook}' hook; name one with --service.");
    }

    /// <summary>Composes and sends one request; with <see cref="PrefetchMode.FhirServer"/> a loopback FHIR server serves the Bundle meanwhile.</summary>
    public static async Task<ReplayResult> RunAsync(HttpClient client, DiscoveredService service, ReplayInput input, PrefetchMode mode, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(client);
        ArgumentNullException.ThrowIfNull(service);
        ArgumentNullException.ThrowIfNull(input);
        LoopbackFhirServer? server = null;
        try
        {
            if (mode == PrefetchMode.FhirServer)
            {
                server = LoopbackFhirServer.Start(input.Resources);
            }

            var composed = HookRequestComposer.Compose(service, input, mode, Guid.NewGuid(), server?.BaseUrl, server?.AccessToken);
            var (status, body) = await PostAsync(client, composed.ServiceId, composed.Body, cancellationToken).ConfigureAwait(false);
            return new ReplayResult(input.Name, service.Id, status, body, composed.Notes)
            {
                Prefetch = composed.Body["prefetch"] as JsonObject,
                PrefetchQueries = composed.PrefetchQueries,
                FhirRequests = server?.Log.ToList() ?? [],
            };
        }
        finally
        {
            if (server is not null)
            {
                await server.DisposeAsync().ConfigureAwait(false);
            }
        }
    }

    /// <summary>Posts a body to {base}/cds-services/{id}; returns the status and the JSON body (null when not JSON).</summary>
    public static async Task<(int Status, JsonNode? Body)> PostAsync(HttpClient client, string serviceId, JsonNode body, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(client);
        ArgumentNullException.ThrowIfNull(body);
        using var content = new StringContent(body.ToJsonString(), Encoding.UTF8, "application/json");
        using var response = await client.PostAsync(new Uri("cds-services/" + Uri.EscapeDataString(serviceId), UriKind.Relative), content, cancellationToken).ConfigureAwait(false);
        var text = await response.Content.ReadAsStringAsync(cancellationToken).ConfigureAwait(false);
        JsonNode? parsed = null;
        try
        {
            parsed = text.Length == 0 ? null : JsonNode.Parse(text);
        }
        catch (System.Text.Json.JsonException)
        {
            // Left null: the caller reports a body that is not JSON.
        }

        return ((int)response.StatusCode, parsed);
    }
}
