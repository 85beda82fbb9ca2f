using System.Text.Json.Nodes;
using CdsNatremia.Core.Cards;
using CdsNatremia.Fhir.Writing;
using CdsNatremia.Service.Configuration;
using Microsoft.Extensions.Options;

namespace CdsNatremia.Service.Hooks;

/// <summary>
/// Turns cards into the CDS Hooks 2.0 response. Optional fields with no value are left out (the standard forbids
/// null, "", [] and {} where not allowed); selectionBehavior is sent whenever suggestions are.
/// </summary>
public sealed class CardResponseWriter
{
    /// <summary>Our card-topic CodeSystem (profiles/codesystems/card-topic.json).</summary>
    public const string TopicSystem = "https://cdsnatremia.example.org/fhir/CodeSystem/card-topic";

    private readonly NatremiaServiceOptions _options;
    private readonly string? _courseLaunchUrl;

    /// <summary>Creates the writer.</summary>
    public CardResponseWriter(IOptions<NatremiaServiceOptions> options, IOptions<Course.CourseOptions> course)
    {
        _options = options.Value;
        _courseLaunchUrl = course.Value.Enabled && !string.IsNullOrEmpty(course.Value.LaunchUrl) ? course.Value.LaunchUrl : null;
    }

    /// <summary>Builds the response body and the record of what was issued.</summary>
    public (JsonObject Body, IReadOnlyList<IssuedCard> Issued) Write(IReadOnlyList<Card> cards, string patientId, DateTimeOffset now)
    {
        ArgumentNullException.ThrowIfNull(cards);
        var array = new JsonArray();
        var issued = new List<IssuedCard>();
        foreach (var card in cards)
        {
            var uuid = Guid.NewGuid();
            var suggestionUuids = new Dictionary<string, Guid>(StringComparer.Ordinal);
            var json = new JsonObject
            {
                ["uuid"] = uuid.ToString(),
                ["summary"] = Summary.Fit(card.Summary),
                ["indicator"] = Indicator(card.Indicator),
                ["detail"] = card.Detail,
                ["source"] = new JsonObject
                {
                    ["label"] = _options.SourceLabel,
                    ["topic"] = new JsonObject { ["system"] = TopicSystem, ["code"] = card.Topic, ["display"] = TopicDisplay(card.Topic) },
                },
            };
            if (card.Suggestions.Count > 0)
            {
                var suggestions = new JsonArray();
                foreach (var suggestion in card.Suggestions)
                {
                    var suggestionUuid = Guid.NewGuid();
                    suggestionUuids[suggestion.Key] = suggestionUuid;
                    suggestions.Add(Suggestion(suggestion, suggestionUuid, patientId, now));
                }

                json["suggestions"] = suggestions;
                json["selectionBehavior"] = card.SelectionBehavior == SelectionBehavior.AtMostOne ? "at-most-one" : "any";
            }

            if (card.OverrideReasons.Count > 0)
            {
                json["overrideReasons"] = new JsonArray(card.OverrideReasons
                    .Select(r => (JsonNode)new JsonObject { ["system"] = r.System, ["code"] = r.Code, ["display"] = r.Display ?? r.Code })
                    .ToArray());
            }

            if (_courseLaunchUrl is not null && Course.CourseLink.For(card.Topic, uuid, _courseLaunchUrl) is { } link)
            {
                json["links"] = new JsonArray(link);
            }

            array.Add(json);
            issued.Add(new IssuedCard(uuid, card, suggestionUuids));
        }

        return (new JsonObject { ["cards"] = array }, issued);
    }

    private static JsonObject Suggestion(Suggestion suggestion, Guid uuid, string patientId, DateTimeOffset now)
    {
        var json = new JsonObject { ["label"] = suggestion.Label, ["uuid"] = uuid.ToString() };
        if (suggestion.IsRecommended is { } recommended)
        {
            json["isRecommended"] = recommended;
        }

        if (suggestion.Actions.Count > 0)
        {
            json["actions"] = new JsonArray(suggestion.Actions.Select(a => (JsonNode)Action(a, patientId, now)).ToArray());
        }

        return json;
    }

    private static JsonObject Action(SuggestedAction action, string patientId, DateTimeOffset now)
    {
        var json = new JsonObject
        {
            ["type"] = action.Kind switch { ActionKind.Create => "create", ActionKind.Update => "update", _ => "delete" },
            ["description"] = action.Description,
        };
        if (action.Create is { } proposal)
        {
            json["resource"] = JsonNode.Parse(OrderResourceFactory.ToJson(OrderResourceFactory.LabOrder(proposal, patientId, now)));
        }

        if (action.ResourceId is { } resourceId)
        {
            json["resourceId"] = resourceId;
        }

        return json;
    }

    private static string Indicator(CardIndicator indicator) => indicator switch
    {
        CardIndicator.Critical => "critical",
        CardIndicator.Warning => "warning",
        _ => "info",
    };

    private static string TopicDisplay(string topic) => topic switch
    {
        "sodium-assessment" => "Sodium assessment",
        "correction-rate" => "Correction rate",
        "infusion-prediction" => "Infusion prediction",
        "drug-cause" => "Drug cause",
        "drug-order-warning" => "Drug order warning",
        "rate-caution-order" => "Rate caution on an order",
        _ => topic,
    };
}
