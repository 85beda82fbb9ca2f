using System.Data.Common;
using Microsoft.Data.Sqlite;

namespace CdsNatremia.Audit.Storage;

/// <summary>
/// The embedded store: one SQLite file in write-ahead-log mode with <c>synchronous=FULL</c>, so a committed write is
/// on disk (the log is flushed at every commit) before the answer leaves. Writers of this process queue on one gate
/// (SQLite allows one writer at a time; queuing here is cheaper than retrying on SQLITE_BUSY); other processes on the
/// same file wait through the busy timeout. The folder is 0700 and the files 0600 (<see cref="PrivateFiles"/>).
/// </summary>
public sealed class SqliteAuditStore : SqlAuditStore
{
    private readonly string _connectionString;
    private readonly SemaphoreSlim _writeGate = new(1, 1);

    /// <summary>Creates the store on a file (the folder is created when missing).</summary>
    public SqliteAuditStore(string path)
    {
        ArgumentException.ThrowIfNullOrEmpty(path);
        Path = System.IO.Path.GetFullPath(path);
        PrivateFiles.EnsureFolder(System.IO.Path.GetDirectoryName(Path)!);
        _connectionString = new SqliteConnectionStringBuilder
        {
            DataSource = Path,
            Mode = SqliteOpenMode.ReadWriteCreate,
            Cache = SqliteCacheMode.Private,
            Pooling = true,
            DefaultTimeout = 30,
        }.ToString();
    }

    /// <summary>The database file.</summary>
    public string Path { get; }

    /// <inheritdoc />
    public override string Kind => "sqlite";

    /// <inheritdoc />
    protected override string ListTablesSql => "SELECT name FROM sqlite_master WHERE type = 'table' ORDER BY name";

    /// <inheritdoc />
    public override async Task InitializeAsync(CancellationToken cancellationToken)
    {
        // Created empty with mode 0600 before SQLite opens it: SQLite gives its -wal and -shm files the database
        // file's permissions, so the whole audit stays readable by the owner only.
        PrivateFiles.EnsureFile(Path);
        foreach (var suffix in new[] { "-wal", "-shm", "-journal" })
        {
            PrivateFiles.RestrictFile(Path + suffix);
        }

        await using (var connection = await OpenAsync(cancellationToken).ConfigureAwait(false))
        {
            // The journal mode is kept in the file: set once, every later connection uses the write-ahead log.
            var mode = await ScalarAsync(connection, null, "PRAGMA journal_mode=WAL", cancellationToken).ConfigureAwait(false) as string;
            if (!string.Equals(mode, "wal", StringComparison.OrdinalIgnoreCase))
            {
                throw new InvalidOperationException($"The audit database {Path} could not be switched to write-ahead logging (journal mode is '{mode}').");
            }
        }

        await base.InitializeAsync(cancellationToken).ConfigureAwait(false);
    }

    /// <inheritdoc />
    protected override async Task<DbConnection> OpenAsync(CancellationToken cancellationToken)
    {
        var connection = new SqliteConnection(_connectionString);
        await connection.OpenAsync(cancellationToken).ConfigureAwait(false);
        // Per connection: flush the log at every commit (durable once answered), wait up to 30 s for another process.
        await ExecuteAsync(connection, null, "PRAGMA synchronous=FULL; PRAGMA busy_timeout=30000;", cancellationToken).ConfigureAwait(false);
        return connection;
    }

    /// <inheritdoc />
    protected override async Task<DbTransaction> BeginWriteAsync(DbConnection connection, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(connection);
        // BEGIN IMMEDIATE: take the write lock at the start, so a read-then-write transaction cannot deadlock.
        return await Task.FromResult(((SqliteConnection)connection).BeginTransaction(deferred: false)).ConfigureAwait(false);
    }

    /// <inheritdoc />
    protected override Task LockForMigrationAsync(DbConnection connection, DbTransaction transaction, CancellationToken cancellationToken)
        => Task.CompletedTask; // BEGIN IMMEDIATE already excludes every other writer.

    /// <inheritdoc />
    protected override async Task<T> WriteAsync<T>(Func<Task<T>> write, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(write);
        await _writeGate.WaitAsync(cancellationToken).ConfigureAwait(false);
        try
        {
            return await write().ConfigureAwait(false);
        }
        finally
        {
            _writeGate.Release();
        }
    }

    /// <inheritdoc />
    public override ValueTask DisposeAsync()
    {
        using (var connection = new SqliteConnection(_connectionString))
        {
            SqliteConnection.ClearPool(connection);
        }

        _writeGate.Dispose();
        return ValueTask.CompletedTask;
    }
}
