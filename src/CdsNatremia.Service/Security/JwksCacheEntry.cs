using Microsoft.IdentityModel.Tokens;

namespace CdsNatremia.Service.Security;

/// <summary>One JWK Set URL's cached keys and fetch times; the gate lets one fetch run at a time per URL.</summary>
internal sealed class JwksCacheEntry
{
    public SemaphoreSlim Gate { get; } = new(1, 1);

    public IReadOnlyList<JsonWebKey>? Keys { get; set; }

    public DateTimeOffset FetchedAt { get; set; }

    public DateTimeOffset? LastAttempt { get; set; }
}
