using BenchmarkDotNet.Attributes;
using CdsNatremia.Audit.Records;
using CdsNatremia.Audit.Storage;

namespace CdsNatremia.Audit.Benchmarks;

/// <summary>
/// One audit write as a hook answer or a feedback post does it: a committed, durable transaction. SQLite always;
/// PostgreSQL when NATREMIA_TEST_POSTGRES holds a connection string.
/// </summary>
[InProcess]
[MemoryDiagnoser]
[MinIterationCount(8)]
[MaxIterationCount(20)]
public class StoreWriteBenchmarks
{
    private string _folder = string.Empty;
    private IAuditStore _store = null!;
    private IssuedCardRecord _target = null!;

    public static IEnumerable<string> Stores()
    {
        yield return "sqlite";
        if (!string.IsNullOrEmpty(Environment.GetEnvironmentVariable("NATREMIA_TEST_POSTGRES")))
        {
            yield return "postgresql";
        }
    }

    [ParamsSource(nameof(Stores))]
    public string Store { get; set; } = "sqlite";

    [GlobalSetup]
    public void Setup()
    {
        _folder = Path.Combine(Path.GetTempPath(), "natremia-bench", Guid.NewGuid().ToString("N"));
        _store = Store == "sqlite"
            ? new SqliteAuditStore(Path.Combine(_folder, "audit.db"))
            : new PostgresAuditStore(Environment.GetEnvironmentVariable("NATREMIA_TEST_POSTGRES")!);
        _store.InitializeAsync(CancellationToken.None).GetAwaiter().GetResult();
        _target = Card();
        _store.RecordIssuedAsync([_target], CancellationToken.None).GetAwaiter().GetResult();
    }

    [GlobalCleanup]
    public void Cleanup()
    {
        _store.DisposeAsync().AsTask().GetAwaiter().GetResult();
        if (Directory.Exists(_folder))
        {
            Directory.Delete(_folder, recursive: true);
        }
    }

    [Benchmark(Description = "record 1 card")]
    public Task RecordOneCard() => _store.RecordIssuedAsync([Card()], CancellationToken.None);

    [Benchmark(Description = "record 3 cards")]
    public Task RecordThreeCards() => _store.RecordIssuedAsync([Card(), Card(), Card()], CancellationToken.None);

    [Benchmark(Description = "record 1 feedback")]
    public Task RecordFeedback() => _store.RecordFeedbackAsync("natremia-chart-review",
        [new FeedbackEntry { Card = _target.CardUuid, Outcome = FeedbackOutcome.Overridden, OutcomeTimestamp = DateTimeOffset.UnixEpoch.AddTicks(Random.Shared.NextInt64(1, 10_000_000_000)) }],
        DateTimeOffset.UtcNow, CancellationToken.None);

    /// <summary>32 answers at once (one per connection of the load run), each in a transaction of its own.</summary>
    [Benchmark(Description = "32 concurrent answers, per-answer commit")]
    public Task ThirtyTwoAnswersEachCommitted() => Task.WhenAll(Enumerable.Range(0, 32).Select(_ => _store.RecordIssuedAsync([Card()], CancellationToken.None)));

    /// <summary>The same 32 answers through the group-commit writer: those queued together share a transaction.</summary>
    [Benchmark(Description = "32 concurrent answers, group commit")]
    public async Task ThirtyTwoAnswersGroupCommitted()
    {
        await using var queue = new AuditWriteQueue(_store, capacity: 1024, maxAnswersPerCommit: 256);
        await Task.WhenAll(Enumerable.Range(0, 32).Select(_ => queue.RecordAsync([Card()], CancellationToken.None)));
    }

    private static IssuedCardRecord Card() => new()
    {
        CardUuid = Guid.NewGuid(),
        ServiceId = "natremia-chart-review",
        Hook = "patient-view",
        HookInstance = Guid.NewGuid(),
        PatientPseudonym = "4f2c9b0e7d1a6c3b8e5f0a2d4c6b8e1f3a5c7e9b0d2f4a6c8e0b2d4f6a8c0e2b",
        RuleIds = ["sodium.severity", "workup.tonicity"],
        KnowledgeVersion = "bench",
        SoftwareVersion = "bench",
        Indicator = "critical",
        Topic = "sodium-assessment",
        Summary = "Sodium 124 mmol/L (profound hyponatremia, 10 Mar 07:40 UTC).",
        ResourcesUsed = ["Observation/na-1", "Observation/na-0"],
        SuggestionUuids = new Dictionary<string, Guid> { ["order-sodium"] = Guid.NewGuid() },
        IssuedAt = DateTimeOffset.UtcNow,
    };
}
