using CdsNatremia.Cli.Commands;

namespace CdsNatremia.Cli.Tests.Commands;

/// <summary>Every command refuses an option it does not know (exit 2) and names the option that was probably meant.</summary>
public class StrictOptionsTests
{
    /// <summary>Each command with its required arguments, a misspelling of one of its options, and that option.</summary>
    public static TheoryData<string[], string, string> Misspellings() => new()
    {
        { ["scenarios", "list"], "--jsn", "--json" },
        { ["scenarios", "write", "unused-folder"], "--as-off", "--as-of" },
        { ["population", "generate", "unused-folder"], "--cuont", "--count" },
        { ["population", "survey"], "--sede", "--seed" },
        { ["replay", "01"], "--no-prefech", "--no-prefetch" },
        { ["conform"], "--signing-kee", "--signing-key" },
        { ["load"], "--durration", "--duration" },
        { ["report"], "--admin-kye", "--admin-key" },
        { ["check-input", "unused.json"], "--stale-afer", "--stale-after" },
    };

    [Theory]
    [MemberData(nameof(Misspellings))]
    public async Task Main_MisspelledOption_UsageErrorBeforeAnythingRuns(string[] command, string misspelled, string meant)
    {
        _ = meant;
        // Nothing is written or sent: the parser stops first (the folders and files named do not exist).
        Assert.Equal(ExitCodes.Usage, await Program.Main([.. command, misspelled, "5"]));
        Assert.Equal(ExitCodes.Usage, await Program.Main([.. command, "--no-such-option"]));
    }

    [Theory]
    [MemberData(nameof(Misspellings))]
    public void Hint_MisspelledOption_NamesTheCommandsOwnOption(string[] command, string misspelled, string meant)
    {
        var hint = OptionSuggestions.Hint($"Unknown option '{misspelled.TrimStart('-')}'.", [.. command, misspelled]);
        Assert.Equal($"Did you mean '{meant}'? 'natremia {string.Join(' ', command.TakeWhile(w => !w.StartsWith("unused", StringComparison.Ordinal) && w != "01"))} --help' lists its options.", hint);
    }

    [Fact]
    public void Hint_NothingClose_OnlyWhereTheListIs()
        => Assert.Equal("'natremia load --help' lists its options.", OptionSuggestions.Hint("Unknown option 'zzzzzzzzzz'.", ["load", "--zzzzzzzzzz"]));

    [Theory]
    [InlineData("check-input a.json b.json")] // one file only
    [InlineData("scenarios list extra")]
    [InlineData("conform stray")]
    public async Task Main_UnexpectedArgument_UsageError(string commandLine)
        => Assert.Equal(ExitCodes.Usage, await Program.Main(commandLine.Split(' ')));

    [Fact]
    public void Commands_EveryCommandOfTheTool_HasItsOptionsListed()
    {
        // The commands of Program.Main; a command added there without an entry here would get no hint.
        string[] commands = ["scenarios list", "scenarios write", "population generate", "population survey", "replay", "conform", "load", "report", "check-input"];
        Assert.Equal(commands.Order(StringComparer.Ordinal), OptionSuggestions.Commands.Keys.Order(StringComparer.Ordinal));
        Assert.All(commands, c => Assert.Contains("--help", OptionSuggestions.OptionsOf(c)));
    }
}
