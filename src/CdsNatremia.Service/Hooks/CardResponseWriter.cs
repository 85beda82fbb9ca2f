using System.Text.Json.Nodes;
using CdsNatremia.Core.Cards;
using CdsNatremia.Core.Knowledge;
using CdsNatremia.Fhir.Knowledge;
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
    private readonly NatremiaServiceOptions _options;
    private readonly KnowledgeBase _knowledge;
    private readonly string? _courseLaunchUrl;

    /// <summary>Creates the writer; topic systems and displays come from the loaded card-topic CodeSystem.</summary>
    public CardResponseWriter(IOptions<NatremiaServiceOptions> options, LoadedKnowledge knowledge, IOptions<Course.CourseOptions> course)
    {
        ArgumentNullException.ThrowIfNull(options);
        ArgumentNullException.ThrowIfNull(knowledge);
        ArgumentNullException.ThrowIfNull(course);
        _options = options.Value;
        _knowledge = knowledge.Base;
        _courseLaunchUrl = course.Value.Enabled && !string.IsNullOrEmpty(course.Value.LaunchUrl) ? course.Value.LaunchUrl : null;
    }

    /// <summary>Builds the response body and the record of what was issued.</summary>
    public (JsonObject Body, IReadOnlyList<IssuedCard> Issued) Write(IReadOnlyList<Card> cards, string patientId, DateTimeOffset now)
        => Write(cards, patientId, now, reportBaseUrl: null);

    /// <summary>
    /// Builds the response body and the record of what was issued; with <paramref name="reportBaseUrl"/>, every card with a
    /// full report links to it (<c>{base}/reports/{id}</c>, a fresh random id per card, kept once the audit is committed).
    /// Every card with findings also carries them as data in its <c>extension</c> (kinds, certainty, evidence), with the
    /// full report's Markdown, for integration tooling; an EHR ignores extensions it does not know.
    /// </summary>
    public (JsonObject Body, IReadOnlyList<IssuedCard> Issued) Write(IReadOnlyList<Card> cards, string patientId, DateTimeOffset now, string? reportBaseUrl)
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
                    ["topic"] = Topic(card.Topic),
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

            // Links: the sodium-course view (a SMART app) when configured, then the card's full report.
            var links = new JsonArray();
            if (_courseLaunchUrl is not null && Course.CourseLink.For(card.Topic, uuid, _courseLaunchUrl) is { } courseLink)
            {
                links.Add(courseLink);
            }

            string? reportId = null;
            if (reportBaseUrl is not null && card.Report.Length > 0)
            {
                reportId = Reports.CardReports.NewId();
                links.Add(new JsonObject
                {
                    ["label"] = ReportLinkLabel,
                    ["url"] = reportBaseUrl.TrimEnd('/') + "/reports/" + reportId,
                    ["type"] = "absolute",
                });
            }

            if (links.Count > 0)
            {
                json["links"] = links;
            }

            if (card.Content is { } content)
            {
                json["extension"] = new JsonObject
                {
                    [FindingsExtension] = new JsonObject
                    {
                        ["findings"] = new JsonArray(content.All().Select(f => (JsonNode)FindingJson.Of(f)).ToArray()),
                        ["report"] = card.Report,
                    },
                };
            }

            if (card.OverrideReasons.Count > 0)
            {
                json["overrideReasons"] = new JsonArray(card.OverrideReasons
                    .Select(r => (JsonNode)new JsonObject { ["system"] = r.System, ["code"] = r.Code, ["display"] = r.Display ?? r.Code })
                    .ToArray());
            }

            array.Add(json);
            issued.Add(new IssuedCard(uuid, card, suggestionUuids) { ReportId = reportId });
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

    /// <summary>The label of the link to a card's full report.</summary>
    public const string ReportLinkLabel = "Full report: reasoning, data used, sources";

    /// <summary>The key of our card extension (findings as data and the full report).</summary>
    public const string FindingsExtension = "cdsnatremia-findings";

    private static string Indicator(CardIndicator indicator) => indicator switch
    {
        CardIndicator.Critical => "critical",
        CardIndicator.Warning => "warning",
        _ => "info",
    };

    /// <summary>
    /// The card's topic as a Coding from the loaded card-topic CodeSystem. A code the CodeSystem does not hold (a test
    /// keeps every producer's topic in it) is still sent with the CodeSystem's url, without a display: never invented here.
    /// </summary>
    private JsonObject Topic(string code)
    {
        if (CardTopics.Find(code, _knowledge) is { } topic)
        {
            var coding = new JsonObject { ["system"] = topic.System, ["code"] = topic.Code };
            if (!string.IsNullOrEmpty(topic.Display))
            {
                coding["display"] = topic.Display;
            }

            return coding;
        }

        var system = CardTopics.All(_knowledge).Select(t => t.System).FirstOrDefault();
        return system is null ? new JsonObject { ["code"] = code } : new JsonObject { ["system"] = system, ["code"] = code };
    }
}
