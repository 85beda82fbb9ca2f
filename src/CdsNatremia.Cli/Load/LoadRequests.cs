using CdsNatremia.Cli.Population;
using CdsNatremia.Cli.Prefetch;
using CdsNatremia.Cli.Replay;

namespace CdsNatremia.Cli.Load;

/// <summary>Prepares the requests of a load test from the scenario set or a generated population.</summary>
internal static class LoadRequests
{
    /// <summary>Each scenario, to the service for its hook, prefetch evaluated from that service's templates.</summary>
    public static IReadOnlyList<LoadRequest> FromInputs(IReadOnlyList<DiscoveredService> services, IEnumerable<ReplayInput> inputs)
    {
        var list = new List<LoadRequest>();
        foreach (var input in inputs)
        {
            var service = ReplayRunner.Choose(services, input, null);
            var composed = HookRequestComposer.Compose(service, input, PrefetchMode.Evaluate, Guid.NewGuid());
            list.Add(new LoadRequest(service.Id, composed.Body.ToJsonString()));
        }

        return list;
    }

    /// <summary>A generated population, each patient to the patient-view service.</summary>
    public static IReadOnlyList<LoadRequest> FromPopulation(IReadOnlyList<DiscoveredService> services, int seed, int count, DateTimeOffset asOf)
        => FromInputs(services, PopulationGenerator.Generate(seed, count, asOf).Select(p => new ReplayInput
        {
            Name = p.Id,
            PatientId = p.Id,
            Resources = FhirSearchEvaluator.ResourcesOf(p.Bundle),
        }));
}
