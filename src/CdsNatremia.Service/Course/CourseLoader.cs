using System.Text.Json;
using CdsNatremia.Core.Cards;
using CdsNatremia.Core.Course;
using CdsNatremia.Core.Engine;
using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Text;
using CdsNatremia.Fhir.Knowledge;
using CdsNatremia.Fhir.Reading;
using CdsNatremia.Service.Hooks;
using Microsoft.Extensions.Options;

namespace CdsNatremia.Service.Course;

/// <summary>What the view shows for one patient: the picture's model, the cards the service would answer, and when.</summary>
/// <param name="Model">The chart model.</param>
/// <param name="Cards">The cards of a chart opening for this patient (the full report below the chart).</param>
/// <param name="Display">How times are shown.</param>
/// <param name="Notes">Notes about data gathering (fetch caps, what could not be read).</param>
public sealed record CourseData(CourseModel Model, IReadOnlyList<Card> Cards, TimeDisplay Display, IReadOnlyList<string> Notes);

/// <summary>The view could not get the data it needs; the reasons are safe to show (no token, no patient data).</summary>
/// <param name="Reasons">Why.</param>
public sealed record CourseUnavailable(IReadOnlyList<string> Reasons);

/// <summary>
/// Gathers one patient's data the way a chart opening does (the chart-review service's queries, through the resilient,
/// allowlisted FHIR client with its budget and paging caps), assembles the facts, runs the engine and builds the chart
/// model. Nothing is written to the audit trail: the view is a reading, not advice issued.
/// </summary>
public sealed class CourseLoader
{
    /// <summary>The service whose queries and rules the view uses.</summary>
    public const string ServiceId = "natremia-chart-review";

    /// <summary>Key of the view's completer: the hooks' fetching with the view's own time budget.</summary>
    public const string CompleterKey = "CdsNatremia.Course";

    private readonly ServiceCatalog _catalog;
    private readonly BundleReader _bundles;
    private readonly FactsAssembler _assembler;
    private readonly DecisionEngine _engine;
    private readonly IPrefetchCompleter _completer;
    private readonly RuleOptions _rules;
    private readonly LoadedKnowledge _knowledge;
    private readonly TimeProvider _time;

    /// <summary>Creates the loader.</summary>
    public CourseLoader(ServiceCatalog catalog, BundleReader bundles, FactsAssembler assembler, DecisionEngine engine, [FromKeyedServices(CompleterKey)] IPrefetchCompleter completer, IOptions<RuleOptions> rules, LoadedKnowledge knowledge, TimeProvider time)
    {
        _catalog = catalog;
        _bundles = bundles;
        _assembler = assembler;
        _engine = engine;
        _completer = completer;
        _rules = rules.Value;
        _knowledge = knowledge;
        _time = time;
    }

    /// <summary>Loads the course of a launched session's patient from the EHR's FHIR server.</summary>
    public async Task<OneOf> LoadAsync(CourseSession session, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(session);
        var service = _catalog.Find(ServiceId)!;
        var request = new HookRequest
        {
            Hook = service.Hook,
            HookInstance = Guid.NewGuid(),
            PatientId = session.PatientId,
            Context = JsonSerializer.SerializeToElement(new Dictionary<string, string> { ["patientId"] = session.PatientId }),
            Prefetch = new Dictionary<string, JsonElement>(StringComparer.Ordinal),
            FhirServer = new Uri(session.Issuer),
            Authorization = new FhirAuthorization(session.AccessToken, "Bearer", 0, session.Scope, session.ClientId),
        };
        var values = await _completer.CompleteAsync(service, request, service.PrefetchKeys, cancellationToken).ConfigureAwait(false);
        return Build(service, session.PatientId, values.ToList());
    }

    /// <summary>Loads the course from a chart-opening request body with its prefetch (the offline view of a file).</summary>
    public async Task<OneOf> LoadAsync(JsonElement hookRequestBody, CancellationToken cancellationToken)
    {
        var service = _catalog.Find(ServiceId)!;
        var request = HookRequestParser.Parse(hookRequestBody, service, out var problems);
        if (request is null)
        {
            return new OneOf(null, new CourseUnavailable(problems));
        }

        var values = new List<PrefetchValue>();
        var toFetch = new List<string>();
        foreach (var key in service.PrefetchKeys)
        {
            if (request.Prefetch.TryGetValue(key, out var raw))
            {
                values.Add(_bundles.Read(key, raw, DataOrigin.Prefetch));
            }
            else
            {
                toFetch.Add(key);
            }
        }

        if (toFetch.Count > 0)
        {
            values.AddRange(await _completer.CompleteAsync(service, request, toFetch, cancellationToken).ConfigureAwait(false));
        }

        return Build(service, request.PatientId, values);
    }

    private OneOf Build(ServiceDefinition service, string patientId, List<PrefetchValue> values)
    {
        var missing = service.RequiredKeys
            .Select(k => values.FirstOrDefault(v => v.Key == k))
            .Where(v => v is null || v.Kind is PrefetchValueKind.Failed or PrefetchValueKind.Unusable)
            .SelectMany(v => v?.Problems ?? ["a required query gave no answer"])
            .ToList();
        if (missing.Count > 0)
        {
            return new OneOf(null, new CourseUnavailable(missing));
        }

        var now = _time.GetUtcNow();
        var assembled = _assembler.Assemble(patientId, now, values, []);
        var decision = new DecisionRequest { Hook = service.Kind, Facts = assembled.Facts, Now = now };
        var cards = _engine.Decide(decision);
        var display = _engine.DisplayAt(now);
        var context = new DecisionContext(decision, _rules, _knowledge.Base, display.Zone);
        var notes = assembled.Facts.DataNotes.Concat(assembled.Facts.Unavailable.Select(u => u.Key + ": " + u.Value)).ToList();
        return new OneOf(new CourseData(CourseModelBuilder.Build(context), cards, display, notes), null);
    }

    /// <summary>Either the data or why it is unavailable.</summary>
    /// <param name="Data">The data, when loaded.</param>
    /// <param name="Unavailable">Why not, otherwise.</param>
    public sealed record OneOf(CourseData? Data, CourseUnavailable? Unavailable);
}
