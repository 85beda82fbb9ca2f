namespace CdsNatremia.Cli.Load;

/// <summary>A snapshot during a run, for the live display.</summary>
/// <param name="Completed">Requests answered (or failed) so far.</param>
/// <param name="Errors">Of which errors.</param>
/// <param name="Elapsed">Time since the start.</param>
internal readonly record struct LoadProgress(long Completed, long Errors, TimeSpan Elapsed);
