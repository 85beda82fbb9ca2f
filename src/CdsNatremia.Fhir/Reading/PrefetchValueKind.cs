namespace CdsNatremia.Fhir.Reading;

/// <summary>What a prefetch key held.</summary>
public enum PrefetchValueKind
{
    /// <summary>The key was not in the request: the service may fetch it.</summary>
    Absent,
    /// <summary>JSON null, or an empty Bundle: the EHR says there is no data.</summary>
    Empty,
    /// <summary>A Bundle or a single resource with data.</summary>
    Data,
    /// <summary>An OperationOutcome: the EHR could not run the query; the service may fetch it.</summary>
    Failed,
    /// <summary>Something that is not FHIR JSON; nothing from it is used.</summary>
    Unusable,
}
