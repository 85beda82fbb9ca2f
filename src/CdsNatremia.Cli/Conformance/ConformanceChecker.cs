using System.Text.Json.Nodes;
using CdsNatremia.Cli.Replay;

namespace CdsNatremia.Cli.Conformance;

/// <summary>
/// Checks any CDS Hooks service against the standard: its discovery document, its answers to the scenario library
/// (prefetch filled from its own templates), and 412 when prefetch is removed and no fhirServer is given (a result hook
/// may instead answer 200 from the results in its context).
/// Reports violations; never stops at the first.
/// </summary>
internal static class ConformanceChecker
{
    private static readonly string[] Indicators = ["info", "warning", "critical"];
    private static readonly string[] SelectionBehaviors = ["at-most-one", "any"];

    /// <summary>Runs every check against the service behind <paramref name="client"/>.</summary>
    public static async Task<ConformanceReport> RunAsync(HttpClient client, IReadOnlyList<ReplayInput> inputs, IProgress<string>? progress, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(client);
        ArgumentNullException.ThrowIfNull(inputs);
        var violations = new List<Violation>();
        var tally = new RuleTally();
        var notes = new List<string>();
        progress?.Report("discovery");
        using var response = await client.GetAsync(new Uri("cds-services", UriKind.Relative), cancellationToken).ConfigureAwait(false);
        var text = await response.Content.ReadAsStringAsync(cancellationToken).ConfigureAwait(false);
        var services = CheckDiscovery((int)response.StatusCode, text, violations, tally);
        var uuids = new HashSet<string>(StringComparer.Ordinal);
        var sent = 0;
        foreach (var input in inputs)
        {
            DiscoveredService service;
            try
            {
                service = ReplayRunner.Choose(services, input, null);
            }
            catch (ToolException ex)
            {
                notes.Add($"{input.Name}: not sent ({ex.Message})");
                continue;
            }

            progress?.Report($"{service.Id} / {input.Name}");
            var composed = HookRequestComposer.Compose(service, input, PrefetchMode.Evaluate, Guid.NewGuid());
            var (status, body) = await ReplayRunner.PostAsync(client, service.Id, composed.Body, cancellationToken).ConfigureAwait(false);
            sent++;
            CheckResponse($"{service.Id} / {input.Name}", status, body, uuids, violations, tally);
        }

        foreach (var service in services)
        {
            if (service.Prefetch.Count == 0)
            {
                notes.Add($"{service.Id}: declares no prefetch; 412 behaviour not probed");
                continue;
            }

            var input = inputs.FirstOrDefault(i => ReferenceEquals(Safe(services, i), service)) ?? inputs.FirstOrDefault();
            if (input is null)
            {
                continue;
            }

            progress?.Report($"{service.Id} / 412 probe");
            var composed = HookRequestComposer.Compose(service, input, PrefetchMode.None, Guid.NewGuid());
            var (status, _) = await ReplayRunner.PostAsync(client, service.Id, composed.Body, cancellationToken).ConfigureAwait(false);
            sent++;
            tally.Checked("prefetch.412");
            if (status == 200 && composed.Body["context"]?["results"] is not null)
            {
                // A result hook may answer from the results that arrived in its context (they hold what it needs).
                notes.Add($"{service.Id}: answered without prefetch from the results in its context (allowed)");
            }
            else if (status != 412)
            {
                violations.Add(ConformanceRules.Of("prefetch.412", $"{service.Id} / {input.Name} without prefetch or fhirServer", $"HTTP {status}"));
            }
        }

        return new ConformanceReport(violations, services.Count, sent, notes) { Checks = tally.Checks };
    }

    /// <summary>Checks a discovery document; returns the services it lists (those with an id and a hook).</summary>
    public static IReadOnlyList<DiscoveredService> CheckDiscovery(int status, string text, List<Violation> violations, RuleTally? tally = null)
    {
        ArgumentNullException.ThrowIfNull(violations);
        tally ??= new RuleTally();
        JsonNode? root = null;
        try
        {
            root = JsonNode.Parse(text);
        }
        catch (System.Text.Json.JsonException)
        {
            // Reported below.
        }

        tally.Checked("discovery.status");
        if (status != 200 || root is not JsonObject)
        {
            violations.Add(ConformanceRules.Of("discovery.status", "discovery", $"HTTP {status}{(root is JsonObject ? string.Empty : ", body not a JSON object")}"));
            return [];
        }

        tally.Checked("discovery.services");
        if (root["services"] is not JsonArray services)
        {
            violations.Add(ConformanceRules.Of("discovery.services", "discovery", "no 'services' array"));
            return [];
        }

        var ids = new HashSet<string>(StringComparer.Ordinal);
        for (var i = 0; i < services.Count; i++)
        {
            var where = $"discovery services[{i}]";
            tally.Checked("discovery.service.required");
            if (services[i] is not JsonObject service)
            {
                violations.Add(ConformanceRules.Of("discovery.service.required", where, "not a JSON object"));
                continue;
            }

            foreach (var field in new[] { "hook", "description", "id" })
            {
                if (!IsNonEmptyString(service[field]))
                {
                    violations.Add(ConformanceRules.Of("discovery.service.required", $"{where}.{field}", Describe(service[field])));
                }
            }

            if ((string?)(service["id"] as JsonValue) is { } id && Count(tally, "discovery.service.id-unique") && !ids.Add(id))
            {
                violations.Add(ConformanceRules.Of("discovery.service.id-unique", $"{where}.id", $"'{id}' appears more than once"));
            }

            if (service["prefetch"] is { } prefetch && Count(tally, "discovery.prefetch.strings") && (prefetch is not JsonObject templates || templates.Any(t => !IsNonEmptyString(t.Value))))
            {
                violations.Add(ConformanceRules.Of("discovery.prefetch.strings", $"{where}.prefetch", "not an object of template strings"));
            }
        }

        return Discovery.Read(text);
    }

