using System.Collections.Concurrent;
using System.Globalization;
using System.Net;
using System.Net.Sockets;
using System.Text;
using System.Text.Json.Nodes;
using CdsNatremia.Cli.Prefetch;

namespace CdsNatremia.Cli.FhirServer;

/// <summary>
/// A tiny read-only FHIR R4 server on 127.0.0.1 that serves one patient's Bundle, so a service's own fetch path can be
/// exercised: reads (<c>GET /fhir/Type/id</c>) and searches (<c>GET /fhir/Type?…</c>) answered with searchset Bundles
/// and next links for paging, evaluated by <see cref="FhirSearchEvaluator"/>. Every request must carry the bearer token
/// it was created with (401 otherwise). Listens on loopback only; dispose to stop.
/// </summary>
internal sealed class LoopbackFhirServer : IAsyncDisposable
{
    private readonly HttpListener _listener = new();
    private readonly IReadOnlyList<JsonObject> _resources;
    private readonly CancellationTokenSource _stop = new();
    private readonly Task _loop;

    private LoopbackFhirServer(IReadOnlyList<JsonObject> resources, string accessToken, int port)
    {
        _resources = resources;
        AccessToken = accessToken;
        BaseUrl = new Uri($"http://127.0.0.1:{port.ToString(CultureInfo.InvariantCulture)}/fhir/");
        _listener.Prefixes.Add(BaseUrl.ToString());
        _listener.Start();
        _loop = Task.Run(LoopAsync);
    }

    /// <summary>The server's base URL, ending in "/fhir/".</summary>
    public Uri BaseUrl { get; }

    /// <summary>The bearer token requests must carry.</summary>
    public string AccessToken { get; }

    /// <summary>Every request received, as "GET /fhir/…" with its status code, in arrival order.</summary>
    public ConcurrentQueue<string> Log { get; } = new();

    /// <summary>Starts a server for these resources on a free loopback port.</summary>
    public static LoopbackFhirServer Start(IReadOnlyList<JsonObject> resources, string? accessToken = null)
    {
        ArgumentNullException.ThrowIfNull(resources);
        var token = accessToken ?? Convert.ToHexString(System.Security.Cryptography.RandomNumberGenerator.GetBytes(16));
        for (var attempt = 0; ; attempt++)
        {
            try
            {
                return new LoopbackFhirServer(resources, token, FreePort());
            }
            catch (HttpListenerException) when (attempt < 5)
            {
                // The free port was taken between probing and listening: try another.
            }
        }
    }

    /// <summary>Answers one relative request (path and query below the base) with a status and a FHIR JSON body.</summary>
    public (int Status, JsonObject Body) Answer(string relative)
    {
        FhirQuery query;
        try
        {
            query = FhirQuery.Parse(relative);
        }
        catch (FormatException ex)
        {
            return (400, Outcome("error", "invalid", ex.Message));
        }

        var offset = query.Parameters.Where(p => p.Key == SearchsetBundle.OffsetParameter)
            .Select(p => int.TryParse(p.Value, NumberStyles.None, CultureInfo.InvariantCulture, out var o) ? o : 0)
            .FirstOrDefault();
        var outcome = FhirSearchEvaluator.Evaluate(query, _resources);
        if (query.IsRead)
        {
            return outcome.Matches.Count == 1
                ? (200, (JsonObject)outcome.Matches[0].DeepClone())
                : (404, Outcome("error", "not-found", $"{query} is not in the served Bundle."));
        }

        return (200, SearchsetBundle.Page(query, outcome, offset, BaseUrl.ToString().TrimEnd('/')));
    }

    public async ValueTask DisposeAsync()
    {
        await _stop.CancelAsync().ConfigureAwait(false);
        _listener.Close();
        try
        {
            await _loop.ConfigureAwait(false);
        }
        catch (Exception ex) when (ex is HttpListenerException or ObjectDisposedException or OperationCanceledException)
        {
            // Closing the listener ends the pending accept.
        }

        _stop.Dispose();
    }

    private async Task LoopAsync()
    {
        while (!_stop.IsCancellationRequested)
        {
            HttpListenerContext context;
            try
            {
                context = await _listener.GetContextAsync().ConfigureAwait(false);
            }
            catch (Exception ex) when (ex is HttpListenerException or ObjectDisposedException or InvalidOperationException)
            {
                return;
            }

            _ = Task.Run(() => Handle(context));
        }
    }

    private void Handle(HttpListenerContext context)
    {
        var request = context.Request;
        var relative = request.RawUrl is { } raw && raw.StartsWith("/fhir/", StringComparison.Ordinal) ? raw["/fhir/".Length..] : string.Empty;
        int status;
        JsonObject body;
        if (request.Headers["Authorization"] != "Bearer " + AccessToken)
        {
            (status, body) = (401, Outcome("error", "login", "A bearer token is required (the one given in fhirAuthorization)."));
        }
        else if (request.HttpMethod != "GET")
        {
            (status, body) = (405, Outcome("error", "not-supported", "This server is read-only: GET only."));
        }
        else
        {
            (status, body) = Answer(relative);
        }

        Log.Enqueue($"{request.HttpMethod} /fhir/{relative} → {status.ToString(CultureInfo.InvariantCulture)}");
        var bytes = Encoding.UTF8.GetBytes(body.ToJsonString());
        try
        {
            context.Response.StatusCode = status;
            context.Response.ContentType = "application/fhir+json";
            context.Response.ContentLength64 = bytes.Length;
            context.Response.OutputStream.Write(bytes);
            context.Response.Close();
        }
        catch (HttpListenerException)
        {
            // The client went away.
        }
    }

    private static JsonObject Outcome(string severity, string code, string diagnostics) => new()
    {
        ["resourceType"] = "OperationOutcome",
        ["issue"] = new JsonArray(new JsonObject { ["severity"] = severity, ["code"] = code, ["diagnostics"] = diagnostics }),
    };

    private static int FreePort()
    {
        using var probe = new TcpListener(IPAddress.Loopback, 0);
        probe.Start();
        var port = ((IPEndPoint)probe.LocalEndpoint).Port;
        probe.Stop();
        return port;
    }
}
