using System.Text.Json.Nodes;
using Spectre.Console;

namespace CdsNatremia.Cli.Replay;

/// <summary>Prints cards for a person: indicator, summary, detail (Markdown as sent), suggestions with their actions.</summary>
internal static class CardPrinter
{
    public static void Print(IAnsiConsole console, ReplayResult result, bool verbose)
    {
        ArgumentNullException.ThrowIfNull(console);
        ArgumentNullException.ThrowIfNull(result);
        console.MarkupLine($"[bold]{Markup.Escape(result.Input)}[/] → {Markup.Escape(result.ServiceId)}: HTTP {result.Status}, {result.Cards.Count} card(s)");
        if (result.Status != 200)
        {
            console.WriteLine(result.Body?.ToJsonString() ?? "(no JSON body)");
        }

        foreach (var card in result.Cards.OfType<JsonObject>())
        {
            var indicator = (string?)card["indicator"] ?? "?";
            var colour = indicator switch { "critical" => "red", "warning" => "yellow", _ => "blue" };
            var body = new List<string> { (string?)card["detail"] ?? string.Empty };
            if (card["suggestions"] is JsonArray suggestions)
            {
                body.Add(string.Empty);
                body.Add($"Suggestions ({(string?)card["selectionBehavior"]}):");
                foreach (var suggestion in suggestions.OfType<JsonObject>())
                {
                    var recommended = (bool?)suggestion["isRecommended"] == true ? " (recommended)" : string.Empty;
                    body.Add($"  • {(string?)suggestion["label"]}{recommended}");
                    foreach (var action in (suggestion["actions"] as JsonArray ?? []).OfType<JsonObject>())
                    {
                        var target = (string?)action["resourceId"] ?? (string?)action["resource"]?["resourceType"] ?? string.Empty;
                        body.Add($"      {(string?)action["type"]} {target}: {(string?)action["description"]}");
                    }
                }
            }

            var panel = new Panel(new Text(string.Join('\n', body)))
            {
                Header = new PanelHeader($"[{colour}]{Markup.Escape(indicator.ToUpperInvariant())}[/] {Markup.Escape((string?)card["summary"] ?? string.Empty)}"),
                Border = BoxBorder.Rounded,
                Expand = true,
            };
            console.Write(panel);
        }

        if (verbose)
        {
            foreach (var note in result.Notes)
            {
                console.MarkupLine("[grey]" + Markup.Escape(note) + "[/]");
            }
        }
    }
}
