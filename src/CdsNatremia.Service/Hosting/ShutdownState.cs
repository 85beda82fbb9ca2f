namespace CdsNatremia.Service.Hosting;

/// <summary>Whether the service is draining after a stop signal; readiness reports "draining" (503) from then on.</summary>
public sealed class ShutdownState
{
    private volatile bool _draining;

    /// <summary>True once the host has begun to stop.</summary>
    public bool Draining => _draining;

    /// <summary>Marks the service as draining.</summary>
    public void BeginDraining() => _draining = true;
}
