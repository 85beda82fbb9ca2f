using System.ComponentModel;
using CdsNatremia.Cli.Hosting;
using CdsNatremia.Cli.Replay;
using CdsNatremia.Scenarios;
using Spectre.Console;
using Spectre.Console.Cli;

namespace CdsNatremia.Cli.Commands;

/// <summary>natremia replay: send a scenario or a Bundle file to a service and show its cards.</summary>
internal sealed class ReplayCommand : AsyncCommand<ReplayCommand.Settings>
{
    internal sealed class Settings : TargetSettings
    {
        [CommandArgument(0, "[INPUT]")]
        [Description("A scenario id (or its number, e.g. 01), or a FHIR Bundle file. Omit with --all.")]
        public string? Input { get; set; }

        [CommandOption("--all")]
        [Description("Replay every scenario and print the comparison table (cards too with -v). Each scenario (all or one) is compared with every field of the manifest's expectation; a difference exits 1.")]
        public bool All { get; set; }

        [CommandOption("--service <ID>")]
        [Description("The service id to call (default: the service whose hook matches the scenario; patient-view for a file).")]
        public string? Service { get; set; }

        [CommandOption("--no-prefetch")]
        [Description("Send no prefetch; serve the Bundle from a loopback FHIR server named in fhirServer so the service fetches it.")]
        public bool NoPrefetch { get; set; }

        [CommandOption("--no-data")]
        [Description("Send neither prefetch nor fhirServer (the service should answer 412).")]
        public bool NoData { get; set; }

        [CommandOption("--patient <ID>")]
        [Description("For a Bundle file: the patient's id (default: the Bundle's only Patient).")]
        public string? Patient { get; set; }

        [CommandOption("--draft-orders <FILE>")]
        [Description("For a Bundle file and an order hook: a Bundle of draft orders (default: draft orders found in the Bundle).")]
        public string? DraftOrders { get; set; }

        [CommandOption("--select <REF>")]
        [Description("For order-select: a selected draft order such as MedicationRequest/abc (repeatable; default: all).")]
        public string[] Selections { get; set; } = [];

        [CommandOption("--result-id <ID>")]
        [Description("For the result hook: ids of the Observations that just arrived (repeatable; default: the newest).")]
        public string[] ResultIds { get; set; } = [];

        [CommandOption("--as-of <WHEN>")]
        [Description("Move a scenario's dates to end at this time: 'now' (default), 'anchor' or an ISO 8601 instant. With --in-process the service's clock reads this time too. A file's dates are moved only when --file-anchor is given.")]
        public string AsOf { get; set; } = "now";

        [CommandOption("--file-anchor <INSTANT>")]
        [Description("For a Bundle file: the instant its data were written against; its dates move by (as-of − this).")]
        public string? FileAnchor { get; set; }

        [CommandOption("--json")]
        [Description("Print the service's answers as JSON (one object per input).")]
        public bool Json { get; set; }

        [CommandOption("-v|--verbose")]
        [Description("Also print the prefetch sent (each key's search and the resources it carried) or, with --no-prefetch, every FHIR request the service made.")]
        public bool Verbose { get; set; }

        public override ValidationResult Validate()
        {
            if (!All && string.IsNullOrWhiteSpace(Input))
            {
                return ValidationResult.Error("Name a scenario or a Bundle file, or use --all.");
            }

            if (NoPrefetch && NoData)
            {
                return ValidationResult.Error("--no-prefetch and --no-data cannot be combined.");
            }

            return base.Validate();
        }
    }

