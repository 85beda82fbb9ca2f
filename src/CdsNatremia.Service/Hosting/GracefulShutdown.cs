using System.Diagnostics;
using CdsNatremia.Audit.Storage;
using Microsoft.Data.Sqlite;
using Microsoft.Extensions.Options;

namespace CdsNatremia.Service.Hosting;

/// <summary>
/// Graceful shutdown on SIGTERM (or Ctrl+C): readiness goes false first and stays false for
/// <see cref="ShutdownOptions.ReadinessDelay"/> while answers continue, so a load balancer stops sending; then the
/// server stops accepting and finishes the answers in flight within <see cref="ShutdownOptions.DrainTimeout"/>; then
/// the audit trail is flushed and the process exits 0. Every answer's audit record is committed before the answer
/// leaves (docs/audit.md), so a drained answer is never without its record.
/// </summary>
public static partial class GracefulShutdown
{
    /// <summary>The readiness endpoint (mapped in HealthEndpoints) that answers "draining" once shutdown has begun.</summary>
    public const string ReadinessPath = "/readyz";

    /// <summary>Registers the options, the drain state and the two shutdown steps, and sets the host's shutdown budget.</summary>
    public static WebApplicationBuilder AddNatremiaGracefulShutdown(this WebApplicationBuilder builder)
    {
        ArgumentNullException.ThrowIfNull(builder);
        var section = builder.Configuration.GetSection(ShutdownOptions.Section);
        builder.Services.AddOptions<ShutdownOptions>().Bind(section)
            .Validate(o => o.ReadinessDelay >= TimeSpan.Zero && o.ReadinessDelay <= TimeSpan.FromSeconds(120), $"{ShutdownOptions.Section}:ReadinessDelay must be 00:00:00 to 00:02:00.")
            .Validate(o => o.DrainTimeout >= TimeSpan.FromSeconds(1) && o.DrainTimeout <= TimeSpan.FromSeconds(300), $"{ShutdownOptions.Section}:DrainTimeout must be 00:00:01 to 00:05:00.")
            .ValidateOnStart();
        var options = section.Get<ShutdownOptions>() ?? new ShutdownOptions();
        builder.Services.Configure<HostOptions>(host => host.ShutdownTimeout = options.Total);
        builder.Services.AddSingleton<ShutdownState>();

        // Registered here, so they stop after the web server (the host stops services in reverse order and registers
        // the server last): StoppingAsync of every lifecycle service runs before any StopAsync.
        builder.Services.AddHostedService<ReadinessDrain>();
        builder.Services.AddHostedService<AuditFlush>();
        return builder;
    }

    /// <summary>Answers /readyz with 503 "draining" once shutdown has begun. Call before the service's endpoints.</summary>
    public static WebApplication UseNatremiaGracefulShutdown(this WebApplication app)
    {
        ArgumentNullException.ThrowIfNull(app);
        var state = app.Services.GetRequiredService<ShutdownState>();
        app.Use(async (context, next) =>
        {
            if (state.Draining && context.Request.Path.Equals(ReadinessPath, StringComparison.Ordinal))
            {
                context.Response.StatusCode = StatusCodes.Status503ServiceUnavailable;
                context.Response.Headers.Connection = "close";
                await context.Response.WriteAsJsonAsync(new { status = "draining" }).ConfigureAwait(false);
                return;
            }

            await next(context).ConfigureAwait(false);
        });
        return app;
    }

    /// <summary>First step: readiness false, then wait the readiness delay while the server still answers.</summary>
    internal sealed partial class ReadinessDrain(ShutdownState state, IOptions<ShutdownOptions> options, ILogger<ReadinessDrain> logger) : IHostedLifecycleService
    {
        public Task StartingAsync(CancellationToken cancellationToken) => Task.CompletedTask;

        public Task StartAsync(CancellationToken cancellationToken) => Task.CompletedTask;

        public Task StartedAsync(CancellationToken cancellationToken) => Task.CompletedTask;

        public async Task StoppingAsync(CancellationToken cancellationToken)
        {
            state.BeginDraining();
            var o = options.Value;
            LogDraining(logger, (long)o.ReadinessDelay.TotalMilliseconds, (long)o.DrainTimeout.TotalMilliseconds);
            try
            {
                await Task.Delay(o.ReadinessDelay, cancellationToken).ConfigureAwait(false);
            }
            catch (OperationCanceledException)
            {
                // The host's shutdown budget ran out: go on stopping.
            }
        }

        public Task StopAsync(CancellationToken cancellationToken) => Task.CompletedTask;

        public Task StoppedAsync(CancellationToken cancellationToken) => Task.CompletedTask;

        [LoggerMessage(EventId = 9001, Level = LogLevel.Information,
            Message = "Shutdown: readiness is now 'draining'; still answering for {ReadinessDelayMs} ms, then the server stops accepting and finishes answers in flight (up to {DrainTimeoutMs} ms)")]
        private static partial void LogDraining(ILogger logger, long readinessDelayMs, long drainTimeoutMs);
    }

    /// <summary>
    /// Last step (after the server has drained): write what the group-commit queue still holds, then flush the audit trail.
    /// </summary>
    internal sealed partial class AuditFlush(IAuditStore store, IServiceProvider services, ILogger<AuditFlush> logger) : IHostedService
    {
        public Task StartAsync(CancellationToken cancellationToken) => Task.CompletedTask;

        public async Task StopAsync(CancellationToken cancellationToken)
        {
            var started = Stopwatch.GetTimestamp();
            if (services.GetService<AuditWriteQueue>() is { } queue)
            {
                // Every answer drained above has its record already; anything still queued is written before the exit.
                await queue.CompleteAsync().ConfigureAwait(false);
            }

            try
            {
                if (store is SqliteAuditStore sqlite)
                {
                    // Every record is already committed (synchronous=FULL); fold the write-ahead log into the database
                    // file so the file alone is complete when the volume is copied or the process does not return.
                    await using var connection = new SqliteConnection(new SqliteConnectionStringBuilder { DataSource = sqlite.Path, Mode = SqliteOpenMode.ReadWrite, Pooling = false }.ToString());
                    await connection.OpenAsync(cancellationToken).ConfigureAwait(false);
                    await using var command = connection.CreateCommand();
                    command.CommandText = "PRAGMA busy_timeout=5000; PRAGMA wal_checkpoint(TRUNCATE);";
                    await command.ExecuteNonQueryAsync(cancellationToken).ConfigureAwait(false);
                }

                LogFlushed(logger, store.Kind, (long)Stopwatch.GetElapsedTime(started).TotalMilliseconds);
            }
            catch (Exception ex) when (ex is SqliteException or IOException or OperationCanceledException)
            {
                // Records are durable without the checkpoint; SQLite folds the log in at the next start.
                LogFlushFailed(logger, store.Kind, ex.GetType().Name);
            }
        }

        [LoggerMessage(EventId = 9002, Level = LogLevel.Information, Message = "Shutdown: answers drained, audit trail ({Store}) flushed in {ElapsedMs} ms")]
        private static partial void LogFlushed(ILogger logger, string store, long elapsedMs);

        [LoggerMessage(EventId = 9003, Level = LogLevel.Warning, Message = "Shutdown: audit trail ({Store}) flush not completed ({Error}); every record was already committed")]
        private static partial void LogFlushFailed(ILogger logger, string store, string error);
    }
}
