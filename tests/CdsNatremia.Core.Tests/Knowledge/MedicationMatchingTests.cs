using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Knowledge;

namespace CdsNatremia.Core.Tests.Knowledge;

public class MedicationMatchingTests
{
    // Codes from the reference sheet: RxNorm hydrochlorothiazide 5487 (verified); ATC C09BA ACE inhibitors and
    // diuretics (verified class).
    private static readonly CodeSet Thiazides = new(
        "drug-thiazide", "https://example.org/vs", "1", "thiazide",
        [new CodeRef(CodeSystems.RxNorm, "5487", "hydrochlorothiazide")],
        [new CodeRef(CodeSystems.Atc, "C09BA")],
        ["hydrochlorothiazide"]);

    private static MedicationFact Med(IReadOnlyList<CodeRef>? product = null, IReadOnlyList<MedicationIngredient>? ingredients = null, string? text = null)
        => new("MedicationStatement", "m1", product ?? [], ingredients ?? [], text, MedicationUse.Active, null, null);

    [Fact]
    public void Match_IngredientOfACombination_NamesTheThiazide()
    {
        var med = Med(ingredients: [new([new CodeRef(CodeSystems.RxNorm, "29046")], "lisinopril"), new([new CodeRef(CodeSystems.RxNorm, "5487")], "hydrochlorothiazide")]);
        var match = MedicationMatching.Match(Thiazides, med)!;
        Assert.Equal("hydrochlorothiazide", match.Ingredient);
        Assert.Equal("RxNorm 5487", match.By);
    }

    [Fact]
    public void Match_AtcClassOfTheProduct()
        => Assert.Equal("ATC C09BA03", MedicationMatching.Match(Thiazides, Med(product: [new CodeRef(CodeSystems.Atc, "C09BA03")], text: "lisinopril and hydrochlorothiazide"))!.By);

    [Fact]
    public void Match_TextOnlyWhenNoCodeMatches()
    {
        var match = MedicationMatching.Match(Thiazides, Med(product: [new CodeRef(CodeSystems.RxNorm, "99999")], text: "Hydrochlorothiazide 12.5 mg"))!;
        Assert.True(match.ByName);
    }

    [Fact]
    public void Match_NoFalseMatchOnASubstring()
        => Assert.Null(MedicationMatching.Match(Thiazides, Med(text: "superhydrochlorothiazidex")));
}
