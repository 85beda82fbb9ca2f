using System.Security.Cryptography;
using System.Text;
using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Knowledge;
using Hl7.Fhir.Model;
using Hl7.Fhir.Serialization;

namespace CdsNatremia.Fhir.Knowledge;

/// <summary>
/// Loads the knowledge files in <c>profiles/</c>: every <c>valuesets/*.json</c> becomes a <see cref="CodeSet"/> and
/// every <c>codesystems/*.json</c> a list of codes. Files are parsed strictly with the Firely SDK; any problem stops
/// loading with a <see cref="KnowledgeLoadException"/> that names the file, so a bad edit stops start-up instead of
/// silently weakening the rules. An "is-a" filter on ATC or ICD-10 is read as a code prefix (no terminology server).
/// </summary>
public static class KnowledgeLoader
{
    private static readonly HashSet<string> PrefixSystems = new(StringComparer.Ordinal) { CodeSystems.Atc, CodeSystems.Icd10, CodeSystems.Icd10Cm };

    /// <summary>Loads every file under the directory.</summary>
    public static LoadedKnowledge Load(string directory)
    {
        if (!Directory.Exists(directory))
        {
            throw new KnowledgeLoadException($"Knowledge directory '{directory}' does not exist.");
        }

        var deserializer = new FhirJsonDeserializer(new DeserializerSettings().UsingMode(DeserializationMode.Strict));
        var sets = new List<CodeSet>();
        var systems = new Dictionary<string, IReadOnlyList<CodeRef>>(StringComparer.Ordinal);
        var hash = new StringBuilder();

        foreach (var file in Files(directory, "codesystems"))
        {
            var text = File.ReadAllText(file);
            hash.Append(Path.GetFileName(file)).Append(text);
            var codeSystem = Parse<CodeSystem>(deserializer, file, text);
            CheckId(file, codeSystem.Id);
            var codes = Flatten(codeSystem.Concept)
                .Select(c => new CodeRef(codeSystem.Url ?? throw Problem(file, "CodeSystem.url is required"), c.Code ?? throw Problem(file, "a concept has no code"), c.Display ?? throw Problem(file, $"concept '{c.Code}' has no display")))
                .ToList();
            systems[codeSystem.Id!] = codes;
        }

        // ValueSets after CodeSystems: a ValueSet may include the whole of one of our own CodeSystems.
        var ownSystems = systems.Values.Where(c => c.Count > 0).ToDictionary(c => c[0].System, c => c, StringComparer.Ordinal);
        foreach (var file in Files(directory, "valuesets"))
        {
            var text = File.ReadAllText(file);
            hash.Append(Path.GetFileName(file)).Append(text);
            var valueSet = Parse<ValueSet>(deserializer, file, text);
            sets.Add(ToCodeSet(file, valueSet, ownSystems));
        }

        if (sets.Count == 0)
        {
            throw new KnowledgeLoadException($"No ValueSet files were found under '{Path.Combine(directory, "valuesets")}'.");
        }

        var digest = Convert.ToHexString(SHA256.HashData(Encoding.UTF8.GetBytes(hash.ToString())))[..12].ToLowerInvariant();
        return new LoadedKnowledge(new KnowledgeBase(sets, "knowledge-" + digest, systems), systems, directory);
    }

    private static IEnumerable<string> Files(string directory, string sub)
    {
        var path = Path.Combine(directory, sub);
        return Directory.Exists(path)
            ? Directory.EnumerateFiles(path, "*.json", SearchOption.TopDirectoryOnly).Order(StringComparer.Ordinal)
            : [];
    }

    private static T Parse<T>(FhirJsonDeserializer deserializer, string file, string text) where T : Resource
    {
        Resource? resource;
        try
        {
            if (!deserializer.TryDeserializeResource(text, out resource, out var issues) || resource is null)
            {
                throw Problem(file, "not valid FHIR R4: " + (issues?.FirstOrDefault()?.Message ?? "unknown problem"));
            }
        }
        catch (Exception ex) when (ex is DeserializationFailedException or System.Text.Json.JsonException or FormatException)
        {
            throw new KnowledgeLoadException($"{file}: not valid FHIR R4 JSON: {ex.Message}", ex);
        }

        return resource as T ?? throw Problem(file, $"expected a {typeof(T).Name}, found a {resource.TypeName}");
    }

