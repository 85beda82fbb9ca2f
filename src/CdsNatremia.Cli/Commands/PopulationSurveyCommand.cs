using System.ComponentModel;
using CdsNatremia.Cli.Hosting;
using CdsNatremia.Cli.Population;
using Spectre.Console;
using Spectre.Console.Cli;

namespace CdsNatremia.Cli.Commands;

/// <summary>natremia population survey: run a generated population through a service and count cards per 1,000 patients.</summary>
internal sealed class PopulationSurveyCommand : AsyncCommand<PopulationSurveyCommand.Settings>
{
    internal sealed class Settings : TargetSettings
    {
        [CommandOption("-n|--count <N>")]
        [Description("Number of patients (1-100000). Default 1000.")]
        public int Count { get; set; } = 1000;

        [CommandOption("--seed <SEED>")]
        [Description("Seed of the population. Default 1.")]
        public int Seed { get; set; } = 1;

        [CommandOption("--as-of <WHEN>")]
        [Description("Time the data end at: 'now' (default; with --in-process the service's clock reads it too), 'anchor' or an ISO 8601 instant.")]
        public string AsOf { get; set; } = "now";

        [CommandOption("-o|--output <FILE>")]
        [Description("Also write the survey as JSON to this file.")]
        public string? Output { get; set; }

        [CommandOption("--json")]
        [Description("Print the survey as JSON.")]
        public bool Json { get; set; }
    }

    public override async Task<int> ExecuteAsync(CommandContext context, Settings settings, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(settings);
        if (settings.Count is < 1 or > PopulationGenerator.MaxCount)
        {
            throw new ToolException(ExitCodes.Usage, $"--count must be between 1 and {PopulationGenerator.MaxCount}.");
        }

        var asOf = CommandSupport.AsOf(settings.AsOf, TimeProvider.System);
        await using var connection = await ServiceConnection.OpenAsync(settings, asOf, cancellationToken).ConfigureAwait(false);
        var report = settings.Json
            ? await PopulationSurvey.RunAsync(connection.Client, settings.Seed, settings.Count, asOf, null, cancellationToken).ConfigureAwait(false)
            : await AnsiConsole.Progress().StartAsync(async progress =>
            {
                var task = progress.AddTask("surveying", maxValue: settings.Count);
                return await PopulationSurvey.RunAsync(connection.Client, settings.Seed, settings.Count, asOf, new Progress<int>(n => task.Value = n), cancellationToken).ConfigureAwait(false);
            }).ConfigureAwait(false);

        if (settings.Output is { } output)
        {
            CommandSupport.WriteJsonFile(output, report);
        }

        if (settings.Json)
        {
            CommandSupport.WriteJson(report);
            return report.Failures.Count == 0 ? ExitCodes.Ok : ExitCodes.ServiceError;
        }

        var table = new Table().Border(TableBorder.Simple).AddColumns("per 1,000 patients", "cards");
        table.AddRow("all cards", $"{report.CardsPer1000:0.0}");
        foreach (var (indicator, value) in report.Per1000ByIndicator)
        {
            table.AddRow("indicator " + Markup.Escape(indicator), $"{value:0.0}");
        }

        foreach (var (topic, value) in report.Per1000ByTopic)
        {
            table.AddRow("topic " + Markup.Escape(topic), $"{value:0.0}");
        }

        AnsiConsole.Write(table);
        AnsiConsole.MarkupLine($"{report.Patients} patients (seed {report.Seed}), {report.PatientsWithCards} with a card; bands: "
            + Markup.Escape(string.Join(", ", report.PatientsByBand.Select(kv => $"{kv.Key} {kv.Value}")))
            + (report.Failures.Count == 0 ? string.Empty : "; failures: " + Markup.Escape(string.Join(", ", report.Failures.Select(kv => $"{kv.Key} {kv.Value}")))));
        return report.Failures.Count == 0 ? ExitCodes.Ok : ExitCodes.ServiceError;
    }
}
