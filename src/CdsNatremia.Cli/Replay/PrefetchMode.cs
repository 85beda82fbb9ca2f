namespace CdsNatremia.Cli.Replay;

/// <summary>How a replayed request gives the service its data.</summary>
internal enum PrefetchMode
{
    /// <summary>Each prefetch key filled by evaluating the service's own template against the Bundle.</summary>
    Evaluate,

    /// <summary>No prefetch, and no fhirServer: the service should answer 412.</summary>
    None,

    /// <summary>No prefetch; fhirServer points at a loopback FHIR server serving the Bundle.</summary>
    FhirServer,
}
