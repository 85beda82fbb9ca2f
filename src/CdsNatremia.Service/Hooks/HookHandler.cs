using System.Diagnostics;
using System.Text.Json;
using CdsNatremia.Core.Cards;
using CdsNatremia.Core.Engine;
using CdsNatremia.Core.Facts;
using CdsNatremia.Fhir.Reading;
using CdsNatremia.Service.Telemetry;

namespace CdsNatremia.Service.Hooks;

/// <summary>
/// From a request body to cards, in named steps that hand each other typed data: read the request
/// (<see cref="ReadRequest"/>), complete the prefetch (<see cref="CompletePrefetchAsync"/>), read the hook context
/// (<see cref="ReadContext"/>), assemble the facts (<see cref="AssembleFacts"/>: 412 when required data cannot be had,
/// except on a hook with arrived results when they hold a sodium: it then answers from them and says which checks the
/// missing history leaves undone), decide (<see cref="Decide"/>) and write the outcome. What each step does per hook
/// comes from the hook's definition (<see cref="HookDefinition"/>). No HTTP types here; the endpoint maps the outcome.
/// </summary>
public sealed class HookHandler
{
    private readonly BundleReader _bundles;
    private readonly FactsAssembler _assembler;
    private readonly DecisionEngine _engine;
    private readonly IPrefetchCompleter _completer;
    private readonly TimeProvider _time;

    /// <summary>Creates the handler.</summary>
    public HookHandler(BundleReader bundles, FactsAssembler assembler, DecisionEngine engine, IPrefetchCompleter completer, TimeProvider time)
    {
        _bundles = bundles;
        _assembler = assembler;
        _engine = engine;
        _completer = completer;
        _time = time;
    }

    /// <summary>Handles one request.</summary>
    public async Task<HookOutcome> HandleAsync(ServiceDefinition service, JsonElement body, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(service);
        var request = ReadRequest(service, body, out var problems);
        if (request is null)
        {
            return new HookOutcome.Invalid(problems);
        }

        var now = _time.GetUtcNow();
        var prefetch = await CompletePrefetchAsync(service, request, cancellationToken).ConfigureAwait(false);
        var context = ReadContext(service.Definition, request);
        var facts = AssembleFacts(service.Definition, request, now, prefetch, context);
        if (facts.Missing.Count > 0)
        {
            return new HookOutcome.MissingData(facts.Missing);
        }

        var cards = Decide(service, new DecisionRequest
        {
            Hook = service.Kind,
            Facts = facts.Facts,
            Now = now,
            DraftOrders = facts.DraftOrders,
            SelectedOrders = context.Selections,
            NewResultIds = context.ArrivedResultIds,
        });
        return Write(cards, request, now);
    }

    /// <summary>Step 1: the body checked against CDS Hooks and the hook's context table; null with the problems when not acceptable.</summary>
    private static HookRequest? ReadRequest(ServiceDefinition service, JsonElement body, out List<string> problems)
        => HookRequestParser.Parse(body, service, out problems);

    /// <summary>
    /// Step 2: every declared prefetch key read; what the EHR did not send, sent as an OperationOutcome, or sent not
    /// fitting its template (when required) is fetched from its FHIR server.
    /// </summary>
    private async Task<CompletedPrefetch> CompletePrefetchAsync(ServiceDefinition service, HookRequest request, CancellationToken cancellationToken)
    {
        var values = new List<PrefetchValue>();
        var toFetch = new List<string>();
        foreach (var key in service.PrefetchKeys)
        {
            if (!request.Prefetch.TryGetValue(key, out var raw))
            {
                toFetch.Add(key);
                continue;
            }

            var required = service.RequiredKeys.Contains(key, StringComparer.Ordinal);
            var value = _bundles.Read(key, raw, DataOrigin.Prefetch);
            if (PrefetchTemplateCheck.Problem(key, raw) is { } mismatch)
            {
                // Not what the template asks for: a required key is treated as absent (fetched when a FHIR server is
                // given, else 412 with this reason); an optional one is listed as not usable.
                value = new PrefetchValue(key, PrefetchValueKind.Unusable, [], [$"prefetch '{key}' {mismatch}; not used"]);
            }

            if (value.Kind == PrefetchValueKind.Failed || (required && value.Kind == PrefetchValueKind.Unusable))
            {
                toFetch.Add(key);
            }

            values.Add(value);
        }

        if (toFetch.Count > 0)
        {
            var fetched = await _completer.CompleteAsync(service, request, toFetch, cancellationToken).ConfigureAwait(false);
            values.RemoveAll(v => toFetch.Contains(v.Key) && fetched.Any(f => f.Key == v.Key && f.Kind != PrefetchValueKind.Failed));
            foreach (var failed in fetched.Where(f => f.Kind == PrefetchValueKind.Failed))
            {
                // The EHR's OperationOutcome and the fetch's failure both explain why the data is missing: keep both.
                var index = values.FindIndex(v => v.Key == failed.Key);
                if (index >= 0)
                {
                    values[index] = values[index] with { Problems = [.. values[index].Problems, .. failed.Problems] };
                }
            }

            values.AddRange(fetched.Where(f => f.Kind != PrefetchValueKind.Failed || values.All(v => v.Key != f.Key)));
        }

        var missing = service.RequiredKeys
            .Select(k => values.FirstOrDefault(v => v.Key == k))
            .Where(v => v is null || v.Kind is PrefetchValueKind.Failed or PrefetchValueKind.Unusable)
            .SelectMany(v => v?.Problems ?? [])
            .ToList();
        return new CompletedPrefetch(values, missing);
    }