    public override async Task<int> ExecuteAsync(CommandContext context, Settings settings, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(settings);
        var asOf = CommandSupport.AsOf(settings.AsOf, TimeProvider.System);
        var shift = asOf - ScenarioLibrary.Anchor;
        var inputs = Inputs(settings, asOf, shift);
        var mode = settings.NoPrefetch ? PrefetchMode.FhirServer : settings.NoData ? PrefetchMode.None : PrefetchMode.Evaluate;
        await using var connection = await ServiceConnection.OpenAsync(settings, asOf, cancellationToken).ConfigureAwait(false);
        var services = await Discovery.GetAsync(connection.Client, cancellationToken).ConfigureAwait(false);
        var results = new List<(ReplayResult Result, IReadOnlyList<FieldComparison> Comparison)>();
        foreach (var input in inputs)
        {
            var service = ReplayRunner.Choose(services, input, settings.Service);
            var result = await ReplayRunner.RunAsync(connection.Client, service, input, mode, cancellationToken).ConfigureAwait(false);
            var comparison = input.Scenario is { } scenario && mode == PrefetchMode.Evaluate
                ? ScenarioExpectation.Compare(scenario, result)
                : [];
            results.Add((result, comparison));
            if (!settings.Json && (!settings.All || settings.Verbose))
            {
                CardPrinter.Print(AnsiConsole.Console, result, settings.Verbose);
            }
        }

        var rows = results.SelectMany(r => r.Comparison).ToList();
        var failed = results.Count(r => r.Comparison.Any(c => c.Result == FieldResult.Fail));
        if (settings.Json)
        {
            CommandSupport.WriteJson(results.Select(r => new
            {
                input = r.Result.Input,
                service = r.Result.ServiceId,
                status = r.Result.Status,
                response = r.Result.Body,
                notes = r.Result.Notes,
                prefetch = settings.Verbose ? r.Result.Prefetch : null,
                fhirRequests = settings.Verbose && r.Result.FhirRequests.Count > 0 ? r.Result.FhirRequests : null,
                comparison = r.Comparison.Select(c => new { field = c.Field, expected = c.Expected, seen = c.Seen, result = ComparisonTable.Word(c.Result) }).ToList(),
                mismatches = r.Comparison.Where(c => c.Result == FieldResult.Fail).Select(c => $"{c.Field}: expected {c.Expected}, seen {c.Seen}").ToList(),
            }).ToList());
        }
        else if (rows.Count > 0)
        {
            ComparisonTable.Print(AnsiConsole.Console, rows);
            var fields = rows.Count(r => r.Result != FieldResult.NotApplicable);
            var wrong = rows.Count(r => r.Result == FieldResult.Fail);
            AnsiConsole.MarkupLine(failed == 0
                ? $"[green]All {results.Count} scenario(s) answered as the manifest expects ({fields} fields compared).[/]"
                : $"[red]{failed} of {results.Count} scenario(s) differ from the manifest ({wrong} of {fields} fields).[/]");
        }

        if (failed > 0)
        {
            return ExitCodes.Failure;
        }

        return results.All(r => r.Result.Status == 200 || (mode == PrefetchMode.None && r.Result.Status == 412)) ? ExitCodes.Ok : ExitCodes.ServiceError;
    }

    private static List<ReplayInput> Inputs(Settings settings, DateTimeOffset asOf, TimeSpan shift)
    {
        if (settings.All)
        {
            return ScenarioLibrary.All.Select(s => ReplayInput.FromScenario(s, shift)).ToList();
        }

        var text = settings.Input!;
        if (!File.Exists(text) && ScenarioLibrary.Find(text) is { } scenario)
        {
            return [ReplayInput.FromScenario(scenario, shift)];
        }

        if (!File.Exists(text))
        {
            throw new ToolException(ExitCodes.Usage, $"'{text}' is neither a scenario (natremia scenarios list) nor a file.");
        }

        var fileShift = settings.FileAnchor is null ? TimeSpan.Zero : asOf - CommandSupport.AsOf(settings.FileAnchor, TimeProvider.System);
        var drafts = settings.DraftOrders is null ? null : CommandSupport.ReadFile(settings.DraftOrders);
        return [ReplayInput.FromBundle(Path.GetFileName(text), CommandSupport.ReadFile(text), settings.Patient, drafts, settings.Selections, settings.ResultIds, fileShift)];
    }
}
