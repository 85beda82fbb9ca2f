using CdsNatremia.Audit.Storage;
using Microsoft.Extensions.Hosting;
using Microsoft.Extensions.Logging;
using Microsoft.Extensions.Options;

namespace CdsNatremia.Audit.Retention;

/// <summary>
/// Deletes audit records older than the retention period: once at start-up, then every
/// <see cref="AuditOptions.PurgeIntervalHours"/> on a timer driven by the injected <see cref="TimeProvider"/> (tests
/// advance a fake clock). <see cref="PurgeOnceAsync"/> is the same purge for callers and tests. A failed purge is
/// logged and retried at the next tick; it never stops the service.
/// </summary>
public sealed partial class AuditPurgeService : BackgroundService
{
    private readonly IAuditStore _store;
    private readonly TimeProvider _time;
    private readonly AuditOptions _options;
    private readonly ILogger<AuditPurgeService> _logger;

    /// <summary>Creates the service.</summary>
    public AuditPurgeService(IAuditStore store, TimeProvider time, IOptions<AuditOptions> options, ILogger<AuditPurgeService> logger)
    {
        ArgumentNullException.ThrowIfNull(options);
        _store = store;
        _time = time;
        _options = options.Value;
        _logger = logger;
    }

    /// <summary>Deletes records issued before now minus the retention period; returns the cards deleted.</summary>
    public Task<int> PurgeOnceAsync(CancellationToken cancellationToken)
        => _store.PurgeAsync(_time.GetUtcNow().AddDays(-_options.RetentionDays), cancellationToken);

    /// <inheritdoc />
    protected override async Task ExecuteAsync(CancellationToken stoppingToken)
    {
        using var timer = new PeriodicTimer(TimeSpan.FromHours(_options.PurgeIntervalHours), _time);
        do
        {
            try
            {
                var deleted = await PurgeOnceAsync(stoppingToken).ConfigureAwait(false);
                if (deleted > 0)
                {
                    LogPurged(deleted, _options.RetentionDays);
                }
            }
            catch (Exception ex) when (ex is not OperationCanceledException)
            {
                LogPurgeFailed(ex);
            }
        }
        while (await timer.WaitForNextTickAsync(stoppingToken).ConfigureAwait(false));
    }

    [LoggerMessage(Level = LogLevel.Information, Message = "Audit purge deleted {Cards} card records older than {Days} days.")]
    private partial void LogPurged(int cards, int days);

    [LoggerMessage(Level = LogLevel.Warning, Message = "Audit purge failed; it runs again at the next interval.")]
    private partial void LogPurgeFailed(Exception exception);
}
