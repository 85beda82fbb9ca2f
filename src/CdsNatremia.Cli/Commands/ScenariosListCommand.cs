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

        var table = new Table().Border(TableBorder.Simple).AddColumns("id", "hook", "expected", "what a clinician would expect");
        foreach (var scenario in ScenarioLibrary.All)
        {
            var expected = scenario.ExpectsCard ? $"{scenario.ExpectedIndicator ?? "card"} ({scenario.ExpectedBand})" : $"no card ({scenario.ExpectedBand})";
            table.AddRow(Markup.Escape(scenario.Id), scenario.Hook, Markup.Escape(expected), Markup.Escape(scenario.ClinicianExpects ?? scenario.Title));
        }

        AnsiConsole.Write(table);
        AnsiConsole.MarkupLine($"{ScenarioLibrary.All.Count} scenarios, written as of {ScenarioLibrary.Anchor:yyyy-MM-dd HH:mm} UTC. [grey]natremia scenarios write <folder> --as-of now[/] writes them.");
        return ExitCodes.Ok;
    }
}
