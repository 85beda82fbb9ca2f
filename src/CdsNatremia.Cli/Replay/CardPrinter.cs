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

            // The summary opens the box's body, where it wraps; a header is one line and would be cut at the console width.
            var content = new Rows(
                new Markup($"[bold]{Markup.Escape((string?)card["summary"] ?? string.Empty)}[/]"),
                new Text(string.Empty),
                new Text(string.Join('\n', body)));
            var panel = new Panel(content)
            {
                Header = new PanelHeader($"[{colour}]{Markup.Escape(indicator.ToUpperInvariant())}[/]"),
                Border = BoxBorder.Rounded,
                Expand = true,
            };
            console.Write(panel);
        }

        if (verbose)
        {
            PrintPrefetch(console, result);
        }

        foreach (var note in result.Notes)
        {
            console.MarkupLine("[grey]" + Markup.Escape(note) + "[/]");
        }
    }

    /// <summary>The prefetch sent, key by key (its search and the resources it carried), or the FHIR requests the service made.</summary>
    public static void PrintPrefetch(IAnsiConsole console, ReplayResult result)
    {
        ArgumentNullException.ThrowIfNull(console);
        ArgumentNullException.ThrowIfNull(result);
        if (result.Prefetch is { } prefetch)
        {
            var table = new Table().Border(TableBorder.Simple).Title("prefetch sent").AddColumns("key", "search (template, context filled in)", "resources");
            foreach (var (key, value) in prefetch)
            {
                var query = result.PrefetchQueries.TryGetValue(key, out var q) ? q : "(not a search)";
                table.AddRow(new Text(key), new Text(query), new Text(Describe(value)));
            }

            console.Write(table);
        }
        else if (result.FhirRequests.Count == 0)
        {
            console.MarkupLine("[grey]No prefetch was sent.[/]");
        }

        if (result.FhirRequests.Count > 0)
        {
            console.MarkupLine($"[bold]FHIR requests the service made[/] ({result.FhirRequests.Count}):");
            foreach (var request in result.FhirRequests)
            {
                console.WriteLine("  " + request);
            }
        }
    }

    /// <summary>A prefetch value in one line: null, a resource's reference, or a Bundle's entries by reference.</summary>
    public static string Describe(JsonNode? value)
    {
        static string Reference(JsonNode? resource) => $"{(string?)resource?["resourceType"]}/{(string?)resource?["id"]}";
        if (value is not JsonObject resource)
        {
            return "null (nothing selected)";
        }

        if ((string?)resource["resourceType"] != "Bundle")
        {
            return Reference(resource);
        }

        var entries = (resource["entry"] as JsonArray ?? []).OfType<JsonObject>().Select(e => Reference(e["resource"])).ToList();
        return entries.Count == 0 ? "Bundle, no entries" : $"Bundle, {entries.Count}: " + string.Join(", ", entries);
    }
}
