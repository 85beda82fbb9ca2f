using System.Collections.Concurrent;
using System.Runtime.CompilerServices;
using CdsNatremia.Core.Facts;

namespace CdsNatremia.Core.Knowledge;

/// <summary>
/// Matches a medication against a code set: first by code (product codes and each ingredient's codes: RxNorm, ATC by
/// class prefix, SNOMED CT), and only when no code matches, by whole-word generic name in the product or ingredient
/// text. A multi-ingredient product is matched on each ingredient, so a thiazide inside a combination is found.
/// </summary>
public static class MedicationMatching
{
    /// <summary>
    /// Several rules ask the same question of the same medication in one request (diuretic in use for the urine
    /// studies, the volume clues and the SIADH checklist; drug causes). The answer is a pure function of the two
    /// immutable objects, so it is remembered per medication instance and forgotten with it (weak keys).
    /// </summary>
    private static readonly ConditionalWeakTable<MedicationFact, ConcurrentDictionary<CodeSet, MedicationMatch?>> Remembered = [];

    /// <summary>The match, or null when the medication is not in the set.</summary>
    public static MedicationMatch? Match(CodeSet set, MedicationFact medication)
    {
        Guard.NotNull(set, nameof(set));
        Guard.NotNull(medication, nameof(medication));
        var answers = Remembered.GetValue(medication, static _ => new ConcurrentDictionary<CodeSet, MedicationMatch?>(ReferenceEqualityComparer.Instance));
        return answers.TryGetValue(set, out var known) ? known : answers.GetOrAdd(set, Compute(set, medication));
    }

    private static MedicationMatch? Compute(CodeSet set, MedicationFact medication)
    {
        foreach (var ingredient in medication.Ingredients)
        {
            foreach (var code in ingredient.Codes)
            {
                if (set.Matches(code))
                {
                    return new MedicationMatch(set, IngredientName(set, ingredient.Text, code), Describe(code), ByName: false);
                }
            }
        }

        foreach (var code in medication.ProductCodes)
        {
            if (set.Matches(code))
            {
                var name = set.MatchName(medication.Text) ?? set.MatchName(code.Display) ?? medication.Text ?? code.Display ?? code.Code;
                return new MedicationMatch(set, name, Describe(code), ByName: false);
            }
        }

        foreach (var text in medication.Ingredients.Select(i => i.Text).Append(medication.Text))
        {
            if (set.MatchName(text) is { } name)
            {
                return new MedicationMatch(set, name, "name in text", ByName: true);
            }
        }

        return null;
    }

    /// <summary>Every set (of those given) that the medication matches.</summary>
    public static IEnumerable<MedicationMatch> MatchAll(IEnumerable<CodeSet> sets, MedicationFact medication)
        => Guard.NotNull(sets, nameof(sets)).Select(s => Match(s, medication)).OfType<MedicationMatch>();

    private static string IngredientName(CodeSet set, string? text, CodeRef code)
        => set.MatchName(text) ?? set.MatchName(code.Display) ?? text ?? code.Display ?? code.Code;

    private static string Describe(CodeRef code) => code.System switch
    {
        CodeSystems.RxNorm => "RxNorm " + code.Code,
        CodeSystems.Atc => "ATC " + code.Code,
        CodeSystems.SnomedCt => "SNOMED CT " + code.Code,
        _ => code.System + " " + code.Code,
    };
}
