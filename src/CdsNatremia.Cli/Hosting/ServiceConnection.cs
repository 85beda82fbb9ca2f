using CdsNatremia.Cli.Commands;
using CdsNatremia.Service.Audit;

namespace CdsNatremia.Cli.Hosting;

/// <summary>An HTTP client for the target service (a URL, or the in-process service), and what must be stopped with it.</summary>
internal sealed class ServiceConnection : IAsyncDisposable
{
    private readonly InProcessService? _inProcess;

    private ServiceConnection(HttpClient client, InProcessService? inProcess)
    {
        Client = client;
        _inProcess = inProcess;
    }

    /// <summary>The client, its BaseAddress the service's base URL (ending in '/').</summary>
    public HttpClient Client { get; }

    /// <summary>Opens a connection as the settings say; refuses hosts that are not allowed.</summary>
    public static async Task<ServiceConnection> OpenAsync(TargetSettings settings, DateTimeOffset? inProcessNow, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(settings);
        InProcessService? inProcess = null;
        Uri baseUrl;
        if (settings.InProcess)
        {
            inProcess = await InProcessService.StartAsync(inProcessNow, cancellationToken).ConfigureAwait(false);
            baseUrl = inProcess.BaseUrl;
        }
        else
        {
            baseUrl = new Uri(settings.Url.TrimEnd('/') + "/");
            HostPolicy.Require(baseUrl, settings.AllowHosts);
        }

        HttpMessageHandler handler = new SocketsHttpHandler { PooledConnectionLifetime = TimeSpan.FromMinutes(2), MaxConnectionsPerServer = 512 };
        if (settings.SigningKey is { } key)
        {
            handler = new ClientAssertionHandler(ClientAssertionHandler.LoadKey(key, settings.KeyId!), settings.Issuer!, TimeProvider.System) { InnerHandler = handler };
        }

        var client = new HttpClient(handler) { BaseAddress = baseUrl, Timeout = TimeSpan.FromSeconds(settings.TimeoutSeconds) };
        // Every request of the toolkit is test traffic: the service records its cards flagged, and reports leave them out.
        client.DefaultRequestHeaders.Add(TestTraffic.Header, TestTraffic.Value);
        return new ServiceConnection(client, inProcess);
    }

    public async ValueTask DisposeAsync()
    {
        Client.Dispose();
        if (_inProcess is not null)
        {
            await _inProcess.DisposeAsync().ConfigureAwait(false);
        }
    }
}
