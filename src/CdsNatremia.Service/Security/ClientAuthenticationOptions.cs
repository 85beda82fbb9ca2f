using System.ComponentModel.DataAnnotations;

namespace CdsNatremia.Service.Security;

/// <summary>
/// CDS Hooks 2.0 client authentication, bound from "Natremia:Authentication". Every call under /cds-services must carry
/// <c>Authorization: Bearer &lt;JWT&gt;</c> signed by a trusted client. With no trusted client the service runs open,
/// and only in the Development environment (<see cref="ClientAuthenticationOptionsValidator"/>).
/// </summary>
public sealed class ClientAuthenticationOptions
{
    /// <summary>The configuration section.</summary>
    public const string Section = "Natremia:Authentication";

    /// <summary>Every asymmetric JWS algorithm the library can verify; anything else (none, HS*) is never accepted.</summary>
    public static readonly IReadOnlySet<string> AsymmetricAlgorithms = new HashSet<string>(StringComparer.Ordinal)
    {
        "ES256", "ES384", "ES512", "RS256", "RS384", "RS512", "PS256", "PS384", "PS512",
    };

    /// <summary>
    /// The service's public root URL as the EHR calls it (everything before "/cds-services"), e.g.
    /// "https://cds.hospital.example/natremia". The expected <c>aud</c> is this URL followed by the path called, so it
    /// stays right behind a reverse proxy. Required when trusted clients are configured: the Host header a request
    /// carries is chosen by the caller and cannot be trusted to rebuild the audience.
    /// </summary>
    public string? PublicBaseUrl { get; set; }

    /// <summary>The algorithms accepted when none are configured: ES384 and RS384, as CDS Hooks 2.0 recommends.</summary>
    public static readonly IReadOnlyList<string> DefaultAlgorithms = ["ES384", "RS384"];

    /// <summary>
    /// The JWS algorithms accepted; unset means <see cref="DefaultAlgorithms"/> (a configured list replaces the default
    /// rather than adding to it). Only the asymmetric algorithms in <see cref="AsymmetricAlgorithms"/> may be listed;
    /// "none" and HMAC stop the start-up, and are refused at run time whatever the list says.
    /// </summary>
    public IList<string>? Algorithms { get; set; }

    /// <summary>The configured algorithms that are asymmetric, or the default.</summary>
    public IReadOnlyList<string> EffectiveAlgorithms
        => (Algorithms is { Count: > 0 } configured ? (IEnumerable<string>)configured : DefaultAlgorithms).Where(AsymmetricAlgorithms.Contains).ToList();

    /// <summary>Tolerance for clock differences when checking exp, nbf and iat, in seconds. Default 60 (common practice).</summary>
    [Range(0, 300)]
    public int ClockSkewSeconds { get; set; } = 60;

    /// <summary>
    /// Longest accepted token lifetime (exp − iat), in seconds. Default 300: CDS Hooks 2.0 advises an expiry no more
    /// than 5 minutes after issue. It also bounds how long a jti is remembered.
    /// </summary>
    [Range(30, 3600)]
    public int MaxTokenLifetimeSeconds { get; set; } = 300;

    /// <summary>
    /// How many unexpired token ids the per-process replay cache holds for each trusted client (the cache is
    /// partitioned per client). Default 100 000 (about 20 MB at the longest jti): at the default rate limit of 50
    /// calls/s a client holds at most 50 × 360 s = 18 000 ids. When one client's partition is full its new tokens are
    /// refused with 503 rather than letting replays through; other clients are not affected. Not used when the replay
    /// store is PostgreSQL.
    /// </summary>
    [Range(1_000, 10_000_000)]
    public int ReplayCacheCapacity { get; set; } = 100_000;

    /// <summary>Longest accepted bearer token, in characters. Default 8192.</summary>
    [Range(512, 65_536)]
    public int MaxTokenLength { get; set; } = 8192;

    /// <summary>How long a JWK Set fetched from a URL is used before it is fetched again, in seconds. Default 3600.</summary>
    [Range(60, 86_400)]
    public int JwksCacheSeconds { get; set; } = 3600;

    /// <summary>
    /// Least time between two fetches of the same JWK Set URL, in seconds, also when a token names an unknown kid.
    /// Default 60: a stream of tokens with invented kids cannot make the service hammer the client's key server.
    /// </summary>
    [Range(1, 3600)]
    public int JwksMinRefreshSeconds { get; set; } = 60;

    /// <summary>Time allowed for one JWK Set fetch, in seconds. Default 5.</summary>
    [Range(1, 60)]
    public int JwksFetchTimeoutSeconds { get; set; } = 5;

    /// <summary>Largest JWK Set response accepted, in bytes. Default 65 536.</summary>
    [Range(1_024, 1_048_576)]
    public int JwksMaxBytes { get; set; } = 65_536;

    /// <summary>The EHRs (CDS clients) allowed to call, each with its issuer and keys. Empty by default.</summary>
    public IList<TrustedClientOptions> TrustedClients { get; } = [];
}
