using CdsNatremia.Cli.Commands;
using CdsNatremia.Scenarios;
using Spectre.Console;

namespace CdsNatremia.Cli.Tests.Commands;

/// <summary>scenarios list on a narrow console: ids are never broken across lines.</summary>
public class ScenariosListTests
{
    [Theory]
    [InlineData(80)]
    [InlineData(60)]
    public void Print_NarrowConsole_EveryIdWholeAtTheStartOfALine(int width)
    {
        using var writer = new StringWriter();
        var console = AnsiConsole.Create(new AnsiConsoleSettings { Ansi = AnsiSupport.No, ColorSystem = ColorSystemSupport.NoColors, Out = new AnsiConsoleOutput(writer) });
        console.Profile.Width = width;

        ScenariosListCommand.Print(console, ScenarioLibrary.All);

        var lines = writer.ToString().Split('\n');
        Assert.All(ScenarioLibrary.All, s => Assert.Contains(lines, l => l.StartsWith(s.Id + " ", StringComparison.Ordinal)));
        Assert.All(lines, l => Assert.True(l.TrimEnd().Length <= width, $"longer than {width}: {l}"));
    }
}
