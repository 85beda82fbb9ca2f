using System.Globalization;
using System.Text.Encodings.Web;
using System.Text.Json;
using System.Text.Json.Serialization;
using CdsNatremia.Scenarios;

namespace CdsNatremia.Cli.Commands;

/// <summary>Small helpers every command shares: reading --as-of, writing JSON.</summary>
internal static class CommandSupport
{
    /// <summary>JSON for programs: camelCase, indented, "\n" line ends, non-ASCII kept readable.</summary>
    public static readonly JsonSerializerOptions Json = new()
    {
        PropertyNamingPolicy = JsonNamingPolicy.CamelCase,
        DictionaryKeyPolicy = null,
        WriteIndented = true,
        NewLine = "\n",
        Encoder = JavaScriptEncoder.UnsafeRelaxedJsonEscaping,
        DefaultIgnoreCondition = JsonIgnoreCondition.WhenWritingNull,
    };

    /// <summary>
    /// Reads --as-of: "anchor" (the scenario library's time, 2026-03-10T12:00:00Z), "now" (the wall clock, rounded
    /// down to the second), or an ISO 8601 instant with a zone.
    /// </summary>
    public static DateTimeOffset AsOf(string? text, TimeProvider time)
    {
        ArgumentNullException.ThrowIfNull(time);
        switch (text?.Trim().ToLowerInvariant())
        {
            case null or "" or "now":
                var now = time.GetUtcNow();
                return new DateTimeOffset(now.Ticks - (now.Ticks % TimeSpan.TicksPerSecond), TimeSpan.Zero);
            case "anchor":
                return ScenarioLibrary.Anchor;
        }

        if (DateTimeOffset.TryParse(text, CultureInfo.InvariantCulture, DateTimeStyles.AssumeUniversal | DateTimeStyles.AdjustToUniversal, out var instant))
        {
            return instant;
        }

        throw new ToolException(ExitCodes.Usage, $"--as-of '{text}' is not 'now', 'anchor' or an ISO 8601 instant.");
    }

    /// <summary>Writes an object as JSON to standard output.</summary>
    public static void WriteJson<T>(T value) => Console.Out.WriteLine(JsonSerializer.Serialize(value, Json));

    /// <summary>Writes an object as JSON to a file (creating its folder).</summary>
    public static void WriteJsonFile<T>(string path, T value)
    {
        var folder = Path.GetDirectoryName(Path.GetFullPath(path));
        if (folder is not null)
        {
            Directory.CreateDirectory(folder);
        }

        File.WriteAllText(path, JsonSerializer.Serialize(value, Json) + "\n");
    }

    /// <summary>Reads a file the user named, or explains why it cannot be read (exit 2).</summary>
    public static string ReadFile(string path)
    {
        try
        {
            return File.ReadAllText(path);
        }
        catch (Exception ex) when (ex is IOException or UnauthorizedAccessException or ArgumentException or NotSupportedException)
        {
            throw new ToolException(ExitCodes.Usage, $"Cannot read {path}: {ex.Message}");
        }
    }
}
