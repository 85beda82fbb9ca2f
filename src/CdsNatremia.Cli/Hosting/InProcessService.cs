using CdsNatremia.Service.Configuration;
using Microsoft.AspNetCore.Builder;
using Microsoft.AspNetCore.Hosting;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.DependencyInjection.Extensions;
using Microsoft.Extensions.Logging;

namespace CdsNatremia.Cli.Hosting;

/// <summary>
/// The real service (the same <c>AddNatremia</c>/<c>UseNatremia</c> wiring as its Program) started inside this process on
/// Kestrel at 127.0.0.1 on a free port, in the Development environment, optionally with its clock fixed. Dispose to stop.
/// </summary>
internal sealed class InProcessService : IAsyncDisposable
{
    private readonly WebApplication _app;

    private InProcessService(WebApplication app, Uri baseUrl)
    {
        _app = app;
        BaseUrl = baseUrl;
    }

    /// <summary>Where the service listens, e.g. http://127.0.0.1:41234/.</summary>
    public Uri BaseUrl { get; }

    /// <summary>Starts the service; <paramref name="now"/> fixes its clock (null: the system clock).</summary>
    public static async Task<InProcessService> StartAsync(DateTimeOffset? now, CancellationToken cancellationToken)
    {
        var builder = WebApplication.CreateBuilder(new WebApplicationOptions
        {
            EnvironmentName = "Development",
            ContentRootPath = AppContext.BaseDirectory,
            Args = [],
        });
        builder.Logging.ClearProviders();
        builder.WebHost.UseUrls("http://127.0.0.1:0");
        builder.AddNatremia();
        if (now is { } fixedNow)
        {
            builder.Services.RemoveAll<TimeProvider>();
            builder.Services.AddSingleton<TimeProvider>(new FixedTimeProvider(fixedNow));
        }

        var app = builder.Build();
        app.UseNatremia();
        app.Urls.Clear();
        app.Urls.Add("http://127.0.0.1:0");
        await app.StartAsync(cancellationToken).ConfigureAwait(false);
        var address = app.Urls.First();
        return new InProcessService(app, new Uri(address.TrimEnd('/') + "/"));
    }

    public async ValueTask DisposeAsync()
    {
        await _app.StopAsync().ConfigureAwait(false);
        await _app.DisposeAsync().ConfigureAwait(false);
    }
}
