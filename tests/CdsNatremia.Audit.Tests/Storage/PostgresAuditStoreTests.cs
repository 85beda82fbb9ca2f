using CdsNatremia.Audit.Storage;
using CdsNatremia.Audit.Tests.Support;

namespace CdsNatremia.Audit.Tests.Storage;

/// <summary>The store suite on PostgreSQL (each test in its own schema); skipped with the reason when none is configured.</summary>
public sealed class PostgresAuditStoreTests : AuditStoreContract
{
    protected override async Task<Scope> OpenAsync()
    {
        var (connectionString, schema) = await PostgresDatabase.CreateSchemaAsync();
        var store = new PostgresAuditStore(connectionString);
        await store.InitializeAsync(CancellationToken.None);
        return new Scope(store, async () => await PostgresDatabase.DropSchemaAsync(schema));
    }

    [SkippableFact]
    public async Task InitializeAsync_FourInstancesAtOnce_OneMigration()
    {
        var (connectionString, schema) = await PostgresDatabase.CreateSchemaAsync();
        try
        {
            var stores = Enumerable.Range(0, 4).Select(_ => new PostgresAuditStore(connectionString)).ToList();
            await Task.WhenAll(stores.Select(s => s.InitializeAsync(CancellationToken.None)));
            Assert.Equal((long)AuditSchema.Migrations.Count, Convert.ToInt64(await stores[0].QueryScalarAsync("SELECT COUNT(*) FROM schema_version", CancellationToken.None), System.Globalization.CultureInfo.InvariantCulture));
            foreach (var store in stores)
            {
                await store.DisposeAsync();
            }
        }
        finally
        {
            await PostgresDatabase.DropSchemaAsync(schema);
        }
    }
}
