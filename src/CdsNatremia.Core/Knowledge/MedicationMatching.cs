using CdsNatremia.Core.Facts;

namespace CdsNatremia.Core.Knowledge;

/// <summary>
/// Matches a medication against a code set: first by code (product codes and each ingredient's codes: RxNorm, ATC by
/// class prefix, SNOMED CT), and only when no code matches, by whole-word generic name in the product or ingredient
/// text. A multi-ingredient product is matched on each ingredient, so a thiazide inside a combination is found.
/// </summary>
public static class MedicationMatching
{
    /// <summary>The match, or null when the medication is not in the set.</summary>
    public static MedicationMatch? Match(CodeSet set, MedicationFact medication)
    {
        Guard.NotNull(set, nameof(set));
        Guard.NotNull(medication, nameof(medication));
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
