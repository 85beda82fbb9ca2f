using System.Diagnostics;
using System.Text.Json;
using CdsNatremia.Core.Engine;
using CdsNatremia.Core.Facts;
using CdsNatremia.Fhir.Reading;
using CdsNatremia.Service.Telemetry;

namespace CdsNatremia.Service.Hooks;

/// <summary>
/// From a validated request to cards: read prefetch, obtain what is missing, refuse with 412 when required data
/// cannot be had (except on the result hook when the arrived results hold a sodium: it then answers from them and says
/// which checks the missing history leaves undone), assemble facts, run the engine. No HTTP types here; the endpoint maps the outcome.
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
        var request = HookRequestParser.Parse(body, service, out var problems);
        if (request is null)
        {
            return new HookOutcome.Invalid(problems);
        }

        var now = _time.GetUtcNow();
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
        var contextResources = ContextResources(service, request);
        var assembled = _assembler.Assemble(request.PatientId, now, values, contextResources.Resources, contextResources.Unreadable);
        var facts = assembled.Facts;
        if (missing.Count > 0)
        {
            // The result hook answers from the arrived results when the history cannot be had, saying which checks that
            // leaves undone; without a sodium among them there is nothing to assess (412).
            if (service.Kind != HookKind.ResultArrive || !ArrivedSodium(facts))
            {
                return new HookOutcome.MissingData(missing);
            }

            facts = facts with { SodiumHistoryUnavailable = string.Join("; ", missing) };
        }

        if (contextResources.Problems.Count > 0)
        {
            facts = facts with { DataNotes = [.. facts.DataNotes, .. contextResources.Problems] };
        }

        var decision = new DecisionRequest
        {
            Hook = service.Kind,
            Facts = facts,
            Now = now,
            DraftOrders = assembled.DraftOrders,
            SelectedOrders = Strings(request.Context, "selections"),
            NewResultIds = contextResources.Resources
                .Where(r => r.Source == "context.results" && r.Resource.Id is not null)
                .Select(r => r.Resource.Id!)
                .ToList(),
        };
        NatremiaTelemetry.RecordSetAside(facts.SetAside);
        using var activity = NatremiaTelemetry.Source.StartActivity("rules evaluate");
        activity?.SetTag("natremia.service", service.Id);
        var started = Stopwatch.GetTimestamp();
        var cards = _engine.Decide(decision);
        NatremiaTelemetry.RecordRuleEvaluation(Stopwatch.GetElapsedTime(started), service.Hook);
        activity?.SetTag("natremia.cards", cards.Count);
        return new HookOutcome.Cards(cards, request.PatientId, now);
    }

    /// <summary>True when the hook context brought a sodium of this patient: measured, bounded or unreadable.</summary>
    private static bool ArrivedSodium(PatientFacts facts)
        => facts.Labs.Concat(facts.BoundedLabs).Any(l => l.Analyte == Analyte.Sodium && l.Origin == DataOrigin.Context)
            || facts.SetAside.Any(s => s.Analyte == Analyte.Sodium && s.State == FactState.Unreadable);

    private (List<ParsedResource> Resources, List<string> Problems, List<UnreadableObservation> Unreadable) ContextResources(ServiceDefinition service, HookRequest request)
    {
        var resources = new List<ParsedResource>();
        var problems = new List<string>();
        var unreadable = new List<UnreadableObservation>();
        foreach (var field in service.Context.Where(f => f.Kind == ContextFieldKind.Bundle))
        {
            if (!request.Context.TryGetProperty(field.Name, out var bundle))
            {
                continue;
            }

            var value = _bundles.Read("context." + field.Name, bundle, DataOrigin.Context);
            resources.AddRange(value.Resources.Select(r => r with { Source = "context." + field.Name }));
            unreadable.AddRange(value.UnreadableObservations);
            problems.AddRange(value.Problems.Select(p => p.Replace("prefetch 'context.", "context '", StringComparison.Ordinal)));
        }

        return (resources, problems, unreadable);
    }

    private static IReadOnlyList<string> Strings(JsonElement context, string name)
        => context.TryGetProperty(name, out var array) && array.ValueKind == JsonValueKind.Array
            ? array.EnumerateArray().Where(e => e.ValueKind == JsonValueKind.String).Select(e => e.GetString()!).ToList()
            : [];
}