    /// <summary>
    /// Step 3: the hook context's own data, each resource marked with the part its field plays in the hook's definition
    /// (arrived results, draft orders), and the selections.
    /// </summary>
    private HookContextData ReadContext(HookDefinition hook, HookRequest request)
    {
        var resources = new List<ParsedResource>();
        var problems = new List<string>();
        var unreadable = new List<UnreadableObservation>();
        foreach (var field in hook.Context.Where(f => f.Kind == ContextFieldKind.Bundle))
        {
            if (!request.Context.TryGetProperty(field.Name, out var bundle))
            {
                continue;
            }

            var role = field.Name == hook.DraftOrdersField ? ContextRole.DraftOrder
                : field.Name == hook.ArrivedResultsField ? ContextRole.ArrivedResult
                : ContextRole.None;
            var value = _bundles.Read(field.Name, bundle, DataOrigin.Context);
            resources.AddRange(value.Resources.Select(r => r with { Role = role }));
            unreadable.AddRange(value.UnreadableObservations);
            problems.AddRange(value.Problems);
        }

        var selections = hook.SelectionsField is { } name ? Strings(request.Context, name) : [];
        return new HookContextData(resources, unreadable, problems, selections);
    }

    /// <summary>
    /// Step 4: the patient's facts from prefetch and context. When required prefetch could not be had, the outcome
    /// carries why (412), unless the hook has arrived results holding a sodium of this patient: the facts then say
    /// the history is unavailable and why.
    /// </summary>
    private AssembledHookFacts AssembleFacts(HookDefinition hook, HookRequest request, DateTimeOffset now, CompletedPrefetch prefetch, HookContextData context)
    {
        var assembled = _assembler.Assemble(request.PatientId, now, prefetch.Values, context.Resources, context.Unreadable);
        var facts = assembled.Facts;
        if (prefetch.RequiredMissing.Count > 0)
        {
            if (hook.ArrivedResultsField is null || !ArrivedSodium(facts))
            {
                return new AssembledHookFacts(facts, assembled.DraftOrders, prefetch.RequiredMissing);
            }

            facts = facts with { SodiumHistoryUnavailable = string.Join("; ", prefetch.RequiredMissing) };
        }

        if (context.Problems.Count > 0)
        {
            facts = facts with { DataNotes = [.. facts.DataNotes, .. context.Problems] };
        }

        return new AssembledHookFacts(facts, assembled.DraftOrders, []);
    }

    /// <summary>Step 5: the engine decides; the evaluation is timed and counted.</summary>
    private IReadOnlyList<Card> Decide(ServiceDefinition service, DecisionRequest decision)
    {
        NatremiaTelemetry.RecordSetAside(decision.Facts.SetAside);
        using var activity = NatremiaTelemetry.Source.StartActivity("rules evaluate");
        activity?.SetTag("natremia.service", service.Id);
        var started = Stopwatch.GetTimestamp();
        var cards = _engine.Decide(decision);
        NatremiaTelemetry.RecordRuleEvaluation(Stopwatch.GetElapsedTime(started), service.Hook);
        activity?.SetTag("natremia.cards", cards.Count);
        return cards;
    }

    /// <summary>Step 6: the outcome the endpoint writes (the response body and audit record are built from it).</summary>
    private static HookOutcome.Cards Write(IReadOnlyList<Card> cards, HookRequest request, DateTimeOffset now)
        => new(cards, request.PatientId, now);

    /// <summary>True when the hook context brought a sodium of this patient: measured, bounded or unreadable.</summary>
    private static bool ArrivedSodium(PatientFacts facts)
        => facts.Labs.Concat(facts.BoundedLabs).Any(l => l.Analyte == Analyte.Sodium && l.Origin == DataOrigin.Context)
            || facts.SetAside.Any(s => s.Analyte == Analyte.Sodium && s.State == FactState.Unreadable);

    private static List<string> Strings(JsonElement context, string name)
        => context.TryGetProperty(name, out var array) && array.ValueKind == JsonValueKind.Array
            ? array.EnumerateArray().Where(e => e.ValueKind == JsonValueKind.String).Select(e => e.GetString()!).ToList()
            : [];

    /// <summary>What the prefetch step hands on: every value read or fetched, and why required ones could not be had.</summary>
    private sealed record CompletedPrefetch(IReadOnlyList<PrefetchValue> Values, IReadOnlyList<string> RequiredMissing);

    /// <summary>What the context step hands on: the context's resources (each with its role), unreadable entries, problems, selections.</summary>
    private sealed record HookContextData(
        IReadOnlyList<ParsedResource> Resources,
        IReadOnlyList<UnreadableObservation> Unreadable,
        IReadOnlyList<string> Problems,
        IReadOnlyList<string> Selections)
    {
        /// <summary>Ids of the newly arrived results (<see cref="DecisionRequest.NewResultIds"/>).</summary>
        public IReadOnlyList<string> ArrivedResultIds { get; } = Resources
            .Where(r => r.Role == ContextRole.ArrivedResult && r.Resource.Id is not null)
            .Select(r => r.Resource.Id!)
            .ToList();
    }

    /// <summary>What the facts step hands on: the facts and draft orders, or why required data is missing (412).</summary>
    private sealed record AssembledHookFacts(PatientFacts Facts, IReadOnlyList<MedicationFact> DraftOrders, IReadOnlyList<string> Missing);
}
