using System.ComponentModel;
using System.Globalization;
using CdsNatremia.Cli.Conformance;
using CdsNatremia.Cli.Hosting;
using CdsNatremia.Cli.Replay;
using CdsNatremia.Scenarios;
using Spectre.Console;
using Spectre.Console.Cli;

namespace CdsNatremia.Cli.Commands;

/// <summary>natremia conform: check a CDS Hooks service against the standard with the scenario library.</summary>
internal sealed class ConformCommand : AsyncCommand<ConformCommand.Settings>
{
    internal sealed class Settings : TargetSettings
    {
        [CommandOption("--as-of <WHEN>")]
        [Description("Move the scenarios' dates to end at this time: 'now' (default), 'anchor' or an ISO 8601 instant.")]
        public string AsOf { get; set; } = "now";

        [CommandOption("--json")]
        [Description("Print the report as JSON.")]
        public bool Json { get; set; }
    }

    public override async Task<int> ExecuteAsync(CommandContext context, Settings settings, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(settings);
        var asOf = CommandSupport.AsOf(settings.AsOf, TimeProvider.System);
        var inputs = ScenarioLibrary.All.Select(s => ReplayInput.FromScenario(s, asOf - ScenarioLibrary.Anchor)).ToList();
        await using var connection = await ServiceConnection.OpenAsync(settings, asOf, cancellationToken).ConfigureAwait(false);
        ConformanceReport report;
        if (settings.Json)
        {
            report = await ConformanceChecker.RunAsync(connection.Client, inputs, null, cancellationToken).ConfigureAwait(false);
            CommandSupport.WriteJson(new { target = connection.Client.BaseAddress?.ToString(), passed = report.Passed, report.ServicesChecked, report.RequestsSent, report.Rules, report.Violations, report.Notes });
            return report.Passed ? ExitCodes.Ok : ExitCodes.Failure;
        }

        report = await AnsiConsole.Status().StartAsync("Checking discovery", async status =>
        {
            var progress = new Progress<string>(step => status.Status("Checking " + Markup.Escape(step)));
            return await ConformanceChecker.RunAsync(connection.Client, inputs, progress, cancellationToken).ConfigureAwait(false);
        }).ConfigureAwait(false);

        var table = new Table().Border(TableBorder.Simple).AddColumns("rule", "checked", "violations", "result");
        table.Columns[0].NoWrap();
        foreach (var rule in report.Rules)
        {
            var result = rule.Result switch { "pass" => "[green]pass[/]", "fail" => "[red]FAIL[/]", _ => "[grey]not exercised[/]" };
            table.AddRow(new Text(rule.Rule), new Text(rule.Checks.ToString(CultureInfo.InvariantCulture)), new Text(rule.Violations.ToString(CultureInfo.InvariantCulture)), new Markup(result));
        }

        AnsiConsole.Write(table);
        foreach (var violation in report.Violations)
        {
            AnsiConsole.MarkupLine($"[red]✗ {Markup.Escape(violation.Rule)}[/] at {Markup.Escape(violation.Where)}: found {Markup.Escape(violation.Found)}");
            AnsiConsole.MarkupLine($"  [grey]rule: {Markup.Escape(violation.Requirement)}[/]");
        }

        foreach (var note in report.Notes)
        {
            AnsiConsole.MarkupLine($"[grey]note: {Markup.Escape(note)}[/]");
        }

        AnsiConsole.MarkupLine(report.Passed
            ? $"[green]Conforms: {report.Rules.Count(r => r.Result == "pass")} of {report.Rules.Count} rules checked and kept ({report.Rules.Count(r => r.Result == "not exercised")} not exercised), {report.ServicesChecked} services, {report.RequestsSent} requests, no violation.[/]"
            : $"[red]{report.Violations.Count} violation(s) in {report.RequestsSent} requests to {report.ServicesChecked} services.[/]");
        return report.Passed ? ExitCodes.Ok : ExitCodes.Failure;
    }
}
