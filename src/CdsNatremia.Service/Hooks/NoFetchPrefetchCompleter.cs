using CdsNatremia.Fhir.Reading;

namespace CdsNatremia.Service.Hooks;

/// <summary>A completer that never fetches: every missing key is reported as unobtainable, with the reason.</summary>
internal sealed class NoFetchPrefetchCompleter : IPrefetchCompleter
{
    public Task<IReadOnlyList<PrefetchValue>> CompleteAsync(ServiceDefinition service, HookRequest request, IReadOnlyList<string> keys, CancellationToken cancellationToken)
    {
        var reason = request.FhirServer is null
            ? "it was not in prefetch and the request gave no fhirServer to fetch it from"
            : "it was not in prefetch and fetching from the FHIR server is not enabled";
        IReadOnlyList<PrefetchValue> values = keys.Select(k => new PrefetchValue(k, PrefetchValueKind.Failed, [], [$"prefetch '{k}': {reason}"])).ToList();
        return Task.FromResult(values);
    }
}
