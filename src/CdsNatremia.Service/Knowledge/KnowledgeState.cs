using CdsNatremia.Fhir.Knowledge;

namespace CdsNatremia.Service.Knowledge;

/// <summary>Holds the loaded knowledge; readiness is "ready" once it is set.</summary>
public sealed class KnowledgeState
{
    /// <summary>The loaded knowledge, or null before start-up has loaded it.</summary>
    public LoadedKnowledge? Current { get; set; }
}
