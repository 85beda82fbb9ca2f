using System.ComponentModel;
using CdsNatremia.Scenarios;
using Spectre.Console;
using Spectre.Console.Cli;

namespace CdsNatremia.Cli.Commands;

/// <summary>natremia scenarios list: the invented patients and what a clinician would expect for each.</summary>
internal sealed class ScenariosListCommand : Command<ScenariosListCommand.Settings>
{
    internal sealed class Settings : CommandSettings
    {
        [CommandOption("--json")]
        [Description("Print the list as JSON.")]
        public bool Json { get; set; }
    }

    public override int Execute(CommandContext context, Settings settings, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(settings);
        if (settings.Json)
        {
            CommandSupport.WriteJson(ScenarioManifest.Describe(ScenarioLibrary.All, TimeSpan.Zero, ScenarioLibrary.Anchor));
            return ExitCodes.Ok;
        }

        Print(AnsiConsole.Console, ScenarioLibrary.All);
        return ExitCodes.Ok;
    }

    /// <summary>
    /// One heading line per scenario (id, hook, expected card, never wrapped inside an id: ids hold no spaces and
    /// start the line), then what a clinician would expect as a paragraph indented under it, wrapped to the console.
    /// </summary>
    public static void Print(IAnsiConsole console, IReadOnlyList<Scenario> scenarios)
    {
        ArgumentNullException.ThrowIfNull(console);
        ArgumentNullException.ThrowIfNull(scenarios);
        var idWidth = scenarios.Max(s => s.Id.Length);
        var hookWidth = scenarios.Max(s => s.Hook.Length);
        foreach (var scenario in scenarios)
        {
            var expected = scenario.ExpectsCard ? $"{scenario.ExpectedIndicator ?? "card"} ({scenario.ExpectedBand})" : $"no card ({scenario.ExpectedBand})";
            console.MarkupLine($"[bold]{Markup.Escape(scenario.Id.PadRight(idWidth))}[/]  {Markup.Escape(scenario.Hook.PadRight(hookWidth))}  {Markup.Escape(expected)}");
            console.Write(new Padder(new Text(scenario.ClinicianExpects ?? scenario.Title), new Padding(4, 0, 0, 1)));
        }

        console.MarkupLine($"{scenarios.Count} scenarios, written as of {ScenarioLibrary.Anchor:yyyy-MM-dd HH:mm} UTC. [grey]natremia scenarios write <folder> --as-of now[/] writes them.");
    }
}
