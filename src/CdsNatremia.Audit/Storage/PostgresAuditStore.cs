using System.Data.Common;
using Npgsql;

namespace CdsNatremia.Audit.Storage;

/// <summary>
/// The shared store for several service instances: PostgreSQL through one pooled <see cref="NpgsqlDataSource"/>.
/// A commit returns once PostgreSQL has flushed its write-ahead log (its default <c>synchronous_commit=on</c>).
/// Concurrent duplicate feedback is settled by the primary key (<c>ON CONFLICT DO NOTHING</c>); start-up migrations
/// of several instances are serialised by a transaction-scoped advisory lock.
/// </summary>
public sealed class PostgresAuditStore : SqlAuditStore
{
    /// <summary>The advisory lock key that serialises migrations (an arbitrary constant of this schema).</summary>
    private const long MigrationLockKey = 0x4E61_7472_656D_6961; // "Natremia"

    /// <summary>
    /// Pool size when the connection string sets none: 20 connections per instance, so a handful of instances stay
    /// well inside PostgreSQL's default of 100 connections; bursts queue for a free connection instead of failing.
    /// </summary>
    public const int DefaultMaxPoolSize = 20;

    private readonly NpgsqlDataSource _dataSource;

    /// <summary>Creates the store from a connection string.</summary>
    public PostgresAuditStore(string connectionString)
    {
        ArgumentException.ThrowIfNullOrEmpty(connectionString);
        var builder = new NpgsqlConnectionStringBuilder(connectionString);
        if (!new[] { "max pool size", "maximum pool size", "maxpoolsize" }.Any(k => connectionString.Contains(k, StringComparison.OrdinalIgnoreCase)))
        {
            builder.MaxPoolSize = DefaultMaxPoolSize;
        }

        _dataSource = NpgsqlDataSource.Create(builder);
    }

    /// <inheritdoc />
    public override string Kind => "postgresql";

    /// <inheritdoc />
    protected override string ListTablesSql =>
        "SELECT table_name::text FROM information_schema.tables WHERE table_schema = current_schema() AND table_type = 'BASE TABLE' ORDER BY table_name";

    /// <inheritdoc />
    protected override async Task<DbConnection> OpenAsync(CancellationToken cancellationToken)
        => await _dataSource.OpenConnectionAsync(cancellationToken).ConfigureAwait(false);

    /// <inheritdoc />
    protected override async Task<DbTransaction> BeginWriteAsync(DbConnection connection, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(connection);
        return await connection.BeginTransactionAsync(cancellationToken).ConfigureAwait(false);
    }

    /// <inheritdoc />
    protected override async Task LockForMigrationAsync(DbConnection connection, DbTransaction transaction, CancellationToken cancellationToken)
        => await ExecuteAsync(connection, transaction, "SELECT pg_advisory_xact_lock(@key)", cancellationToken, ("@key", MigrationLockKey)).ConfigureAwait(false);

    /// <inheritdoc />
    public override ValueTask DisposeAsync() => _dataSource.DisposeAsync();
}
