using System.ComponentModel.DataAnnotations;

namespace CdsNatremia.Service.Security;

/// <summary>
/// Bounds on what a caller may send, bound from "Natremia:Limits". The JSON nesting limit lives with the host options
/// (Natremia:MaxJsonDepth).
/// </summary>
public sealed class InputLimitsOptions
{
    /// <summary>The configuration section.</summary>
    public const string Section = "Natremia:Limits";

    /// <summary>
    /// Largest request body, in bytes; beyond it the answer is 413, also for chunked bodies that announce no length.
    /// Default 4 MiB: the largest scenario request is far smaller, and a year of laboratory results in prefetch fits.
    /// </summary>
    [Range(16_384, 268_435_456)]
    public long MaxRequestBodyBytes { get; set; } = 4 * 1024 * 1024;

    /// <summary>
    /// Most Bundle entries accepted in one request, counted across every Bundle in prefetch and context (nested Bundles
    /// included). Beyond it the answer is 413: the request is well formed, just more than the service will work through.
    /// Default 2000.
    /// </summary>
    [Range(10, 1_000_000)]
    public int MaxBundleEntries { get; set; } = 2000;

    /// <summary>Time a client has to send all request headers, in seconds (Kestrel). Default 15 (Kestrel's own is 30).</summary>
    [Range(1, 300)]
    public int RequestHeadersTimeoutSeconds { get; set; } = 15;

    /// <summary>
    /// Slowest accepted request body rate, in bytes per second, after the grace period (Kestrel); a slower or stalled
    /// body is cut off. Default 240, Kestrel's own.
    /// </summary>
    [Range(1, 10_000_000)]
    public double MinRequestBodyBytesPerSecond { get; set; } = 240;

    /// <summary>Grace period before the body rate is enforced, in seconds. Default 5, Kestrel's own.</summary>
    [Range(1, 120)]
    public int MinRequestBodyGraceSeconds { get; set; } = 5;

    /// <summary>Longest time a keep-alive connection may idle, in seconds (Kestrel). Default 60.</summary>
    [Range(5, 600)]
    public int KeepAliveTimeoutSeconds { get; set; } = 60;
}
