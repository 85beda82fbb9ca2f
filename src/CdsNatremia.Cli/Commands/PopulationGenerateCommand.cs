using System.ComponentModel;
using CdsNatremia.Cli.Population;
using Spectre.Console;
using Spectre.Console.Cli;

namespace CdsNatremia.Cli.Commands;

/// <summary>natremia population generate: N synthetic patients from a seed, one Bundle file each, plus population.json.</summary>
internal sealed class PopulationGenerateCommand : Command<PopulationGenerateCommand.Settings>
{
    internal sealed class Settings : CommandSettings
    {
        [CommandArgument(0, "<FOLDER>")]
        [Description("Folder to write the Bundles and population.json into.")]
        public string Folder { get; set; } = string.Empty;

        [CommandOption("-n|--count <N>")]
        [Description("Number of patients (0-100000). Default 1000.")]
        public int Count { get; set; } = 1000;

        [CommandOption("--seed <SEED>")]
        [Description("Seed: the same seed, count and --as-of give byte-identical files. Default 1.")]
        public int Seed { get; set; } = 1;

        [CommandOption("--as-of <WHEN>")]
        [Description("Time the data end at: 'anchor' (default, 2026-03-10T12:00:00Z), 'now' or an ISO 8601 instant.")]
        public string AsOf { get; set; } = "anchor";

        [CommandOption("--json")]
        [Description("Print the population summary as JSON.")]
        public bool Json { get; set; }
    }

    public override int Execute(CommandContext context, Settings settings, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(settings);
        var asOf = CommandSupport.AsOf(settings.AsOf, TimeProvider.System);
        var summary = settings.Json
            ? PopulationWriter.Write(settings.Folder, settings.Seed, settings.Count, asOf, null)
            : AnsiConsole.Progress().Start(progress =>
            {
                var task = progress.AddTask("generating", maxValue: Math.Max(1, settings.Count));
                return PopulationWriter.Write(settings.Folder, settings.Seed, settings.Count, asOf, new Progress<int>(n => task.Value = n));
            });
        if (settings.Json)
        {
            CommandSupport.WriteJson(summary);
        }
        else
        {
            AnsiConsole.MarkupLine($"Wrote {settings.Count} patients (seed {settings.Seed}) to [bold]{Markup.Escape(Path.GetFullPath(settings.Folder))}[/]: "
                + Markup.Escape(string.Join(", ", summary.ByBand.Select(kv => $"{kv.Key} {kv.Value}"))));
        }

        return ExitCodes.Ok;
    }
}
