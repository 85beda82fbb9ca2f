using CdsNatremia.Audit.Retention;
using CdsNatremia.Audit.Storage;
using CdsNatremia.Audit.Tests.Support;
using Microsoft.Extensions.Logging.Abstractions;
using Microsoft.Extensions.Options;
using Microsoft.Extensions.Time.Testing;

namespace CdsNatremia.Audit.Tests.Retention;

public sealed class AuditPurgeServiceTests : IAsyncLifetime
{
    private readonly string _folder = Path.Combine(Path.GetTempPath(), "natremia-purge-tests", Guid.NewGuid().ToString("N"));
    private readonly FakeTimeProvider _clock = new(Some.Now);
    private SqliteAuditStore _store = null!;

    public async Task InitializeAsync()
    {
        _store = new SqliteAuditStore(Path.Combine(_folder, "audit.db"));
        await _store.InitializeAsync(CancellationToken.None);
    }

    public async Task DisposeAsync()
    {
        await _store.DisposeAsync();
        Microsoft.Data.Sqlite.SqliteConnection.ClearAllPools();
        Directory.Delete(_folder, recursive: true);
    }

    private AuditPurgeService Service(int retentionDays = 30, int intervalHours = 24)
        => new(_store, _clock, Options.Create(new AuditOptions { RetentionDays = retentionDays, PurgeIntervalHours = intervalHours }), NullLogger<AuditPurgeService>.Instance);

    [Fact]
    public async Task PurgeOnceAsync_RetentionFromTheClock_OlderCardsDeleted()
    {
        await _store.RecordIssuedAsync([Some.Card(issuedAt: Some.Now.AddDays(-31)), Some.Card(issuedAt: Some.Now.AddDays(-29))], CancellationToken.None);

        Assert.Equal(1, await Service(retentionDays: 30).PurgeOnceAsync(CancellationToken.None));
        Assert.Equal((1L, 0L), await _store.CountAsync(CancellationToken.None));

        _clock.Advance(TimeSpan.FromDays(2));
        Assert.Equal(1, await Service(retentionDays: 30).PurgeOnceAsync(CancellationToken.None));
        Assert.Equal((0L, 0L), await _store.CountAsync(CancellationToken.None));
    }

    [Fact]
    public async Task Timer_ClockPassesTheInterval_PurgesAgain()
    {
        var service = Service(retentionDays: 30, intervalHours: 24);
        await service.StartAsync(CancellationToken.None);
        try
        {
            // The card is 29.5 days old: kept at start-up, past retention once the clock moves a day.
            await _store.RecordIssuedAsync([Some.Card(issuedAt: Some.Now.AddDays(-29.5))], CancellationToken.None);
            _clock.Advance(TimeSpan.FromHours(24));

            // Waits for the background purge to happen (a bounded wait for an event, not a speed check).
            for (var attempt = 0; attempt < 200 && (await _store.CountAsync(CancellationToken.None)).Cards > 0; attempt++)
            {
                await Task.Delay(50);
            }

            Assert.Equal((0L, 0L), await _store.CountAsync(CancellationToken.None));
        }
        finally
        {
            await service.StopAsync(CancellationToken.None);
        }
    }
}
