using System.Text.Json.Serialization;

namespace CdsNatremia.Cli.Load;

/// <summary>The outcome of a load run. Latencies in milliseconds; throughput in requests per second.</summary>
internal sealed record LoadReport
{
    public required string Target { get; init; }

    public required int Concurrency { get; init; }

    public required double ElapsedSeconds { get; init; }

    public required long Requests { get; init; }

    public required long Succeeded { get; init; }

    public required long Errors { get; init; }

    /// <summary>Error counts by kind: "http-412", "http-500", "timeout", "connection", "not-json".</summary>
    public required IReadOnlyDictionary<string, long> ErrorsByKind { get; init; }

    public required double ThroughputPerSecond { get; init; }

    [JsonPropertyName("latencyMs")]
    public required LatencySummary Latency { get; init; }

    /// <summary>Cards returned in total, by indicator.</summary>
    public required IReadOnlyDictionary<string, long> CardsByIndicator { get; init; }
}