    /// <summary>Checks one hook response; card and suggestion uuids are collected across responses.</summary>
    public static void CheckResponse(string where, int status, JsonNode? body, HashSet<string> uuids, List<Violation> violations, RuleTally? tally = null)
    {
        ArgumentNullException.ThrowIfNull(uuids);
        ArgumentNullException.ThrowIfNull(violations);
        tally ??= new RuleTally();
        tally.Checked("response.status");
        if (status != 200 || body is not JsonObject root)
        {
            violations.Add(ConformanceRules.Of("response.status", where, $"HTTP {status}{(body is JsonObject ? string.Empty : ", body not a JSON object")}"));
            return;
        }

        tally.Checked("response.cards");
        if (root["cards"] is not JsonArray cards)
        {
            violations.Add(ConformanceRules.Of("response.cards", where, "no 'cards' array"));
            return;
        }

        for (var i = 0; i < cards.Count; i++)
        {
            if (cards[i] is JsonObject card)
            {
                tally.Checked("response.empty-values");
                EmptyValues(card, $"{where} / cards[{i}]", violations);
                CheckCard(card, $"{where} / cards[{i}]", uuids, violations, tally);
            }
            else
            {
                violations.Add(ConformanceRules.Of("response.cards", $"{where} / cards[{i}]", "not a JSON object"));
            }
        }

        if (root["systemActions"] is JsonArray systemActions)
        {
            for (var i = 0; i < systemActions.Count; i++)
            {
                CheckAction(systemActions[i] as JsonObject, $"{where} / systemActions[{i}]", violations, tally);
            }
        }
    }

    private static void CheckCard(JsonObject card, string where, HashSet<string> uuids, List<Violation> violations, RuleTally tally)
    {
        tally.Checked("card.summary.required");
        if (card["summary"] is not JsonValue s || !s.TryGetValue<string>(out var summary))
        {
            violations.Add(ConformanceRules.Of("card.summary.required", where + ".summary", Describe(card["summary"])));
        }
        else if (Count(tally, "card.summary.length") && summary.Length >= 140)
        {
            violations.Add(ConformanceRules.Of("card.summary.length", where + ".summary", $"{summary.Length} characters"));
        }

        tally.Checked("card.indicator.value");
        tally.Checked("card.source.label");
        tally.Checked("card.selectionBehavior");
        if ((string?)(card["indicator"] as JsonValue) is not { } indicator || !Indicators.Contains(indicator))
        {
            violations.Add(ConformanceRules.Of("card.indicator.value", where + ".indicator", Describe(card["indicator"])));
        }

        if (card["source"] is not JsonObject source || !IsNonEmptyString(source["label"]))
        {
            violations.Add(ConformanceRules.Of("card.source.label", where + ".source", Describe(card["source"])));
        }
        else if (source["topic"] is { } topic)
        {
            CheckCoding(topic, where + ".source.topic", violations, tally);
        }

        Unique(card["uuid"], where + ".uuid", uuids, violations, tally);
        var suggestions = card["suggestions"] as JsonArray;
        var hasSuggestions = suggestions is { Count: > 0 };
        var behavior = (string?)(card["selectionBehavior"] as JsonValue);
        if (hasSuggestions ? behavior is null || !SelectionBehaviors.Contains(behavior) : card["selectionBehavior"] is not null)
        {
            violations.Add(ConformanceRules.Of("card.selectionBehavior", where + ".selectionBehavior",
                hasSuggestions ? Describe(card["selectionBehavior"]) + " with suggestions" : $"'{behavior}' without suggestions"));
        }

        for (var i = 0; suggestions is not null && i < suggestions.Count; i++)
        {
            var suggestionWhere = $"{where}.suggestions[{i}]";
            tally.Checked("suggestion.label");
            if (suggestions[i] is not JsonObject suggestion || !IsNonEmptyString(suggestion["label"]))
            {
                violations.Add(ConformanceRules.Of("suggestion.label", suggestionWhere, Describe((suggestions[i] as JsonObject)?["label"])));
                continue;
            }

            Unique(suggestion["uuid"], suggestionWhere + ".uuid", uuids, violations, tally);
            if (suggestion["actions"] is JsonArray actions)
            {
                for (var a = 0; a < actions.Count; a++)
                {
                    CheckAction(actions[a] as JsonObject, $"{suggestionWhere}.actions[{a}]", violations, tally);
                }
            }
        }

        if (card["overrideReasons"] is JsonArray reasons)
        {
            for (var i = 0; i < reasons.Count; i++)
            {
                CheckCoding(reasons[i], $"{where}.overrideReasons[{i}]", violations, tally);
                tally.Checked("overrideReason.display");
                if (!IsNonEmptyString(reasons[i]?["display"]))
                {
                    violations.Add(ConformanceRules.Of("overrideReason.display", $"{where}.overrideReasons[{i}].display", Describe(reasons[i]?["display"])));
                }
            }
        }

        if (card["links"] is JsonArray links)
        {
            for (var i = 0; i < links.Count; i++)
            {
                var link = links[i] as JsonObject;
                tally.Checked("link.fields");
                var type = (string?)(link?["type"] as JsonValue);
                if (link is null || !IsNonEmptyString(link["label"]) || !Uri.TryCreate((string?)(link["url"] as JsonValue), UriKind.Absolute, out _) || type is not ("absolute" or "smart"))
                {
                    violations.Add(ConformanceRules.Of("link.fields", $"{where}.links[{i}]", link?.ToJsonString() ?? "not an object"));
                }
            }
        }
    }

