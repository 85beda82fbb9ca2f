using System.Collections.Concurrent;

namespace CdsNatremia.Service.Security;

/// <summary>
/// The per-process replay cache, one <see cref="TokenReplayCache"/> per trusted client, each holding at most
/// <c>capacityPerClient</c> ids. A client that fills its own partition (a flood, or a stolen key) is refused with 503
/// while every other client goes on being served. Only issuers that passed the signature check reach it, so the number
/// of partitions is bounded by the configured clients.
/// </summary>
internal sealed class PartitionedReplayCache(int capacityPerClient) : ITokenReplayStore
{
    private readonly ConcurrentDictionary<string, TokenReplayCache> _byIssuer = new(StringComparer.Ordinal);

    public string Kind => "process";

    /// <summary>Ids held now for one issuer.</summary>
    public int CountOf(string issuer) => _byIssuer.TryGetValue(issuer, out var cache) ? cache.Count : 0;

    public ReplayCheck TryUse(string issuer, string jti, DateTimeOffset forgetAfter, DateTimeOffset now)
        => _byIssuer.GetOrAdd(issuer, _ => new TokenReplayCache(capacityPerClient)).TryUse(issuer, jti, forgetAfter, now);

    public ValueTask<ReplayCheck> TryUseAsync(string issuer, string jti, DateTimeOffset forgetAfter, DateTimeOffset now, CancellationToken cancellationToken)
        => ValueTask.FromResult(TryUse(issuer, jti, forgetAfter, now));
}
