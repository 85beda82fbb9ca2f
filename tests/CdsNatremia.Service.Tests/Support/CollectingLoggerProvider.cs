using System.Collections.Concurrent;
using Microsoft.Extensions.Logging;

namespace CdsNatremia.Service.Tests.Support;

/// <summary>Keeps every formatted log message (and exception text), so tests can check what logs never contain.</summary>
public sealed class CollectingLoggerProvider : ILoggerProvider
{
    private readonly ConcurrentQueue<string> _lines = new();

    public IReadOnlyList<string> Lines => _lines.ToList();

    public ILogger CreateLogger(string categoryName) => new Collector(categoryName, _lines);

    public void Dispose()
    {
    }

    private sealed class Collector(string category, ConcurrentQueue<string> lines) : ILogger
    {
        public IDisposable? BeginScope<TState>(TState state)
            where TState : notnull => null;

        public bool IsEnabled(LogLevel logLevel) => true;

        public void Log<TState>(LogLevel logLevel, EventId eventId, TState state, Exception? exception, Func<TState, Exception?, string> formatter)
            => lines.Enqueue($"{category} [{logLevel}] {formatter(state, exception)} {exception}");
    }
}
