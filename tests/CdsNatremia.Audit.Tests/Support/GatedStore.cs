using System.Collections.Concurrent;
using System.Data.Common;
using CdsNatremia.Audit.Records;
using CdsNatremia.Audit.Reports;
using CdsNatremia.Audit.Storage;

namespace CdsNatremia.Audit.Tests.Support;

/// <summary>
/// A real store with a hand on its issued-card writes: each call to <see cref="RecordIssuedAsync"/> is counted with the
/// records it carried, can be held at a gate until the test opens it, and fails (before touching the store) when it
/// carries a poisoned card. Everything else goes straight to the inner store.
/// </summary>
public sealed class GatedStore(IAuditStore inner) : IAuditStore
{
    private readonly ConcurrentQueue<int> _calls = new();
    private readonly ConcurrentDictionary<Guid, bool> _poisoned = new();
    private TaskCompletionSource _gate = Open();
    private TaskCompletionSource _entered = new(TaskCreationOptions.RunContinuationsAsynchronously);

    /// <summary>Records per RecordIssuedAsync call, in order (failed calls included).</summary>
    public IReadOnlyList<int> Calls => [.. _calls];

    /// <summary>Completes when a write has reached the gate (after <see cref="Hold"/>).</summary>
    public Task Entered => _entered.Task;

    /// <summary>From now on writes wait at the gate until <see cref="Release"/>.</summary>
    public void Hold()
    {
        _entered = new TaskCompletionSource(TaskCreationOptions.RunContinuationsAsynchronously);
        _gate = new TaskCompletionSource(TaskCreationOptions.RunContinuationsAsynchronously);
    }

    /// <summary>Lets every held and later write through.</summary>
    public void Release() => _gate.TrySetResult();

    /// <summary>Any write carrying this card fails, as a database refusing it would.</summary>
    public void Poison(Guid card) => _poisoned[card] = true;

    public string Kind => inner.Kind;

    public Task InitializeAsync(CancellationToken cancellationToken) => inner.InitializeAsync(cancellationToken);

    public async Task RecordIssuedAsync(IReadOnlyList<IssuedCardRecord> cards, CancellationToken cancellationToken)
    {
        _calls.Enqueue(cards.Count);
        _entered.TrySetResult();
        await _gate.Task.WaitAsync(cancellationToken);
        if (cards.Any(c => _poisoned.ContainsKey(c.CardUuid)))
        {
            throw new RefusedException();
        }

        await inner.RecordIssuedAsync(cards, cancellationToken);
    }

    public Task<FeedbackResult> RecordFeedbackAsync(string serviceId, IReadOnlyList<FeedbackEntry> entries, DateTimeOffset receivedAt, CancellationToken cancellationToken)
        => inner.RecordFeedbackAsync(serviceId, entries, receivedAt, cancellationToken);

    public Task<DateTimeOffset?> LastReviewedAsync(string patientPseudonym, string fingerprint, DateTimeOffset since, CancellationToken cancellationToken)
        => inner.LastReviewedAsync(patientPseudonym, fingerprint, since, cancellationToken);

    public Task<IssuedCardRecord?> FindCardAsync(Guid cardUuid, CancellationToken cancellationToken) => inner.FindCardAsync(cardUuid, cancellationToken);

    public Task<IReadOnlyList<FeedbackEntry>> FindFeedbackAsync(Guid cardUuid, CancellationToken cancellationToken) => inner.FindFeedbackAsync(cardUuid, cancellationToken);

    public Task<OverrideReport> ReportAsync(DateTimeOffset from, DateTimeOffset to, string? serviceId, bool includeTestTraffic, CancellationToken cancellationToken)
        => inner.ReportAsync(from, to, serviceId, includeTestTraffic, cancellationToken);

    public Task<int> PurgeAsync(DateTimeOffset issuedBefore, CancellationToken cancellationToken) => inner.PurgeAsync(issuedBefore, cancellationToken);

    public Task<(long Cards, long Feedback)> CountAsync(CancellationToken cancellationToken) => inner.CountAsync(cancellationToken);

    public ValueTask DisposeAsync() => ValueTask.CompletedTask; // the inner store belongs to the test's scope

    private static TaskCompletionSource Open()
    {
        var open = new TaskCompletionSource(TaskCreationOptions.RunContinuationsAsynchronously);
        open.SetResult();
        return open;
    }

    /// <summary>What a database refusing a write throws.</summary>
    public sealed class RefusedException() : DbException("The database refused the write.");
}
