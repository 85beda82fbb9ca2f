namespace CdsNatremia.Service.Tests.Telemetry;

/// <summary>
/// The service's meter and activity source are process-wide (static), so telemetry tests run alone: measurements
/// from other tests' hosts running at the same time would otherwise mix into what they count.
/// </summary>
[CollectionDefinition(Name, DisableParallelization = true)]
public sealed class TelemetryCollection
{
    public const string Name = "Telemetry (alone)";
}
