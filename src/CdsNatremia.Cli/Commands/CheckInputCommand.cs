using System.ComponentModel;
using CdsNatremia.Cli.InputCheck;
using CdsNatremia.Core.Engine;
using CdsNatremia.Core.Sodium;
using CdsNatremia.Fhir.Knowledge;
using CdsNatremia.Service.Hooks;
using CdsNatremia.Service.Knowledge;
using Spectre.Console;
using Spectre.Console.Cli;

namespace CdsNatremia.Cli.Commands;

/// <summary>natremia check-input: explain, per resource of a Bundle, whether the service will use it and why not.</summary>
internal sealed class CheckInputCommand : Command<CheckInputCommand.Settings>
{
    internal sealed class Settings : CommandSettings
    {
        [CommandArgument(0, "<FILE>")]
        [Description("A FHIR R4 Bundle (JSON) of one patient's data.")]
        public string File { get; set; } = string.Empty;

        [CommandOption("--patient <ID>")]
        [Description("The patient's id (default: the Bundle's only Patient).")]
        public string? Patient { get; set; }

        [CommandOption("--as-of <WHEN>")]
        [Description("Judge staleness and future times as of: 'now' (default), 'anchor' or an ISO 8601 instant.")]
        public string AsOf { get; set; } = "now";

        [CommandOption("--stale-after <HOURS>")]
        [Description("Hours after which a sodium result is stale (the service's Natremia:Rules:Reading:StaleAfterHours). Default 72.")]
        public double StaleAfterHours { get; set; } = 72;

        [CommandOption("--knowledge <FOLDER>")]
        [Description("The knowledge folder (profiles/) the service reads. Default: the nearest profiles/ above this folder, else the copy beside the tool.")]
        public string? Knowledge { get; set; }

        [CommandOption("--json")]
        [Description("Print the verdicts as JSON.")]
        public bool Json { get; set; }
    }

    public override int Execute(CommandContext context, Settings settings, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(settings);
        var asOf = CommandSupport.AsOf(settings.AsOf, TimeProvider.System);
        var json = CommandSupport.ReadFile(settings.File);
        var folder = KnowledgeDirectory.Resolve(settings.Knowledge, Directory.GetCurrentDirectory());
        LoadedKnowledge knowledge;
        try
        {
            knowledge = KnowledgeLoader.Load(folder);
        }
        catch (KnowledgeLoadException ex)
        {
            throw new ToolException(ExitCodes.Usage, $"The knowledge files in {folder} could not be loaded: {ex.Message}");
        }

        var reading = new SodiumReadingOptions { StaleAfterHours = settings.StaleAfterHours };
        var report = new InputChecker(reading, knowledge.Base, PrefetchKeys.Templates).Check(json, settings.Patient, asOf);
        if (report.Unusable is { } unusable)
        {
            // Nothing to tabulate: the file itself is not usable input (exit 2, as for any unusable input file).
            throw new ToolException(ExitCodes.Usage, $"{settings.File}: {unusable}");
        }

        if (settings.Json)
        {
            CommandSupport.WriteJson(new { file = settings.File, asOf, report.PatientId, readable = report.Readable, report.Problems, resources = report.Resources });
            return report.Readable ? ExitCodes.Ok : ExitCodes.Failure;
        }

        var table = new Table().Border(TableBorder.Simple).AddColumns("resource", "verdict", "why", "prefetch keys");
        foreach (var verdict in report.Resources)
        {
            var colour = verdict.Verdict switch { "used" => "green", "used-stale" => "yellow", "ignored" => "grey", _ => "red" };
            var why = verdict.FhirIssues.Count == 0 ? verdict.Reason : verdict.Reason + "; not valid FHIR R4: " + string.Join("; ", verdict.FhirIssues);
            table.AddRow(Markup.Escape(verdict.Reference), $"[{colour}]{verdict.Verdict}[/]", Markup.Escape(why),
                verdict.PrefetchKeys.Count == 0 ? "[grey](none)[/]" : Markup.Escape(string.Join(", ", verdict.PrefetchKeys)));
        }

        AnsiConsole.Write(table);
        foreach (var problem in report.Problems)
        {
            AnsiConsole.MarkupLine("[red]✗ " + Markup.Escape(problem) + "[/]");
        }

        AnsiConsole.MarkupLine($"Patient {Markup.Escape(report.PatientId ?? "(unknown)")}, as of {asOf:yyyy-MM-dd HH:mm} UTC; knowledge from {Markup.Escape(folder)}.");
        return report.Readable ? ExitCodes.Ok : ExitCodes.Failure;
    }
}
