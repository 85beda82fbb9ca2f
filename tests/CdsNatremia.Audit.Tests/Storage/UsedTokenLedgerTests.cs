using CdsNatremia.Audit.Storage;
using CdsNatremia.Audit.Tests.Support;

namespace CdsNatremia.Audit.Tests.Storage;

/// <summary>
/// The shared ledger of used token ids on PostgreSQL: unique per (issuer, jti) across every instance, expired rows
/// purged. Skipped with the reason when no PostgreSQL is configured.
/// </summary>
public sealed class UsedTokenLedgerTests
{
    private static readonly DateTimeOffset Now = Some.Now;
    private static CancellationToken None => CancellationToken.None;

    [SkippableFact]
    public async Task TryUseAsync_SameIdOnTwoInstances_OnlyTheFirstAccepted()
    {
        await using var scope = await LedgerScope.OpenAsync();
        await using var instanceA = new UsedTokenLedger(scope.ConnectionString);
        await using var instanceB = new UsedTokenLedger(scope.ConnectionString);

        Assert.True(await instanceA.TryUseAsync("https://ehr.test.example", "jti-1", Now.AddMinutes(6), Now, None));
        Assert.False(await instanceB.TryUseAsync("https://ehr.test.example", "jti-1", Now.AddMinutes(6), Now, None));
        Assert.False(await instanceA.TryUseAsync("https://ehr.test.example", "jti-1", Now.AddMinutes(6), Now, None));
        Assert.True(await instanceB.TryUseAsync("https://other-ehr.test.example", "jti-1", Now.AddMinutes(6), Now, None));
    }

    [SkippableFact]
    public async Task TryUseAsync_ManyInstancesAtOnce_ExactlyOneAccepted()
    {
        await using var scope = await LedgerScope.OpenAsync();
        var ledgers = Enumerable.Range(0, 8).Select(_ => new UsedTokenLedger(scope.ConnectionString)).ToList();

        var results = await Task.WhenAll(ledgers.Select(l => l.TryUseAsync("https://ehr.test.example", "raced", Now.AddMinutes(6), Now, None)));

        Assert.Single(results, r => r);
        foreach (var ledger in ledgers)
        {
            await ledger.DisposeAsync();
        }
    }

    [SkippableFact]
    public async Task PurgeAsync_ExpiredRowsGone_LiveRowsKept()
    {
        await using var scope = await LedgerScope.OpenAsync();
        await using var ledger = new UsedTokenLedger(scope.ConnectionString);
        await ledger.TryUseAsync("iss", "expires-soon", Now.AddMinutes(1), Now, None);
        await ledger.TryUseAsync("iss", "expires-later", Now.AddMinutes(6), Now, None);

        var purged = await ledger.PurgeAsync(Now.AddMinutes(2), None);

        Assert.Equal(1, purged);
        Assert.Equal(1L, await ledger.CountAsync(None));
        Assert.False(await ledger.TryUseAsync("iss", "expires-later", Now.AddMinutes(6), Now.AddMinutes(2), None));
    }

    [SkippableFact]
    public async Task TryUseAsync_AfterThePurgeInterval_PurgesExpiredRowsOnTheWay()
    {
        await using var scope = await LedgerScope.OpenAsync();
        await using var ledger = new UsedTokenLedger(scope.ConnectionString);
        await ledger.TryUseAsync("iss", "old", Now.AddMinutes(1), Now, None);

        var later = Now + UsedTokenLedger.PurgeInterval + TimeSpan.FromMinutes(1);
        await ledger.TryUseAsync("iss", "new", later.AddMinutes(5), later, None);

        Assert.Equal(1L, await ledger.CountAsync(None));
    }

    /// <summary>A fresh schema with the audit schema applied (which creates the used_token table), dropped afterwards.</summary>
    private sealed class LedgerScope(string connectionString, string schema) : IAsyncDisposable
    {
        public string ConnectionString { get; } = connectionString;

        public static async Task<LedgerScope> OpenAsync()
        {
            var (connectionString, schema) = await PostgresDatabase.CreateSchemaAsync();
            await using (var store = new PostgresAuditStore(connectionString))
            {
                await store.InitializeAsync(None);
            }

            return new LedgerScope(connectionString, schema);
        }

        public async ValueTask DisposeAsync() => await PostgresDatabase.DropSchemaAsync(schema);
    }
}
