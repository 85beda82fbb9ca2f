using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Knowledge;

namespace CdsNatremia.Fhir.Knowledge;

/// <summary>The result of loading <c>profiles/</c>: code sets for the rules and code systems (e.g. override reasons).</summary>
/// <param name="Base">The code sets.</param>
/// <param name="CodeSystems">Code systems by id, each as its list of codes with displays.</param>
/// <param name="Directory">Where they were loaded from.</param>
/// <param name="ManifestVersion">The version of the knowledge manifest the files were checked against, when they were.</param>
public sealed record LoadedKnowledge(KnowledgeBase Base, IReadOnlyDictionary<string, IReadOnlyList<CodeRef>> CodeSystems, string Directory, string? ManifestVersion = null);
