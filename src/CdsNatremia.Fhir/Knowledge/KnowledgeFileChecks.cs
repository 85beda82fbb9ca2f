using System.Text.RegularExpressions;
using CdsNatremia.Core.Facts;
using Hl7.Fhir.Model;

namespace CdsNatremia.Fhir.Knowledge;

/// <summary>
/// Checks a knowledge ValueSet beyond what FHIR parsing catches, so that a slip in an operator's edit stops start-up
/// with the file and the problem named instead of quietly weakening a rule: the url ends in the id, status is given,
/// an include has concepts or one filter (never both, never two filters: FHIR would AND them), codes have the shape of
/// their system (a typo such as "N06AB4" is caught), class prefixes are long enough not to catch unrelated drugs, and
/// every code of a drug group has a display (its name, for text matching), a tier, a label and a row in the
/// description's source table.
/// </summary>
internal static partial class KnowledgeFileChecks
{
    /// <summary>Shortest ATC class a filter may name: the 4-character pharmacological subgroup (e.g. "C07B").</summary>
    private const int MinimumAtcPrefix = 4;

    /// <summary>Shortest ICD-10 category a filter may name: the 3-character category (e.g. "I50").</summary>
    private const int MinimumIcdPrefix = 3;

    public static void Check(string file, ValueSet valueSet)
    {
        var id = valueSet.Id!;
        if (valueSet.Url is { } url && !url.EndsWith("/ValueSet/" + id, StringComparison.Ordinal))
        {
            throw Problem(file, $"ValueSet.url '{url}' must end with '/ValueSet/{id}'");
        }

        if (valueSet.Status is null)
        {
            throw Problem(file, "ValueSet.status is required");
        }

        var isDrugGroup = id.StartsWith("drug-", StringComparison.Ordinal);
        if (isDrugGroup)
        {
            if (valueSet.GetExtension(KnowledgeExtensions.DrugGroupTier) is null)
            {
                throw Problem(file, $"a drug group needs the extension {KnowledgeExtensions.DrugGroupTier} (primary or secondary)");
            }

            if (string.IsNullOrWhiteSpace(valueSet.GetStringExtension(KnowledgeExtensions.DrugGroupLabel)))
            {
                throw Problem(file, $"a drug group needs a non-empty {KnowledgeExtensions.DrugGroupLabel} extension (the label cards print)");
            }

            if (string.IsNullOrWhiteSpace(valueSet.Description))
            {
                throw Problem(file, "a drug group needs a description with the source and status of every code");
            }
        }

        foreach (var include in valueSet.Compose?.Include ?? [])
        {
            if (include.Concept.Count > 0 && include.Filter.Count > 0)
            {
                throw Problem(file, $"an include of {include.System} has both concepts and a filter (FHIR R4 does not allow both; give the class its own include)");
            }

            if (include.Filter.Count > 1)
            {
                throw Problem(file, $"an include of {include.System} has {include.Filter.Count} filters; FHIR combines them with AND, so give each class its own include");
            }

            foreach (var concept in include.Concept)
            {
                var code = concept.Code?.Trim() ?? string.Empty;
                if (!HasShape(include.System, code, isPrefix: false))
                {
                    throw Problem(file, $"code '{code}' is not a well-formed {SystemName(include.System)} code");
                }

                if (isDrugGroup && string.IsNullOrWhiteSpace(concept.Display))
                {
                    throw Problem(file, $"code '{code}' of {SystemName(include.System)} has no display (the ingredient name is needed)");
                }

                if (isDrugGroup && !(valueSet.Description ?? string.Empty).Contains("`" + code + "`", StringComparison.Ordinal))
                {
                    throw Problem(file, $"code '{code}' has no row in the description's table of sources (add its source and status)");
                }
            }

            foreach (var filter in include.Filter)
            {
                var value = filter.Value?.Trim() ?? string.Empty;
                if (!HasShape(include.System, value, isPrefix: true))
                {
                    throw Problem(file, $"class '{value}' is not a well-formed {SystemName(include.System)} class, or too short (ATC at least {MinimumAtcPrefix} characters, ICD-10 at least {MinimumIcdPrefix}): it would catch unrelated codes");
                }

                if (isDrugGroup && !(valueSet.Description ?? string.Empty).Contains("`" + value + "`", StringComparison.Ordinal))
                {
                    throw Problem(file, $"class '{value}' has no row in the description's table of sources (add its source and status)");
                }
            }
        }
    }

    private static bool HasShape(string? system, string code, bool isPrefix) => system switch
    {
        CodeSystems.RxNorm => RxNormCode().IsMatch(code),
        CodeSystems.SnomedCt => SnomedCode().IsMatch(code),
        CodeSystems.Atc => isPrefix ? code.Length >= MinimumAtcPrefix && AtcCode().IsMatch(code) : AtcCode().IsMatch(code),
        CodeSystems.Icd10 or CodeSystems.Icd10Cm => code.Replace(".", string.Empty, StringComparison.Ordinal).Length >= (isPrefix ? MinimumIcdPrefix : 3) && IcdCode().IsMatch(code),
        _ => code.Length > 0,
    };

    private static string SystemName(string? system) => system switch
    {
        CodeSystems.RxNorm => "RxNorm",
        CodeSystems.SnomedCt => "SNOMED CT",
        CodeSystems.Atc => "WHO ATC",
        CodeSystems.Icd10 => "ICD-10",
        CodeSystems.Icd10Cm => "ICD-10-CM",
        _ => system ?? "(no system)",
    };

    private static KnowledgeLoadException Problem(string file, string problem) => new($"{file}: {problem}");

    // RxNorm concept ids are digits; SNOMED CT ids are 6 to 18 digits.
    [GeneratedRegex("^[0-9]{1,10}$", RegexOptions.CultureInvariant)]
    private static partial Regex RxNormCode();

    [GeneratedRegex("^[0-9]{6,18}$", RegexOptions.CultureInvariant)]
    private static partial Regex SnomedCode();

    // ATC levels: A, A01, A01A, A01AA, A01AA01 (letter, two digits, letter, letter, two digits).
    [GeneratedRegex("^[A-Z]([0-9]{2}([A-Z]([A-Z]([0-9]{2})?)?)?)?$", RegexOptions.CultureInvariant)]
    private static partial Regex AtcCode();

    // ICD-10 and ICD-10-CM: a letter, two characters, then optionally a dot and up to four more.
    [GeneratedRegex("^[A-Z][0-9][0-9A-Z](\\.[0-9A-Z]{1,4})?$", RegexOptions.CultureInvariant)]
    private static partial Regex IcdCode();
}
