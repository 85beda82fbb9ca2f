using CdsNatremia.Service.Configuration;
using Microsoft.AspNetCore.Builder;
using Microsoft.AspNetCore.TestHost;
using Microsoft.Extensions.Logging;

namespace CdsNatremia.Benchmarks;

/// <summary>
/// The real service composed exactly as Program.cs does (AddNatremia, UseNatremia), in the Development environment
/// (no client token needed), on an in-memory TestServer. Logging is limited to warnings so the console does not
/// dominate the measurement, as in the load run.
/// </summary>
internal sealed class InMemoryService : IAsyncDisposable
{
    private InMemoryService(WebApplication app, HttpClient client)
    {
        App = app;
        Client = client;
    }

    /// <summary>The host; its services give the handler, catalog and writer the endpoint uses.</summary>
    public WebApplication App { get; }

    /// <summary>A client whose requests go straight into the in-memory server.</summary>
    public HttpClient Client { get; }

    /// <summary>Builds and starts the service.</summary>
    public static async Task<InMemoryService> StartAsync()
    {
        var builder = WebApplication.CreateBuilder(new WebApplicationOptions
        {
            EnvironmentName = "Development",
            ContentRootPath = AppContext.BaseDirectory,
        });
        builder.WebHost.UseTestServer();
        builder.Logging.SetMinimumLevel(LogLevel.Warning);
        builder.AddNatremia();
        var app = builder.Build();
        app.UseNatremia();
        await app.StartAsync().ConfigureAwait(false);
        return new InMemoryService(app, app.GetTestClient());
    }

    /// <inheritdoc />
    public async ValueTask DisposeAsync()
    {
        Client.Dispose();
        await App.StopAsync().ConfigureAwait(false);
        await App.DisposeAsync().ConfigureAwait(false);
    }
}
