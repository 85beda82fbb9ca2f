using System.Diagnostics;
using System.Reflection;
using CdsNatremia.Audit.Pseudonyms;
using CdsNatremia.Audit.Records;
using CdsNatremia.Audit.Storage;
using CdsNatremia.Core.Cards;
using CdsNatremia.Fhir.Knowledge;
using CdsNatremia.Service.Hooks;
using CdsNatremia.Service.Telemetry;

namespace CdsNatremia.Service.Audit;

/// <summary>
/// Records what a hook response issued, before the response is sent (durable write: see docs/audit.md). With group
/// commit on (the default) the records go through the <see cref="AuditWriteQueue"/>, which commits the records of every
/// answer waiting at that moment in one transaction; the answer still waits until its own record is durable.
/// The patient id becomes a keyed pseudonym here and is not passed further; the patient's own reference is dropped
/// from the resources used.
/// </summary>
public sealed class CardAudit
{
    private readonly IAuditStore _store;
    private readonly PatientPseudonymizer _pseudonymizer;
    private readonly LoadedKnowledge _knowledge;
    private readonly HashSet<string> _topics;
    private readonly AuditWriteQueue? _queue;

    /// <summary>Creates the recorder; without a queue, each answer's records are written in a transaction of their own.</summary>
    public CardAudit(IAuditStore store, PatientPseudonymizer pseudonymizer, LoadedKnowledge knowledge, AuditWriteQueue? queue = null)
    {
        _store = store;
        _pseudonymizer = pseudonymizer;
        _knowledge = knowledge;
        _topics = CardTopics.All(knowledge.Base).Select(t => t.Code).ToHashSet(StringComparer.Ordinal);
        _queue = queue;
    }

    /// <summary>The service's software version (assembly informational version), as audit records carry it.</summary>
    public static string SoftwareVersion { get; } =
        typeof(CardAudit).Assembly.GetCustomAttribute<AssemblyInformationalVersionAttribute>()?.InformationalVersion ?? "unknown";

    /// <summary>Builds the records of one response's cards.</summary>
    public IReadOnlyList<IssuedCardRecord> Records(ServiceDefinition service, Guid hookInstance, string patientId, DateTimeOffset now, IReadOnlyList<IssuedCard> issued, bool testTraffic = false)
    {
        ArgumentNullException.ThrowIfNull(service);
        ArgumentNullException.ThrowIfNull(issued);
        var pseudonym = _pseudonymizer.Pseudonym(patientId);
        var patientReference = "Patient/" + patientId;
        return issued.Select(card => new IssuedCardRecord
        {
            CardUuid = card.Uuid,
            ServiceId = service.Id,
            Hook = service.Hook,
            HookInstance = hookInstance,
            PatientPseudonym = pseudonym,
            PseudonymKeyId = _pseudonymizer.KeyId,
            RuleIds = card.Card.RuleIds,
            KnowledgeVersion = _knowledge.Base.Version,
            SoftwareVersion = SoftwareVersion,
            Indicator = card.Card.Indicator switch { CardIndicator.Critical => "critical", CardIndicator.Warning => "warning", _ => "info" },
            Topic = card.Card.Topic,
            Summary = Summary.Fit(card.Card.Summary),
            ResourcesUsed = card.Card.ResourcesUsed
                .Where(r => !string.Equals(r, patientReference, StringComparison.Ordinal) && !string.Equals(r, patientId, StringComparison.Ordinal))
                .ToList(),
            SuggestionUuids = card.SuggestionUuids,
            FindingsFingerprint = string.IsNullOrEmpty(card.Card.Fingerprint) ? null : card.Card.Fingerprint,
            IssuedAt = now,
            TestTraffic = testTraffic,
        }).ToList();
    }

    /// <summary>
    /// Records one response's cards (flagged when the request was marked as test traffic); completes once they are durably
    /// stored. Throws <see cref="AuditQueueFullException"/> at once when the group-commit queue is full (nothing queued).
    /// </summary>
    public async Task RecordAsync(ServiceDefinition service, Guid hookInstance, string patientId, DateTimeOffset now, IReadOnlyList<IssuedCard> issued, bool testTraffic, CancellationToken cancellationToken)
    {
        var records = Records(service, hookInstance, patientId, now, issued, testTraffic);
        using var activity = NatremiaTelemetry.Source.StartActivity("audit write");
        activity?.SetTag("natremia.audit.store", _store.Kind);
        activity?.SetTag("natremia.cards", records.Count);
        var started = Stopwatch.GetTimestamp();
        var succeeded = false;
        try
        {
            await (_queue is null ? _store.RecordIssuedAsync(records, cancellationToken) : _queue.RecordAsync(records, cancellationToken)).ConfigureAwait(false);
            succeeded = true;
        }
        finally
        {
            NatremiaTelemetry.RecordAuditWrite(Stopwatch.GetElapsedTime(started), _store.Kind, succeeded);
            activity?.SetStatus(succeeded ? ActivityStatusCode.Ok : ActivityStatusCode.Error);
        }

        NatremiaTelemetry.RecordCards(issued.Select(i => i.Card), _topics);
    }
}
