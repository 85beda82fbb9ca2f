using CdsNatremia.Fhir.Reading;

namespace CdsNatremia.Service.Hooks;

/// <summary>
/// Obtains prefetch keys the EHR did not send (or sent as an OperationOutcome), from the EHR's FHIR server.
/// </summary>
public interface IPrefetchCompleter
{
    /// <summary>Fetches the keys; a key that could not be obtained comes back as <see cref="PrefetchValueKind.Failed"/> with the reason.</summary>
    Task<IReadOnlyList<PrefetchValue>> CompleteAsync(ServiceDefinition service, HookRequest request, IReadOnlyList<string> keys, CancellationToken cancellationToken);
}
