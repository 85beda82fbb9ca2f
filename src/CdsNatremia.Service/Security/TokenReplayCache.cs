namespace CdsNatremia.Service.Security;

/// <summary>
/// Remembers each (issuer, jti) until its token expires, so a captured token cannot be sent twice. Memory is bounded:
/// at most <c>capacity</c> entries, each with a jti of bounded length; expired entries are dropped on every call (a
/// priority queue ordered by expiry makes that cheap). One lock keeps it simple and correct: the work under it is a
/// dictionary look-up and a few heap operations.
/// </summary>
internal sealed class TokenReplayCache(int capacity)
{
    private readonly Dictionary<string, DateTimeOffset> _seen = new(StringComparer.Ordinal);
    private readonly PriorityQueue<string, DateTimeOffset> _byExpiry = new();
    private readonly Lock _gate = new();

    /// <summary>Entries held now (after the last purge).</summary>
    public int Count
    {
        get
        {
            lock (_gate)
            {
                return _seen.Count;
            }
        }
    }

    /// <summary>Records the id if it is new; <paramref name="forgetAfter"/> is the token's expiry plus clock skew.</summary>
    public ReplayCheck TryUse(string issuer, string jti, DateTimeOffset forgetAfter, DateTimeOffset now)
    {
        var key = issuer + "\n" + jti;
        lock (_gate)
        {
            while (_byExpiry.TryPeek(out var oldest, out var expiry) && expiry <= now)
            {
                _byExpiry.Dequeue();
                if (_seen.TryGetValue(oldest, out var stored) && stored == expiry)
                {
                    _seen.Remove(oldest);
                }
            }

            if (_seen.ContainsKey(key))
            {
                return ReplayCheck.Replayed;
            }

            if (_seen.Count >= capacity)
            {
                return ReplayCheck.Full;
            }

            _seen[key] = forgetAfter;
            _byExpiry.Enqueue(key, forgetAfter);
            return ReplayCheck.FirstUse;
        }
    }
}
