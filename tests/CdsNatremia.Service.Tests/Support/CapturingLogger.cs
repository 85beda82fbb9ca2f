using System.Collections.Concurrent;
using Microsoft.Extensions.Logging;

namespace CdsNatremia.Service.Tests.Support;

/// <summary>The logger behind <see cref="CapturingLoggerProvider"/>: every level enabled, each entry kept as text.</summary>
internal sealed class CapturingLogger(string category, ConcurrentQueue<string> lines) : ILogger
{
    public IDisposable? BeginScope<TState>(TState state)
        where TState : notnull => null;

    public bool IsEnabled(LogLevel logLevel) => true;

    public void Log<TState>(LogLevel logLevel, EventId eventId, TState state, Exception? exception, Func<TState, Exception?, string> formatter)
    {
        var values = state is IEnumerable<KeyValuePair<string, object?>> pairs
            ? string.Join(" ", pairs.Select(p => $"{p.Key}={p.Value}"))
            : string.Empty;
        lines.Enqueue($"{logLevel} {category}: {formatter(state, exception)} | {values} | {exception}");
    }
}
