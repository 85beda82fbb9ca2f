using System.Diagnostics;
using System.Diagnostics.Metrics;
using CdsNatremia.Core.Cards;
using CdsNatremia.Core.Facts;

namespace CdsNatremia.Service.Telemetry;

/// <summary>
/// The service's own traces and metrics: one <see cref="ActivitySource"/> and one <see cref="Meter"/>, both named
/// <see cref="Name"/>, exported by OpenTelemetry (<see cref="TelemetrySetup"/>). Every label has a small, fixed set of
/// values chosen here (service ids from the catalogue, card topics and indicators, set-aside reason classes, fetch
/// outcomes); nothing a request sends becomes a label or attribute, so no patient identifier, value or token can
/// reach a span or a metric (checked over every scenario by the telemetry tests).
/// </summary>
public static class NatremiaTelemetry
{
    /// <summary>Name of the activity source and of the meter.</summary>
    public const string Name = "CdsNatremia";

    /// <summary>Label value when a value is not one of the known set.</summary>
    public const string Other = "other";

    /// <summary>The service's spans: rule evaluation and the audit write (the server and HTTP client spans come from OpenTelemetry's instrumentation).</summary>
    public static readonly ActivitySource Source = new(Name, Version);

    private static readonly Meter Meter = new(Name, Version);

    private static readonly Counter<long> Answers = Meter.CreateCounter<long>(
        "natremia.answers", "{answer}", "Answers to POST /cds-services/{id} (hook calls and feedback), by service and HTTP status.");

    private static readonly Counter<long> Cards = Meter.CreateCounter<long>(
        "natremia.cards", "{card}", "Cards issued (and recorded in the audit trail), by topic and indicator.");

    private static readonly Counter<long> SetAsideItems = Meter.CreateCounter<long>(
        "natremia.set_aside", "{item}", "Data received but not used, by reason class.");

    private static readonly Counter<long> FhirFetches = Meter.CreateCounter<long>(
        "natremia.fhir.fetches", "{key}", "Prefetch keys fetched from the EHR's FHIR server, by outcome: fetched, timed out, circuit open, refused, failed.");

    private static readonly Histogram<double> AuditWrite = Meter.CreateHistogram(
        "natremia.audit.write.duration", "s", "Time to durably record one answer's cards in the audit trail.",
        advice: new InstrumentAdvice<double> { HistogramBucketBoundaries = [0.001, 0.0025, 0.005, 0.01, 0.025, 0.05, 0.1, 0.25, 0.5, 1, 2.5] });

    private static readonly Histogram<double> RuleEvaluation = Meter.CreateHistogram(
        "natremia.rules.duration", "s", "Time the decision engine took to evaluate the rules for one request.",
        advice: new InstrumentAdvice<double> { HistogramBucketBoundaries = [0.0001, 0.00025, 0.0005, 0.001, 0.0025, 0.005, 0.01, 0.025, 0.05, 0.1] });

    private static readonly Counter<long> ReplayRefusals = Meter.CreateCounter<long>(
        "natremia.replay.refusals", "{request}", "Calls refused because their token id (jti) had already been used.");

    private static readonly Counter<long> RateLimitRefusals = Meter.CreateCounter<long>(
        "natremia.rate_limit.refusals", "{request}", "Calls refused by the per-client rate limit (HTTP 429).");

    /// <summary>Fetch outcomes, the only values the <c>outcome</c> label of <c>natremia.fhir.fetches</c> takes.</summary>
    public static IReadOnlyList<string> FetchOutcomes { get; } = ["fetched", "timed out", "circuit open", "refused", "failed"];

    private static string Version => typeof(NatremiaTelemetry).Assembly.GetName().Version?.ToString() ?? "0.0.0";

    /// <summary>Counts one answer of a CDS service. <paramref name="serviceId"/> must already be a catalogue id or <see cref="Other"/>.</summary>
    public static void RecordAnswer(string serviceId, string kind, int status)
        => Answers.Add(1, new TagList { { "natremia.service", serviceId }, { "natremia.call", kind }, { "http.response.status_code", status } });

    /// <summary>
    /// Counts the cards of one answer, by topic and indicator, both from fixed sets: a topic is its code when the loaded
    /// card-topic CodeSystem holds it (<paramref name="topics"/>, <see cref="CardTopics"/>), else <see cref="Other"/>.
    /// </summary>
    public static void RecordCards(IEnumerable<Card> cards, IReadOnlySet<string> topics)
    {
        ArgumentNullException.ThrowIfNull(cards);
        ArgumentNullException.ThrowIfNull(topics);
        foreach (var card in cards)
        {
            Cards.Add(1, new TagList { { "natremia.card.topic", TopicLabel(card.Topic, topics) }, { "natremia.card.indicator", IndicatorLabel(card.Indicator) } });
        }
    }

    /// <summary>Counts the items set aside in one request, by reason class (never the reason's text).</summary>
    public static void RecordSetAside(IEnumerable<SetAsideItem> items)
    {
        ArgumentNullException.ThrowIfNull(items);
        foreach (var item in items)
        {
            SetAsideItems.Add(1, new KeyValuePair<string, object?>("natremia.reason", SetAsideReasons.Classify(item.Reason)));
        }
    }

    /// <summary>Counts one prefetch key's fetch; <paramref name="detail"/> is the fetcher's own outcome word, mapped onto <see cref="FetchOutcomes"/>.</summary>
    public static void RecordFetch(string detail, int keys = 1)
        => FhirFetches.Add(keys, new KeyValuePair<string, object?>("outcome", FetchOutcome(detail)));

    /// <summary>Counts keys not fetched at all (fetching off, no server or token, server not allowlisted).</summary>
    public static void RecordFetchRefused(int keys) => FhirFetches.Add(keys, new KeyValuePair<string, object?>("outcome", "refused"));

    /// <summary>Records one audit write's duration.</summary>
    public static void RecordAuditWrite(TimeSpan elapsed, string store, bool succeeded)
        => AuditWrite.Record(elapsed.TotalSeconds, new TagList { { "natremia.audit.store", store is "sqlite" or "postgresql" ? store : Other }, { "outcome", succeeded ? "ok" : "failed" } });

    /// <summary>Records one rule evaluation's duration.</summary>
    public static void RecordRuleEvaluation(TimeSpan elapsed, string hook)
        => RuleEvaluation.Record(elapsed.TotalSeconds, new KeyValuePair<string, object?>("natremia.hook", hook));

    /// <summary>Counts a call refused as a replayed token.</summary>
    public static void RecordReplayRefusal() => ReplayRefusals.Add(1);

    /// <summary>Counts a call refused by the per-client rate limiter (for its OnRejected callback).</summary>
    public static void RecordRateLimitRefusal() => RateLimitRefusals.Add(1);

    /// <summary>Maps the fetcher's outcome words onto the bounded set.</summary>
    public static string FetchOutcome(string detail) => detail switch
    {
        "data" or "no data" or "partial" => "fetched",
        "deadline" or "attempt time-out" => "timed out",
        "circuit open" => "circuit open",
        "refused" => "refused",
        _ => "failed",
    };

    private static string IndicatorLabel(CardIndicator indicator) => indicator switch
    {
        CardIndicator.Critical => "critical",
        CardIndicator.Warning => "warning",
        _ => "info",
    };

    // Topic codes are the service's own constants; anything else is folded so the label set stays bounded.
    private static string TopicLabel(string? topic, IReadOnlySet<string> topics) => topic is not null && topics.Contains(topic) ? topic : Other;
}
