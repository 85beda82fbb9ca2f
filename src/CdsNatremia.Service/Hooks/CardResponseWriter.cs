using CdsNatremia.Core.Cards;
using CdsNatremia.Core.Knowledge;
using CdsNatremia.Fhir.Knowledge;
using CdsNatremia.Service.Configuration;
using Microsoft.Extensions.Options;

namespace CdsNatremia.Service.Hooks;

/// <summary>
/// Turns cards into the CDS Hooks 2.0 response (<see cref="CardsResponse"/>). Optional fields with no value are left out
/// (the standard forbids null, "", [] and {} where not allowed); selectionBehavior is sent whenever suggestions are.
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

    /// <summary>Decides the ids of the response and the record of what was issued; the body is written later, straight to the response.</summary>
    public (CardsResponse Body, IReadOnlyList<IssuedCard> Issued) Write(IReadOnlyList<Card> cards, string patientId, DateTimeOffset now)
        => Write(cards, patientId, now, reportBaseUrl: null);

    /// <summary>
    /// Decides the ids of the response and the record of what was issued; with <paramref name="reportBaseUrl"/>, every card
    /// with a full report links to it (<c>{base}/reports/{id}</c>, a fresh random id per card, kept once the audit is
    /// committed). Every card with findings also carries them as data in its <c>extension</c> (kinds, certainty, evidence),
    /// with the full report's Markdown, for integration tooling; an EHR ignores extensions it does not know. The body is
    /// written by <see cref="CardsResponse"/> with a <see cref="System.Text.Json.Utf8JsonWriter"/> straight to the response.
    /// </summary>
    public (CardsResponse Body, IReadOnlyList<IssuedCard> Issued) Write(IReadOnlyList<Card> cards, string patientId, DateTimeOffset now, string? reportBaseUrl)
    {
        ArgumentNullException.ThrowIfNull(cards);
        var answered = new AnsweredCard[cards.Count];
        var issued = new IssuedCard[cards.Count];
        for (var i = 0; i < cards.Count; i++)
        {
            var card = cards[i];
            var uuid = Guid.NewGuid();
            var suggestionUuids = new Dictionary<string, Guid>(StringComparer.Ordinal);
            var ordered = new Guid[card.Suggestions.Count];
            for (var s = 0; s < ordered.Length; s++)
            {
                ordered[s] = Guid.NewGuid();
                suggestionUuids[card.Suggestions[s].Key] = ordered[s];
            }

            var courseLink = _courseLaunchUrl is null ? null : Course.CourseLink.For(card.Topic, uuid, _courseLaunchUrl);
            string? reportId = null;
            string? reportUrl = null;
            if (reportBaseUrl is not null && card.Report.Length > 0)
            {
                reportId = Reports.CardReports.NewId();
                reportUrl = reportBaseUrl.TrimEnd('/') + "/reports/" + reportId;
            }

            answered[i] = new AnsweredCard(card, uuid, ordered, Topic(card.Topic), courseLink, reportUrl);
            issued[i] = new IssuedCard(uuid, card, suggestionUuids) { ReportId = reportId };
        }

        return (new CardsResponse(answered, _options.SourceLabel, patientId, now), issued);
    }

    /// <summary>The label of the link to a card's full report.</summary>
    public const string ReportLinkLabel = "Full report: reasoning, data used, sources";

    /// <summary>The key of our card extension (findings as data and the full report).</summary>
    public const string FindingsExtension = "cdsnatremia-findings";

    /// <summary>
    /// The card's topic as a Coding from the loaded card-topic CodeSystem. A code the CodeSystem does not hold (a test
    /// keeps every producer's topic in it) is still sent with the CodeSystem's url, without a display: never invented here.
    /// </summary>
    private TopicCoding Topic(string code)
    {
        if (CardTopics.Find(code, _knowledge) is { } topic)
        {
            return new TopicCoding(topic.System, topic.Code, string.IsNullOrEmpty(topic.Display) ? null : topic.Display);
        }

        var system = CardTopics.All(_knowledge).Select(t => t.System).FirstOrDefault();
        return new TopicCoding(system, code, null);
    }
}
