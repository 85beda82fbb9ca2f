namespace CdsNatremia.Cli.Hosting;

/// <summary>A clock that always reads one instant: the in-process service judges a replayed patient at the replay's "now".</summary>
internal sealed class FixedTimeProvider(DateTimeOffset now) : TimeProvider
{
    public override DateTimeOffset GetUtcNow() => now;
}
