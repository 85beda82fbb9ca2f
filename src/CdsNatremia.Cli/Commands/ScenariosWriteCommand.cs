using System.ComponentModel;
using System.Text.Json.Nodes;
using CdsNatremia.Scenarios;
using Spectre.Console;
using Spectre.Console.Cli;

namespace CdsNatremia.Cli.Commands;

/// <summary>natremia scenarios write: each scenario's Bundle (and draft orders) plus manifest.json, optionally rebased in time.</summary>
internal sealed class ScenariosWriteCommand : Command<ScenariosWriteCommand.Settings>
{
    internal sealed class Settings : CommandSettings
    {
        [CommandArgument(0, "<FOLDER>")]
        [Description("Folder to write into (created if missing; files of the same name are replaced).")]
        public string Folder { get; set; } = string.Empty;

        [CommandOption("--as-of <WHEN>")]
        [Description("Move every date so the stories happen before this time: 'now' (default, as replay does, so the files read as recent to a running service), 'anchor' (2026-03-10T12:00:00Z as written), or an ISO 8601 instant.")]
        public string AsOf { get; set; } = "now";

        [CommandOption("--only <ID>")]
        [Description("Write only these scenarios (id or number prefix, repeatable).")]
        public string[] Only { get; set; } = [];

        [CommandOption("--json")]
        [Description("Print the manifest as JSON instead of a summary.")]
        public bool Json { get; set; }
    }

    public override int Execute(CommandContext context, Settings settings, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(settings);
        var asOf = CommandSupport.AsOf(settings.AsOf, TimeProvider.System);
        var shift = asOf - ScenarioLibrary.Anchor;
        var scenarios = settings.Only.Length == 0
            ? ScenarioLibrary.All
            : settings.Only.Select(id => ScenarioLibrary.Find(id) ?? throw new ToolException(ExitCodes.Usage, $"No scenario '{id}' (natremia scenarios list shows them).")).ToList();
        Directory.CreateDirectory(settings.Folder);
        foreach (var scenario in scenarios)
        {
            File.WriteAllText(Path.Combine(settings.Folder, scenario.Id + ".bundle.json"), Pretty(DateShifter.Shift(scenario.BundleJson, shift)));
            if (scenario.DraftOrdersJson is { } drafts)
            {
                File.WriteAllText(Path.Combine(settings.Folder, scenario.Id + ".draft-orders.json"), Pretty(DateShifter.Shift(drafts, shift)));
            }
        }

        var manifest = ScenarioManifest.Describe(scenarios, shift, asOf);
        CommandSupport.WriteJsonFile(Path.Combine(settings.Folder, "manifest.json"), manifest);
        if (settings.Json)
        {
            CommandSupport.WriteJson(manifest);
        }
        else
        {
            AnsiConsole.MarkupLine($"Wrote {scenarios.Count} scenarios and manifest.json to [bold]{Markup.Escape(Path.GetFullPath(settings.Folder))}[/] (as of {asOf:yyyy-MM-dd HH:mm:ss} UTC).");
        }

        return ExitCodes.Ok;
    }

    private static string Pretty(string json) => JsonNode.Parse(json)!.ToJsonString(CommandSupport.Json) + "\n";
}
