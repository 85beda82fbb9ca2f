using System.ComponentModel;
using System.Globalization;
using CdsNatremia.Cli.Hosting;
using CdsNatremia.Cli.Load;
using CdsNatremia.Cli.Replay;
using CdsNatremia.Scenarios;
using Spectre.Console;
using Spectre.Console.Cli;

namespace CdsNatremia.Cli.Commands;

/// <summary>natremia load: concurrent requests for a bounded time or count; throughput, latency percentiles, errors by kind.</summary>
internal sealed class LoadCommand : AsyncCommand<LoadCommand.Settings>
{
    internal sealed class Settings : TargetSettings
    {
        [CommandOption("--duration <SECONDS>")]
        [Description("Stop after this many seconds (1-600). Default 30.")]
        public int DurationSeconds { get; set; } = 30;

        [CommandOption("--requests <N>")]
        [Description("Stop after this many requests (1-1000000), if that comes first.")]
        public int? Requests { get; set; }

        [CommandOption("--concurrency <N>")]
        [Description("Requests in flight at once (1-256). Default 8.")]
        public int Concurrency { get; set; } = 8;

        [CommandOption("--population <N>")]
        [Description("Send N generated patients (to the patient-view service) instead of the scenario set.")]
        public int? Population { get; set; }

        [CommandOption("--seed <SEED>")]
        [Description("Seed of the generated population. Default 1.")]
        public int Seed { get; set; } = 1;

        [CommandOption("--as-of <WHEN>")]
        [Description("Move the data to end at this time: 'now' (default), 'anchor' or an ISO 8601 instant.")]
        public string AsOf { get; set; } = "now";

        [CommandOption("-o|--output <FILE>")]
        [Description("Also write the report as JSON to this file.")]
        public string? Output { get; set; }

        [CommandOption("--json")]
        [Description("Print the report as JSON (no live display).")]
        public bool Json { get; set; }
    }

    public override async Task<int> ExecuteAsync(CommandContext context, Settings settings, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(settings);
        var plan = new LoadPlan { Concurrency = settings.Concurrency, Duration = TimeSpan.FromSeconds(settings.DurationSeconds), Requests = settings.Requests };
        if (settings.DurationSeconds is < 1 or > LoadPlan.MaxDurationSeconds)
        {
            throw new ToolException(ExitCodes.Usage, $"--duration must be between 1 and {LoadPlan.MaxDurationSeconds} seconds.");
        }

        plan.Validate();
        var asOf = CommandSupport.AsOf(settings.AsOf, TimeProvider.System);
        await using var connection = await ServiceConnection.OpenAsync(settings, asOf, cancellationToken).ConfigureAwait(false);
        var services = await Discovery.GetAsync(connection.Client, cancellationToken).ConfigureAwait(false);
        var requests = settings.Population is { } count
            ? LoadRequests.FromPopulation(services, settings.Seed, count, asOf)
            : LoadRequests.FromInputs(services, ScenarioLibrary.All.Select(s => ReplayInput.FromScenario(s, asOf - ScenarioLibrary.Anchor)));

        LoadReport report;
        if (settings.Json)
        {
            report = await LoadRunner.RunAsync(connection.Client, requests, plan, null, cancellationToken).ConfigureAwait(false);
        }
        else
        {
            report = await AnsiConsole.Progress()
                .Columns(new TaskDescriptionColumn(), new ProgressBarColumn(), new ElapsedTimeColumn())
                .StartAsync(async progress =>
                {
                    var task = progress.AddTask("starting", maxValue: plan.Requests ?? plan.Duration.TotalSeconds);
                    var live = new Progress<LoadProgress>(p =>
                    {
                        task.Description = string.Create(CultureInfo.InvariantCulture, $"{p.Completed} requests, {p.Errors} errors, {(p.Elapsed.TotalSeconds > 0 ? p.Completed / p.Elapsed.TotalSeconds : 0):0} req/s");
                        task.Value = plan.Requests is not null ? p.Completed : Math.Min(p.Elapsed.TotalSeconds, plan.Duration.TotalSeconds);
                    });
                    var result = await LoadRunner.RunAsync(connection.Client, requests, plan, live, cancellationToken).ConfigureAwait(false);
                    task.Value = task.MaxValue;
                    return result;
                }).ConfigureAwait(false);
        }

        if (settings.Output is { } output)
        {
            CommandSupport.WriteJsonFile(output, report);
        }

        if (settings.Json)
        {
            CommandSupport.WriteJson(report);
        }
        else
        {
            Print(report);
        }

        return report.Errors == 0 ? ExitCodes.Ok : ExitCodes.Failure;
    }

    private static void Print(LoadReport report)
    {
        var l = report.Latency;
        var table = new Table().Border(TableBorder.Simple).AddColumns("measure", "value");
        table.AddRow("target", Markup.Escape(report.Target));
        table.AddRow("requests", $"{report.Requests} in {report.ElapsedSeconds:0.0} s, concurrency {report.Concurrency}");
        table.AddRow("throughput", $"{report.ThroughputPerSecond:0.0} requests/s");
        table.AddRow("latency (ms)", $"p50 {l.P50:0.0}  p90 {l.P90:0.0}  p99 {l.P99:0.0}  max {l.Max:0.0}");
        table.AddRow("errors", report.Errors == 0 ? "none" : Markup.Escape(string.Join(", ", report.ErrorsByKind.Select(kv => $"{kv.Key}: {kv.Value}"))));
        table.AddRow("cards", Markup.Escape(string.Join(", ", report.CardsByIndicator.Select(kv => $"{kv.Key}: {kv.Value}"))));
        AnsiConsole.Write(table);
    }
}
