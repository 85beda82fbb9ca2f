using CdsNatremia.Scenarios;
using Microsoft.AspNetCore.Hosting;
using Microsoft.AspNetCore.Mvc.Testing;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.DependencyInjection.Extensions;
using Microsoft.Extensions.Time.Testing;

namespace CdsNatremia.Cli.Tests.Support;

/// <summary>The real service in memory, its clock fixed at the scenario anchor so every scenario reads as written.</summary>
public sealed class NatremiaFactory : WebApplicationFactory<global::Program>
{
    public FakeTimeProvider Clock { get; } = new(ScenarioLibrary.Anchor);

    protected override void ConfigureWebHost(IWebHostBuilder builder)
    {
        builder.UseEnvironment("Development");
        builder.ConfigureServices(services =>
        {
            services.RemoveAll<TimeProvider>();
            services.AddSingleton<TimeProvider>(Clock);
        });
    }
}
