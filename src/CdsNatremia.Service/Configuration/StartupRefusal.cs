using System.Reflection;
using CdsNatremia.Audit;
using CdsNatremia.Fhir.Knowledge;
using Microsoft.Extensions.Options;

namespace CdsNatremia.Service.Configuration;

/// <summary>
/// Turns a configuration problem found at start-up into one log line on standard error, naming the setting and the
/// fix, and a non-zero exit code, instead of an unhandled exception with a stack trace. Only the refusals the service
/// raises on purpose are turned into a line (options validation, knowledge files, the pseudonym key, other start-up
/// settings); anything else is a fault and keeps its stack trace.
/// </summary>
public static class StartupRefusal
{
    /// <summary>The exit code of a refused start: 78, "configuration error" in the BSD sysexits convention.</summary>
    public const int ExitCode = 78;

    /// <summary>
    /// True when the service runs as its own process. Under a test host (WebApplicationFactory) the exception is left
    /// to propagate, so tests read the whole message from it.
    /// </summary>
    public static bool IsProcessEntry => Assembly.GetEntryAssembly() == typeof(StartupRefusal).Assembly;

    /// <summary>Runs every options check registered with ValidateOnStart now, before the server starts.</summary>
    public static void ValidateNow(IServiceProvider services)
    {
        ArgumentNullException.ThrowIfNull(services);
        services.GetService<IStartupValidator>()?.Validate();
    }

    /// <summary>The reason for a refusal, as one line, or null when the exception is not a configuration refusal.</summary>
    public static string? Describe(Exception exception)
    {
        var reasons = Reasons(exception).ToList();
        return reasons.Count == 0 || reasons.Contains(null) ? null : OneLine(string.Join(" | ", reasons.Distinct(StringComparer.Ordinal)));
    }

    /// <summary>The log line written to standard error.</summary>
    public static string LogLine(string reason) => "crit: CdsNatremia.Service refused to start: " + reason;

    private static IEnumerable<string?> Reasons(Exception exception) => exception switch
    {
        OptionsValidationException options => options.Failures.Select(f => f.Trim()),
        AggregateException aggregate => aggregate.InnerExceptions.SelectMany(Reasons),
        KnowledgeLoadException knowledge => [$"Natremia:KnowledgeDirectory: {knowledge.Message} Fix or restore the knowledge files (see profiles/README.md), or point Natremia:KnowledgeDirectory at a complete copy."],
        AuditConfigurationException audit => [audit.Message],
        StartupConfigurationException setting => [setting.Message],
        TargetInvocationException { InnerException: { } inner } => Reasons(inner),
        _ => [null],
    };

    private static string OneLine(string text)
        => string.Join(' ', text.Split(['\r', '\n'], StringSplitOptions.RemoveEmptyEntries | StringSplitOptions.TrimEntries));
}
