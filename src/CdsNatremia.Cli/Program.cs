using CdsNatremia.Cli.Commands;
using Spectre.Console;
using Spectre.Console.Cli;

namespace CdsNatremia.Cli;

/// <summary>The natremia command: its commands, help and exit codes (see docs/integration-guide.md).</summary>
internal static class Program
{
    public static async Task<int> Main(string[] args)
    {
        var app = new CommandApp();
        app.Configure(config =>
        {
            config.SetApplicationName("natremia");
            config.SetApplicationVersion("0.1.0");
            // Every command refuses an option or argument it does not know (exit 2, with a "did you mean").
            config.UseStrictParsing();
            config.AddBranch("scenarios", scenarios =>
            {
                scenarios.SetDescription("The invented patients: list them, or write their Bundles, draft orders and manifest to a folder.");
                scenarios.AddCommand<ScenariosListCommand>("list").WithDescription("List the scenarios and what a clinician would expect for each.");
                scenarios.AddCommand<ScenariosWriteCommand>("write").WithDescription("Write Bundles, draft orders and manifest.json, optionally rebased in time.")
                    .WithExample("scenarios", "write", "out/scenarios", "--as-of", "now");
            });
            config.AddBranch("population", population =>
            {
                population.SetDescription("Synthetic patients from a seed, for load tests and card-rate surveys.");
                population.AddCommand<PopulationGenerateCommand>("generate").WithDescription("Write N synthetic patients as Bundles (same seed, same bytes).")
                    .WithExample("population", "generate", "out/pop", "--count", "1000", "--seed", "7");
                population.AddCommand<PopulationSurveyCommand>("survey").WithDescription("Run N synthetic patients through the patient-view service and count cards per 1,000.")
                    .WithExample("population", "survey", "--in-process", "--count", "1000");
            });
            config.AddCommand<ReplayCommand>("replay").WithDescription("Send a scenario or a Bundle file to a service and show its cards.")
                .WithExample("replay", "01", "--in-process")
                .WithExample("replay", "--all", "--url", "http://127.0.0.1:5080")
                .WithExample("replay", "patient.json", "--no-prefetch", "--in-process");
            config.AddCommand<ConformCommand>("conform").WithDescription("Check a CDS Hooks service against the standard; exit 1 on any violation.")
                .WithExample("conform", "--url", "http://127.0.0.1:5080");
            config.AddCommand<LoadCommand>("load").WithDescription("Load test: concurrent requests for a bounded time or count; latency percentiles and errors.")
                .WithExample("load", "--url", "http://127.0.0.1:5080", "--duration", "30", "--output", "load.json");
            config.AddCommand<ReportCommand>("report").WithDescription("The override report of a running service: per rule, cards shown, accepted and overridden, and why; optional SVG chart.")
                .WithExample("report", "--url", "http://127.0.0.1:5080", "--from", "2026-11-01", "--to", "2026-11-30", "--chart", "overrides.svg");
            config.AddCommand<ViewCommand>("view").WithDescription("Write the sodium-course page (chart, tables, full report) of a scenario or Bundle file as one HTML file.")
                .WithExample("view", "01", "--out", "course.html");
            config.AddCommand<CheckInputCommand>("check-input").WithDescription("Explain, per resource of a Bundle, whether the service will use it and why not.")
                .WithExample("check-input", "patient.json");
            config.SetExceptionHandler((exception, _) =>
            {
                switch (exception)
                {
                    case ToolException tool:
                        AnsiConsole.MarkupLine("[red]" + Markup.Escape(tool.Message) + "[/]");
                        return tool.ExitCode;
                    case CommandAppException:
                        AnsiConsole.MarkupLine("[red]" + Markup.Escape(exception.Message) + "[/]");
                        if (OptionSuggestions.Hint(exception.Message, args) is { } hint)
                        {
                            AnsiConsole.MarkupLine(Markup.Escape(hint));
                        }

                        return ExitCodes.Usage;
                    case HttpRequestException or TaskCanceledException:
                        AnsiConsole.MarkupLine("[red]Could not reach the service: " + Markup.Escape(exception.Message) + "[/]");
                        return ExitCodes.Unreachable;
                    default:
                        AnsiConsole.WriteException(exception, ExceptionFormats.ShortenEverything);
                        return ExitCodes.Failure;
                }
            });
        });

        return await app.RunAsync(args).ConfigureAwait(false);
    }
}
