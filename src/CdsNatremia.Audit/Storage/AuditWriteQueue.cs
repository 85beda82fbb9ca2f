using System.Threading.Channels;
using CdsNatremia.Audit.Records;

namespace CdsNatremia.Audit.Storage;

/// <summary>
/// Group commit of issued-card records. Answers put their records on a bounded queue and wait; one writer takes every
/// answer queued at that moment (up to <see cref="AuditOptions.MaxAnswersPerCommit"/>), writes all their records in one
/// transaction of the store (one commit, one disk flush), and only then releases each of those answers. So an answer is
/// still sent only after its record is durable, but concurrent answers share the flush instead of queuing for one each.
/// <para>
/// A full queue refuses the answer at once (<see cref="AuditQueueFullException"/>): nothing is accepted that is not then
/// written or reported as failed. When a batch's transaction fails, each of its answers is retried in a transaction of
/// its own, so one answer's records can never cost the others theirs; an answer whose own write fails gets the store's
/// exception. <see cref="CompleteAsync"/> (graceful shutdown, disposal) stops taking answers and writes everything
/// queued before it returns. Thread-safe; one instance per store.
/// </para>
/// </summary>
public sealed class AuditWriteQueue : IAsyncDisposable
{
    private readonly IAuditStore _store;
    private readonly Channel<Pending> _queue;
    private readonly int _maxAnswersPerCommit;
    private readonly Task _writer;
    private long _commits;
    private bool _closed;

    /// <summary>Starts the writer over a store.</summary>
    /// <param name="store">The store the records go to.</param>
    /// <param name="capacity">Answers that may wait at once (<see cref="AuditOptions.WriteQueueCapacity"/>).</param>
    /// <param name="maxAnswersPerCommit">Most answers per transaction (<see cref="AuditOptions.MaxAnswersPerCommit"/>).</param>
    public AuditWriteQueue(IAuditStore store, int capacity, int maxAnswersPerCommit)
    {
        ArgumentNullException.ThrowIfNull(store);
        ArgumentOutOfRangeException.ThrowIfLessThan(capacity, 1);
        ArgumentOutOfRangeException.ThrowIfLessThan(maxAnswersPerCommit, 1);
        _store = store;
        _maxAnswersPerCommit = maxAnswersPerCommit;
        Capacity = capacity;
        _queue = Channel.CreateBounded<Pending>(new BoundedChannelOptions(capacity)
        {
            FullMode = BoundedChannelFullMode.Wait, // TryWrite then says "full" instead of dropping anything
            SingleReader = true,
            SingleWriter = false,
            AllowSynchronousContinuations = false,
        });
        _writer = Task.Run(WriteLoopAsync);
    }

    /// <summary>Answers that may wait at once.</summary>
    public int Capacity { get; }

    /// <summary>Transactions committed (or attempted) so far: fewer than the answers when records shared a commit.</summary>
    public long Commits => Interlocked.Read(ref _commits);

    /// <summary>Answers waiting for the writer right now.</summary>
    public int Waiting => _queue.Reader.Count;

    /// <summary>
    /// Queues one answer's records; the task completes once they are durably committed (or fails with the store's
    /// exception). Throws <see cref="AuditQueueFullException"/> at once when the queue is full. After
    /// <see cref="CompleteAsync"/> the records are written directly, in a transaction of their own.
    /// </summary>
    /// <param name="records">The records of one answer (written all or none).</param>
    /// <param name="cancellationToken">Stops the wait, not the write: records already queued are still committed.</param>
    public Task RecordAsync(IReadOnlyList<IssuedCardRecord> records, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(records);
        if (records.Count == 0)
        {
            return Task.CompletedTask;
        }

        var pending = new Pending(records, new TaskCompletionSource(TaskCreationOptions.RunContinuationsAsynchronously));
        if (!_queue.Writer.TryWrite(pending))
        {
            if (Volatile.Read(ref _closed))
            {
                // Shutting down (the server has drained): a late answer is written on its own, never lost.
                return _store.RecordIssuedAsync(records, cancellationToken);
            }

            throw new AuditQueueFullException(Capacity);
        }

        return cancellationToken.CanBeCanceled ? pending.Done.Task.WaitAsync(cancellationToken) : pending.Done.Task;
    }