    private static void CheckAction(JsonObject? action, string where, List<Violation> violations, RuleTally tally)
    {
        tally.Checked("action.type");
        tally.Checked("action.description");
        var type = (string?)(action?["type"] as JsonValue);
        if (type is not ("create" or "update" or "delete"))
        {
            violations.Add(ConformanceRules.Of("action.type", where + ".type", Describe(action?["type"])));
        }

        if (!IsNonEmptyString(action?["description"]))
        {
            violations.Add(ConformanceRules.Of("action.description", where + ".description", Describe(action?["description"])));
        }

        if (type is "create" or "update" && Count(tally, "action.resource") && (action?["resource"] is not JsonObject resource || !IsNonEmptyString(resource["resourceType"])))
        {
            violations.Add(ConformanceRules.Of("action.resource", where + ".resource", Describe(action?["resource"])));
        }

        if (type == "delete" && Count(tally, "action.resourceId") && ((string?)(action?["resourceId"] as JsonValue) is not { } id || !IsRelativeReference(id)))
        {
            violations.Add(ConformanceRules.Of("action.resourceId", where + ".resourceId", Describe(action?["resourceId"])));
        }
    }

    private static void CheckCoding(JsonNode? coding, string where, List<Violation> violations, RuleTally tally)
    {
        tally.Checked("coding.system-code");
        if (coding is not JsonObject obj || !IsNonEmptyString(obj["system"]) || !IsNonEmptyString(obj["code"]))
        {
            violations.Add(ConformanceRules.Of("coding.system-code", where, coding?.ToJsonString() ?? "missing"));
        }
    }

    private static void Unique(JsonNode? uuid, string where, HashSet<string> uuids, List<Violation> violations, RuleTally tally)
    {
        if ((string?)(uuid as JsonValue) is { } text && Count(tally, "card.uuid.unique") && !uuids.Add(text))
        {
            violations.Add(ConformanceRules.Of("card.uuid.unique", where, $"'{text}' was already used"));
        }
    }

    private static void EmptyValues(JsonNode? node, string where, List<Violation> violations)
    {
        switch (node)
        {
            case JsonObject obj:
                foreach (var (key, value) in obj)
                {
                    var path = where + "." + key;
                    if (value is null || (value is JsonValue v && v.TryGetValue<string>(out var s) && s.Length == 0)
                        || value is JsonArray { Count: 0 } || value is JsonObject { Count: 0 })
                    {
                        violations.Add(ConformanceRules.Of("response.empty-values", path, value?.ToJsonString() ?? "null"));
                    }
                    else
                    {
                        EmptyValues(value, path, violations);
                    }
                }

                break;
            case JsonArray array:
                for (var i = 0; i < array.Count; i++)
                {
                    EmptyValues(array[i], $"{where}[{i}]", violations);
                }

                break;
        }
    }

    private static bool IsRelativeReference(string text)
    {
        var slash = text.IndexOf('/', StringComparison.Ordinal);
        return slash > 0 && slash < text.Length - 1 && char.IsAsciiLetterUpper(text[0]) && !text.Contains("://", StringComparison.Ordinal);
    }

    private static DiscoveredService? Safe(IReadOnlyList<DiscoveredService> services, ReplayInput input)
    {
        try
        {
            return ReplayRunner.Choose(services, input, null);
        }
        catch (ToolException)
        {
            return null;
        }
    }

    // Notes a check inside a condition, once the rule applies; always true.
    private static bool Count(RuleTally tally, string rule)
    {
        tally.Checked(rule);
        return true;
    }

    private static bool IsNonEmptyString(JsonNode? node) => node is JsonValue v && v.TryGetValue<string>(out var s) && s.Length > 0;

    private static string Describe(JsonNode? node) => node is null ? "missing" : node.ToJsonString();
}