    private static CodeSet ToCodeSet(string file, ValueSet valueSet, IReadOnlyDictionary<string, IReadOnlyList<CodeRef>> ownSystems)
    {
        CheckId(file, valueSet.Id);
        if (string.IsNullOrWhiteSpace(valueSet.Url))
        {
            throw Problem(file, "ValueSet.url is required");
        }

        KnowledgeFileChecks.Check(file, valueSet);

        if (valueSet.Compose?.Include is not { Count: > 0 } includes)
        {
            throw Problem(file, "ValueSet.compose.include is empty");
        }

        var codes = new List<CodeRef>();
        var prefixes = new List<CodeRef>();
        var names = new List<string>();
        var id = valueSet.Id!;
        var isDrugOrFluid = id.StartsWith("drug-", StringComparison.Ordinal) || id.StartsWith("fluid-", StringComparison.Ordinal);
        foreach (var include in includes)
        {
            if (string.IsNullOrWhiteSpace(include.System))
            {
                throw Problem(file, "an include has no system (includes of other ValueSets are not supported)");
            }

            if (include.Concept.Count == 0 && include.Filter.Count == 0 && ownSystems.TryGetValue(include.System, out var whole))
            {
                codes.AddRange(whole);
                continue;
            }

            if (include.Concept.Count == 0 && include.Filter.Count == 0)
            {
                throw Problem(file, $"the include of {include.System} lists no concept and no filter (whole code systems are supported only for our own CodeSystems in codesystems/)");
            }

            foreach (var concept in include.Concept)
            {
                if (string.IsNullOrWhiteSpace(concept.Code))
                {
                    throw Problem(file, $"a concept of {include.System} has no code");
                }

                codes.Add(new CodeRef(include.System, concept.Code.Trim(), concept.Display));
                if (isDrugOrFluid && !string.IsNullOrWhiteSpace(concept.Display) && IsNameBearing(include.System, concept.Code))
                {
                    names.Add(concept.Display);
                }

                names.AddRange(concept.Designation.Select(d => d.Value).OfType<string>().Where(v => !string.IsNullOrWhiteSpace(v)));
            }

            foreach (var filter in include.Filter)
            {
                if (filter.Op != FilterOperator.IsA || filter.Property != "concept" || !PrefixSystems.Contains(include.System))
                {
                    throw Problem(file, $"unsupported filter '{filter.Property} {filter.Op} {filter.Value}' on {include.System}: only 'concept is-a' on ATC or ICD-10");
                }

                prefixes.Add(new CodeRef(include.System, (filter.Value ?? throw Problem(file, "a filter has no value")).Trim()));
            }
        }

        var tierText = valueSet.GetStringExtension(KnowledgeExtensions.DrugGroupTier)
            ?? (valueSet.GetExtension(KnowledgeExtensions.DrugGroupTier)?.Value as Code)?.Value;
        EvidenceTier? tier = tierText switch
        {
            null => null,
            "primary" => EvidenceTier.Primary,
            "secondary" => EvidenceTier.Secondary,
            _ => throw Problem(file, $"drug-group-tier '{tierText}' must be 'primary' or 'secondary'"),
        };
        var label = valueSet.GetStringExtension(KnowledgeExtensions.DrugGroupLabel)
            ?? valueSet.GetStringExtension(KnowledgeExtensions.ClinicalClueLabel)
            ?? valueSet.Title
            ?? valueSet.Name
            ?? id;
        return new CodeSet(id, valueSet.Url, valueSet.Version ?? "unversioned", label, codes, prefixes, names, tier);
    }

    /// <summary>RxNorm ingredient displays and ATC substance-level (7-character) displays are drug names; class displays are not.</summary>
    private static bool IsNameBearing(string system, string code)
        => system == CodeSystems.RxNorm || (system == CodeSystems.Atc && code.Trim().Length == 7);

    private static IEnumerable<CodeSystem.ConceptDefinitionComponent> Flatten(IEnumerable<CodeSystem.ConceptDefinitionComponent> concepts)
        => concepts.SelectMany(c => new[] { c }.Concat(Flatten(c.Concept)));

    private static void CheckId(string file, string? id)
    {
        if (string.IsNullOrWhiteSpace(id))
        {
            throw Problem(file, "the resource has no id");
        }

        var expected = id + ".json";
        if (!string.Equals(Path.GetFileName(file), expected, StringComparison.Ordinal))
        {
            throw Problem(file, $"the file name must be '{expected}' (the resource id)");
        }
    }

    private static KnowledgeLoadException Problem(string file, string problem) => new($"{file}: {problem}");
}
