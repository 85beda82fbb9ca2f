using Microsoft.Extensions.Hosting;

namespace CdsNatremia.Testing;

/// <summary>
/// A host lifetime that holds the host's start until <see cref="Open"/> is called, so the test factory can listen for
/// the outcome of the start before it can happen (see <see cref="NatremiaFactory"/>). Nothing else: no console
/// signals, stopping is immediate.
/// </summary>
internal sealed class StartGate : IHostLifetime
{
    private readonly TaskCompletionSource _open = new(TaskCreationOptions.RunContinuationsAsynchronously);

    /// <summary>Lets the host start.</summary>
    public void Open() => _open.TrySetResult();

    public Task WaitForStartAsync(CancellationToken cancellationToken) => _open.Task.WaitAsync(cancellationToken);

    public Task StopAsync(CancellationToken cancellationToken) => Task.CompletedTask;
}
