using CdsNatremia.Audit.Storage;

namespace CdsNatremia.Service.Audit;

/// <summary>Creates or migrates the audit schema before the server takes requests (hosted services start first).</summary>
internal sealed class AuditStartup(IAuditStore store) : IHostedService
{
    public Task StartAsync(CancellationToken cancellationToken) => store.InitializeAsync(cancellationToken);

    public Task StopAsync(CancellationToken cancellationToken) => Task.CompletedTask;
}
