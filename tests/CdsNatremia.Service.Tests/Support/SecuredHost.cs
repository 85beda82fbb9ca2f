using Microsoft.AspNetCore.Hosting;
using Microsoft.AspNetCore.Mvc.Testing;
using Microsoft.Extensions.Logging;
using Microsoft.Extensions.Time.Testing;

namespace CdsNatremia.Service.Tests.Support;

/// <summary>
/// The real service in memory with the given settings (usually a trusted client) and every log line captured at every
/// level, so tests can check both what the caller saw and what the operator's log says.
/// </summary>
public sealed class SecuredHost : IDisposable
{
    private readonly NatremiaFactory _factory;
    private readonly WebApplicationFactory<Program> _host;

    public SecuredHost(Dictionary<string, string?> settings)
    {
        _factory = NatremiaFactory.With(settings);
        _host = _factory.WithWebHostBuilder(b => b.ConfigureLogging(logging =>
        {
            logging.AddProvider(Logs);
            logging.AddFilter<CapturingLoggerProvider>(null, LogLevel.Trace);
        }));
    }

    public CapturingLoggerProvider Logs { get; } = new();

    public FakeTimeProvider Clock => _factory.Clock;

    public IServiceProvider Services => _host.Services;

    public HttpClient CreateClient() => _host.CreateClient();

    public void Dispose()
    {
        _host.Dispose();
        _factory.Dispose();
    }
}
