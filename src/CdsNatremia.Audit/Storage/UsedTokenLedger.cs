using Npgsql;

namespace CdsNatremia.Audit.Storage;

/// <summary>
/// The used token ids of every service instance, in the audit's PostgreSQL database (table <c>used_token</c>, created
/// by the audit schema's migrations): one row per (issuer, jti), unique, so of two instances receiving the same token
/// only the first insert succeeds. Rows are kept until their token has expired and then purged, at most once per
/// <see cref="PurgeInterval"/> per instance, by the call that notices the interval has passed.
/// </summary>
public sealed class UsedTokenLedger : IAsyncDisposable
{
    /// <summary>Least time between two purges of expired rows by one instance.</summary>
    public static readonly TimeSpan PurgeInterval = TimeSpan.FromMinutes(1);

    private readonly NpgsqlDataSource _dataSource;
    private long _nextPurgeMs;

    /// <summary>Creates the ledger on the audit's connection string (the table must exist: the audit start-up creates it).</summary>
    public UsedTokenLedger(string connectionString)
    {
        ArgumentException.ThrowIfNullOrEmpty(connectionString);
        var builder = new NpgsqlConnectionStringBuilder(connectionString);
        if (!new[] { "max pool size", "maximum pool size", "maxpoolsize" }.Any(k => connectionString.Contains(k, StringComparison.OrdinalIgnoreCase)))
        {
            builder.MaxPoolSize = 10;
        }

        _dataSource = NpgsqlDataSource.Create(builder);
    }

    /// <summary>
    /// Records the id; true on its first use, false when any instance already recorded it. Throws
    /// <see cref="NpgsqlException"/> (or a timeout) when the database cannot be reached.
    /// </summary>
    public async Task<bool> TryUseAsync(string issuer, string jti, DateTimeOffset forgetAfter, DateTimeOffset now, CancellationToken cancellationToken)
    {
        ArgumentException.ThrowIfNullOrEmpty(issuer);
        ArgumentException.ThrowIfNullOrEmpty(jti);
        await using var connection = await _dataSource.OpenConnectionAsync(cancellationToken).ConfigureAwait(false);
        var nowMs = now.ToUnixTimeMilliseconds();
        var purgeDue = Interlocked.Read(ref _nextPurgeMs);
        if (nowMs >= purgeDue && Interlocked.CompareExchange(ref _nextPurgeMs, nowMs + (long)PurgeInterval.TotalMilliseconds, purgeDue) == purgeDue)
        {
            await PurgeAsync(connection, now, cancellationToken).ConfigureAwait(false);
        }

        await using var insert = new NpgsqlCommand(
            "INSERT INTO used_token (issuer, jti, expires_at_ms) VALUES (@issuer, @jti, @expires) ON CONFLICT (issuer, jti) DO NOTHING",
            connection);
        insert.Parameters.AddWithValue("issuer", issuer);
        insert.Parameters.AddWithValue("jti", jti);
        insert.Parameters.AddWithValue("expires", forgetAfter.ToUnixTimeMilliseconds());
        return await insert.ExecuteNonQueryAsync(cancellationToken).ConfigureAwait(false) == 1;
    }

    /// <summary>Deletes the rows of tokens expired at <paramref name="now"/>; returns how many.</summary>
    public async Task<int> PurgeAsync(DateTimeOffset now, CancellationToken cancellationToken)
    {
        await using var connection = await _dataSource.OpenConnectionAsync(cancellationToken).ConfigureAwait(false);
        return await PurgeAsync(connection, now, cancellationToken).ConfigureAwait(false);
    }

    /// <summary>Rows held now (for tests and operators).</summary>
    public async Task<long> CountAsync(CancellationToken cancellationToken)
    {
        await using var connection = await _dataSource.OpenConnectionAsync(cancellationToken).ConfigureAwait(false);
        await using var count = new NpgsqlCommand("SELECT COUNT(*) FROM used_token", connection);
        return Convert.ToInt64(await count.ExecuteScalarAsync(cancellationToken).ConfigureAwait(false), System.Globalization.CultureInfo.InvariantCulture);
    }

    /// <inheritdoc />
    public ValueTask DisposeAsync() => _dataSource.DisposeAsync();

    private static async Task<int> PurgeAsync(NpgsqlConnection connection, DateTimeOffset now, CancellationToken cancellationToken)
    {
        await using var delete = new NpgsqlCommand("DELETE FROM used_token WHERE expires_at_ms <= @now", connection);
        delete.Parameters.AddWithValue("now", now.ToUnixTimeMilliseconds());
        return await delete.ExecuteNonQueryAsync(cancellationToken).ConfigureAwait(false);
    }
}
