using System.Collections.Concurrent;
using Microsoft.Extensions.Logging;

namespace CdsNatremia.Service.Tests.Support;

/// <summary>
/// Keeps every log line the service writes, at every level and in every category, as the text an operator would
/// read: the formatted message, each structured value, and any exception in full.
/// </summary>
public sealed class CapturingLoggerProvider : ILoggerProvider
{
    private readonly ConcurrentQueue<string> _lines = new();

    public IReadOnlyList<string> Lines => [.. _lines];

    /// <summary>Forgets what was captured (tests in one class run one after another).</summary>
    public void Clear() => _lines.Clear();

    public ILogger CreateLogger(string categoryName) => new CapturingLogger(categoryName, _lines);

    public void Dispose()
    {
    }
}
