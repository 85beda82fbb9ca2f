namespace CdsNatremia.Service.Hosting;

/// <summary>Graceful shutdown, bound from the "Natremia:Shutdown" configuration section (docs/deployment.md).</summary>
public sealed class ShutdownOptions
{
    /// <summary>The configuration section.</summary>
    public const string Section = "Natremia:Shutdown";

    /// <summary>
    /// After SIGTERM, how long /readyz answers 503 "draining" while the server still answers, so a load balancer's
    /// health checks take the instance out before it stops accepting. Set it to at least the balancer's check interval
    /// times its failure count (HAProxy <c>inter</c> × <c>fall</c>; Kubernetes readiness <c>periodSeconds</c> ×
    /// <c>failureThreshold</c>). Default 5 s; 0 to 120 s.
    /// </summary>
    public TimeSpan ReadinessDelay { get; set; } = TimeSpan.FromSeconds(5);

    /// <summary>
    /// After the server stops accepting, the longest wait for answers in flight to finish (the CDS Hooks standard asks
    /// for answers within seconds, so 20 s is ample). Default 20 s; 1 to 300 s.
    /// </summary>
    public TimeSpan DrainTimeout { get; set; } = TimeSpan.FromSeconds(20);

    /// <summary>Time kept for flushing the audit trail after the drain.</summary>
    public static readonly TimeSpan FlushAllowance = TimeSpan.FromSeconds(5);

    /// <summary>The host's whole shutdown budget: readiness delay, drain and flush (Kubernetes' termination grace period must be at least this).</summary>
    public TimeSpan Total => ReadinessDelay + DrainTimeout + FlushAllowance;
}
