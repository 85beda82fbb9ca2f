namespace CdsNatremia.Audit.Storage;

/// <summary>Chooses the store: PostgreSQL when a connection string is configured, else SQLite in the data folder.</summary>
public static class AuditStoreFactory
{
    /// <summary>Creates (but does not initialise) the configured store.</summary>
    /// <param name="options">The audit options.</param>
    /// <param name="contentRoot">The folder a relative data folder is taken from.</param>
    public static IAuditStore Create(AuditOptions options, string contentRoot)
    {
        ArgumentNullException.ThrowIfNull(options);
        return string.IsNullOrWhiteSpace(options.PostgresConnectionString)
            ? new SqliteAuditStore(Path.Combine(DataDirectory(options, contentRoot), options.SqliteFileName))
            : new PostgresAuditStore(options.PostgresConnectionString);
    }

    /// <summary>The absolute data folder.</summary>
    public static string DataDirectory(AuditOptions options, string contentRoot)
    {
        ArgumentNullException.ThrowIfNull(options);
        return Path.GetFullPath(options.DataDirectory, contentRoot);
    }
}
