using System.ComponentModel.DataAnnotations;

namespace CdsNatremia.Service.Security;

/// <summary>
/// Per-client rate limits on /cds-services, bound from "Natremia:RateLimiting". Each authenticated client (issuer) has
/// its own token bucket (ASP.NET Core's rate limiter, partitioned by client): a burst of <see cref="TokenLimit"/>
/// calls, refilled by <see cref="TokensPerPeriod"/> every <see cref="ReplenishmentPeriodSeconds"/>. A call beyond it
/// gets 429 with Retry-After; other clients are not affected. Defaults (common practice, to be fitted per site): a
/// busy EHR sends a few hook calls per second, so 50 per second sustained with bursts of 200 leaves ample room while
/// one client (or a stolen key) cannot fill its replay cache partition (50 × 360 s = 18 000 of 100 000 ids).
/// Without trusted clients (Development only) no call is limited: there is no client to tell apart.
/// </summary>
public sealed class RateLimitingOptions
{
    /// <summary>The configuration section.</summary>
    public const string Section = "Natremia:RateLimiting";

    /// <summary>Whether calls are limited. Default true.</summary>
    public bool Enabled { get; set; } = true;

    /// <summary>Largest burst per client (bucket size). Default 200.</summary>
    [Range(1, 1_000_000)]
    public int TokenLimit { get; set; } = 200;

    /// <summary>Calls added to each client's bucket every period. Default 50.</summary>
    [Range(1, 1_000_000)]
    public int TokensPerPeriod { get; set; } = 50;

    /// <summary>The refill period, in seconds. Default 1.</summary>
    [Range(1, 86_400)]
    public int ReplenishmentPeriodSeconds { get; set; } = 1;
}
