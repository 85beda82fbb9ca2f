using System.ComponentModel.DataAnnotations;

namespace CdsNatremia.Cli.Load;

/// <summary>How hard and how long to load a service. Both a duration and a request count bound every run.</summary>
internal sealed record LoadPlan
{
    /// <summary>Longest run allowed, in seconds (10 minutes): a load test is bounded by design.</summary>
    public const int MaxDurationSeconds = 600;

    /// <summary>Most requests allowed in one run.</summary>
    public const int MaxRequests = 1_000_000;

    /// <summary>Requests in flight at once. Default 8.</summary>
    [Range(1, 256)]
    public int Concurrency { get; init; } = 8;

    /// <summary>Stop after this long. Default 30 s.</summary>
    public TimeSpan Duration { get; init; } = TimeSpan.FromSeconds(30);

    /// <summary>Stop after this many requests (null: only the duration bounds the run).</summary>
    public int? Requests { get; init; }

    /// <summary>Refuses plans outside the bounds.</summary>
    public void Validate()
    {
        if (Concurrency is < 1 or > 256)
        {
            throw new ToolException(ExitCodes.Usage, "--concurrency must be between 1 and 256.");
        }

        if (Duration <= TimeSpan.Zero || Duration > TimeSpan.FromSeconds(MaxDurationSeconds))
        {
            throw new ToolException(ExitCodes.Usage, $"--duration must be between 1 and {MaxDurationSeconds} seconds.");
        }

        if (Requests is < 1 or > MaxRequests)
        {
            throw new ToolException(ExitCodes.Usage, $"--requests must be between 1 and {MaxRequests}.");
        }
    }
}
