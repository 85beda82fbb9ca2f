using System.ComponentModel.DataAnnotations;

namespace CdsNatremia.Service.Configuration;

/// <summary>Host settings, bound from the "Natremia" configuration section.</summary>
public sealed class NatremiaServiceOptions
{
    /// <summary>The configuration section.</summary>
    public const string Section = "Natremia";

    /// <summary>
    /// Reverse-domain prefix of the organisation-specific result hook, e.g. "org.example" gives
    /// "org.example.lab-result-arrive". Default "org.example", a neutral placeholder each site replaces with its own.
    /// </summary>
    [Required]
    [RegularExpression("^[a-z0-9]+(\\.[a-z0-9-]+)+$")]
    public string ResultHookDomain { get; set; } = "org.example";

    /// <summary>
    /// Folder of the knowledge files (ValueSets, CodeSystems). Default: the nearest "profiles" folder above the
    /// content root (a source checkout), else the copy next to the service's binaries.
    /// </summary>
    public string? KnowledgeDirectory { get; set; }

    /// <summary>The label every card's source carries.</summary>
    [Required]
    public string SourceLabel { get; set; } = "CdsNatremia sodium decision support";

    /// <summary>Largest JSON nesting depth accepted in a request body. Default 64 (FHIR resources rarely exceed 20).</summary>
    [Range(16, 256)]
    public int MaxJsonDepth { get; set; } = 64;

    /// <summary>
    /// Read prefetch with the fast reader (<c>FastResourceReader</c>: System.Text.Json straight to the model objects the
    /// readers use) and fall back to the FHIR SDK's parser for every entry outside its scope. Default true: the
    /// differential test holds both paths to identical facts and set-aside reasons over every scenario, the synthetic
    /// population and a corpus of malformed and hostile inputs (docs/performance.md). False reads everything with the SDK.
    /// </summary>
    public bool FastPrefetchReader { get; set; } = true;
}