    /// <summary>Stops taking answers and returns once every queued answer's records are written (or failed).</summary>
    public async Task CompleteAsync()
    {
        Volatile.Write(ref _closed, true);
        _queue.Writer.TryComplete();
        await _writer.ConfigureAwait(false);
    }

    /// <inheritdoc />
    public async ValueTask DisposeAsync() => await CompleteAsync().ConfigureAwait(false);

    private async Task WriteLoopAsync()
    {
        var reader = _queue.Reader;
        var batch = new List<Pending>(Math.Min(_maxAnswersPerCommit, 1024));
        while (await reader.WaitToReadAsync().ConfigureAwait(false))
        {
            while (batch.Count < _maxAnswersPerCommit && reader.TryRead(out var pending))
            {
                batch.Add(pending);
            }

            await CommitAsync(batch).ConfigureAwait(false);
            batch.Clear();
        }
    }

    private async Task CommitAsync(List<Pending> batch)
    {
        if (batch.Count == 1)
        {
            await WriteAloneAsync(batch[0]).ConfigureAwait(false);
            return;
        }

        var records = new List<IssuedCardRecord>(batch.Sum(p => p.Records.Count));
        foreach (var pending in batch)
        {
            records.AddRange(pending.Records);
        }

        Interlocked.Increment(ref _commits);
        if (await TryWriteAsync(records).ConfigureAwait(false) is null)
        {
            foreach (var pending in batch)
            {
                pending.Done.TrySetResult();
            }

            return;
        }

        // The shared transaction failed (rolled back whole): each answer on its own, so one answer's records never cost
        // the others theirs, and each failure reaches its own answer.
        foreach (var pending in batch)
        {
            await WriteAloneAsync(pending).ConfigureAwait(false);
        }
    }

    private async Task WriteAloneAsync(Pending pending)
    {
        Interlocked.Increment(ref _commits);
        if (await TryWriteAsync(pending.Records).ConfigureAwait(false) is { } failure)
        {
            pending.Done.TrySetException(failure);
        }
        else
        {
            pending.Done.TrySetResult();
        }
    }

    /// <summary>Writes in one transaction; returns the failure instead of throwing, so the writer never stops.</summary>
#pragma warning disable CA1031 // The writer must survive any store failure: it is handed to the waiting answer instead.
    private async Task<Exception?> TryWriteAsync(IReadOnlyList<IssuedCardRecord> records)
    {
        try
        {
            await _store.RecordIssuedAsync(records, CancellationToken.None).ConfigureAwait(false);
            return null;
        }
        catch (Exception ex)
        {
            return ex;
        }
    }
#pragma warning restore CA1031

    private sealed record Pending(IReadOnlyList<IssuedCardRecord> Records, TaskCompletionSource Done);
}

/// <summary>The audit write queue is full: the answer is refused (503 with Retry-After) and nothing was queued.</summary>
public sealed class AuditQueueFullException : Exception
{
    /// <summary>Creates the exception.</summary>
    public AuditQueueFullException()
        : base("The audit write queue is full.")
    {
    }

    /// <summary>Creates the exception with the queue's capacity.</summary>
    public AuditQueueFullException(int capacity)
        : base($"The audit write queue is full ({capacity} answers waiting); the answer was refused and nothing was queued.")
    {
    }

    /// <summary>Creates the exception with a message.</summary>
    public AuditQueueFullException(string message)
        : base(message)
    {
    }

    /// <summary>Creates the exception with a message and a cause.</summary>
    public AuditQueueFullException(string message, Exception innerException)
        : base(message, innerException)
    {
    }
}
