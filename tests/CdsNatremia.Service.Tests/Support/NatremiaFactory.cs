using CdsNatremia.Scenarios;
using Microsoft.AspNetCore.Hosting;
using Microsoft.AspNetCore.Mvc.Testing;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.DependencyInjection.Extensions;
using Microsoft.Extensions.Time.Testing;

namespace CdsNatremia.Service.Tests.Support;

/// <summary>
/// The real service in memory, with the clock fixed at the scenario library's anchor so every scenario reads as written.
/// Extra configuration can be passed per test.
/// </summary>
public sealed class NatremiaFactory : WebApplicationFactory<Program>
{
    private readonly Dictionary<string, string?> _settings = new(StringComparer.Ordinal);

    /// <summary>A factory with extra configuration (for tests that need their own settings).</summary>
    public static NatremiaFactory With(Dictionary<string, string?> settings)
    {
        var factory = new NatremiaFactory();
        foreach (var (key, value) in settings)
        {
            factory._settings[key] = value;
        }

        return factory;
    }

    public FakeTimeProvider Clock { get; } = new(ScenarioLibrary.Anchor);

    /// <summary>A fresh audit data folder per factory, so tests never write into the source tree or share a database.</summary>
    public string AuditDataDirectory { get; } = Path.Combine(Path.GetTempPath(), "natremia-tests", Guid.NewGuid().ToString("N"));

    protected override void ConfigureWebHost(IWebHostBuilder builder)
    {
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
}
