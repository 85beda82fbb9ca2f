using CdsNatremia.Scenarios;
using Microsoft.AspNetCore.Hosting;
using Microsoft.AspNetCore.Mvc.Testing;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.DependencyInjection.Extensions;
using Microsoft.Extensions.Hosting;
using Microsoft.Extensions.Time.Testing;

namespace CdsNatremia.Testing;

/// <summary>
/// The real service in memory, with the clock fixed at the scenario library's anchor so every scenario reads as written,
/// a fresh audit folder per factory, and extra configuration per test. The one factory of every test project (this file
/// is linked into each; see tests/Shared).
/// </summary>
/// <remarks>
/// Start-up is held until this factory is listening for its outcome (see <see cref="CreateHost"/>), so a service that
/// refuses to start reports its own reason every time rather than, now and then, "Cannot access a disposed object".
/// </remarks>
public sealed class NatremiaFactory : WebApplicationFactory<global::Program>
{
    private readonly Dictionary<string, string?> _settings = new(StringComparer.Ordinal);

    /// <summary>A factory with extra configuration (for tests that need their own settings).</summary>
    public static NatremiaFactory With(Dictionary<string, string?> settings)
    {
        ArgumentNullException.ThrowIfNull(settings);
        var factory = new NatremiaFactory();
        foreach (var (key, value) in settings)
        {
            factory._settings[key] = value;
        }

        return factory;
    }

    /// <summary>The service's clock, at the scenario anchor until a test moves it.</summary>
    public FakeTimeProvider Clock { get; } = new(ScenarioLibrary.Anchor);

    /// <summary>A fresh audit data folder per factory, so tests never write into the source tree or share a database.</summary>
    public string AuditDataDirectory { get; } = Path.Combine(Path.GetTempPath(), "natremia-tests", Guid.NewGuid().ToString("N"));

    protected override void ConfigureWebHost(IWebHostBuilder builder)
    {
        ArgumentNullException.ThrowIfNull(builder);
        builder.UseEnvironment("Development");
        builder.UseSetting("Natremia:Audit:DataDirectory", AuditDataDirectory);
        foreach (var (key, value) in _settings)
        {
            builder.UseSetting(key, value);
        }

        builder.ConfigureServices(services =>
        {
            services.RemoveAll<TimeProvider>();
            services.AddSingleton<TimeProvider>(Clock);
        });
    }

    /// <summary>
    /// Builds and starts the service without the race of the default implementation. With a Program of top-level
    /// statements the factory only builds the host; the application's own thread runs <c>app.Run()</c>, and the
    /// factory's start merely subscribes to <c>ApplicationStarted</c> on the host's services and waits. When start-up
    /// validation fails, <c>app.Run()</c> disposes the host on its way out; if that happened before the factory had
    /// subscribed, the factory's subscription threw <see cref="ObjectDisposedException"/> and the real reason was lost
    /// (it happened on cold first runs). Here the application's start waits at a <see cref="StartGate"/> until the
    /// factory has subscribed, so the failure always arrives as the application's own exception.
    /// </summary>
    protected override IHost CreateHost(IHostBuilder builder)
    {
        ArgumentNullException.ThrowIfNull(builder);
        var gate = new StartGate();
        builder.ConfigureServices(services => services.AddSingleton<IHostLifetime>(gate));
        var host = builder.Build();

        // Runs synchronously up to its first wait: by then it has subscribed to the start and to the entry point's end.
        var started = host.StartAsync();
        gate.Open();
        started.GetAwaiter().GetResult();
        return host;
    }
}
