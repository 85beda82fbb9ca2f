using System.Reflection;
using System.Text.RegularExpressions;
using Spectre.Console.Cli;

namespace CdsNatremia.Cli.Commands;

/// <summary>
/// "Did you mean" for a misspelled option: the parser (strict on every command) names the unknown option; this finds
/// the command on the command line and the closest of its own options.
/// </summary>
internal static partial class OptionSuggestions
{
    /// <summary>Each command's words and its settings type, as Program registers them.</summary>
    public static IReadOnlyDictionary<string, Type> Commands { get; } = new Dictionary<string, Type>(StringComparer.Ordinal)
    {
        ["scenarios list"] = typeof(ScenariosListCommand.Settings),
        ["scenarios write"] = typeof(ScenariosWriteCommand.Settings),
        ["population generate"] = typeof(PopulationGenerateCommand.Settings),
        ["population survey"] = typeof(PopulationSurveyCommand.Settings),
        ["replay"] = typeof(ReplayCommand.Settings),
        ["conform"] = typeof(ConformCommand.Settings),
        ["load"] = typeof(LoadCommand.Settings),
        ["report"] = typeof(ReportCommand.Settings),
        ["check-input"] = typeof(CheckInputCommand.Settings),
    };

    /// <summary>The command named by the first words of <paramref name="args"/>, or null.</summary>
    public static string? CommandOf(IReadOnlyList<string> args)
    {
        ArgumentNullException.ThrowIfNull(args);
        var words = args.TakeWhile(a => !a.StartsWith('-')).Take(2).ToList();
        for (var n = words.Count; n > 0; n--)
        {
            var name = string.Join(' ', words.Take(n));
            if (Commands.ContainsKey(name))
            {
                return name;
            }
        }

        return null;
    }

    /// <summary>Every option of a command, long names as "--name" and short ones as "-n".</summary>
    public static IReadOnlyList<string> OptionsOf(string command)
    {
        var type = Commands[command];
        return type.GetProperties(BindingFlags.Public | BindingFlags.Instance)
            .Select(p => p.GetCustomAttribute<CommandOptionAttribute>())
            .Where(a => a is not null)
            .SelectMany(a => a!.LongNames.Select(n => "--" + n).Concat(a.ShortNames.Select(n => "-" + n)))
            .Append("--help")
            .ToList();
    }

    /// <summary>
    /// The hint for a parse error, or null: for an unknown option, the command's closest option (edit distance at most
    /// 3, or one that starts with what was typed) and where the full list is.
    /// </summary>
    public static string? Hint(string message, IReadOnlyList<string> args)
    {
        ArgumentNullException.ThrowIfNull(message);
        var unknown = UnknownOption().Match(message);
        var command = CommandOf(args);
        if (!unknown.Success || command is null)
        {
            return null;
        }

        var typed = "--" + unknown.Groups[1].Value.TrimStart('-');
        var best = OptionsOf(command)
            .Where(o => o.StartsWith("--", StringComparison.Ordinal))
            .Select(o => (Option: o, Distance: o.StartsWith(typed, StringComparison.OrdinalIgnoreCase) ? 0 : Distance(typed.ToLowerInvariant(), o)))
            .Where(x => x.Distance <= 3)
            .OrderBy(x => x.Distance)
            .ThenBy(x => x.Option, StringComparer.Ordinal)
            .Select(x => x.Option)
            .FirstOrDefault();
        var list = $"'natremia {command} --help' lists its options.";
        return best is null ? list : $"Did you mean '{best}'? {list}";
    }

    /// <summary>Levenshtein distance (insertions, deletions, substitutions).</summary>
    public static int Distance(string a, string b)
    {
        ArgumentNullException.ThrowIfNull(a);
        ArgumentNullException.ThrowIfNull(b);
        var previous = Enumerable.Range(0, b.Length + 1).ToArray();
        for (var i = 1; i <= a.Length; i++)
        {
            var current = new int[b.Length + 1];
            current[0] = i;
            for (var j = 1; j <= b.Length; j++)
            {
                current[j] = Math.Min(Math.Min(current[j - 1] + 1, previous[j] + 1), previous[j - 1] + (a[i - 1] == b[j - 1] ? 0 : 1));
            }

            previous = current;
        }

        return previous[b.Length];
    }

    [GeneratedRegex("^Unknown option '([^']+)'")]
    private static partial Regex UnknownOption();
}
