namespace CdsNatremia.Core.Facts;

/// <summary>How a fact reached the service; cards say when data came from the FHIR server rather than prefetch.</summary>
public enum DataOrigin
{
    /// <summary>Sent by the EHR in the hook request's prefetch.</summary>
    Prefetch,
    /// <summary>Sent by the EHR in the hook context (new results, draft orders).</summary>
    Context,
    /// <summary>Fetched by the service from the EHR's FHIR server.</summary>
    FhirServer,
}
