using CdsNatremia.Core.Drugs;
using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Knowledge;
using CdsNatremia.Fhir.Knowledge;
using CdsNatremia.Fhir.Tests.Support;

namespace CdsNatremia.Fhir.Tests.Knowledge;

/// <summary>Matching medications against the project's own drug ValueSets, as loaded at start-up.</summary>
public class DrugSetMatchingTests
{
    private static readonly KnowledgeBase Knowledge = KnowledgeLoader.Load(Profiles.Directory()).Base;
    private static readonly IReadOnlyList<CodeSet> Causes = DrugCauseSets.Causes(Knowledge);

    private static MedicationFact Product(string? text, params CodeRef[] codes)
        => new("MedicationStatement", "m1", codes, [], text, MedicationUse.Active, null, null);

    private static MedicationMatch? Only(MedicationFact medication)
        => Assert.Single(MedicationMatching.MatchAll(Causes, medication).ToList());

    [Theory]
    // Reference sheet codes (verified): RxNorm citalopram 2556, ATC N06AB04 citalopram, SNOMED CT 372596005 citalopram.
    [InlineData(CodeSystems.RxNorm, "2556", "drug-ssri", "RxNorm 2556")]
    [InlineData(CodeSystems.Atc, "N06AB04", "drug-ssri", "ATC N06AB04")]
    [InlineData(CodeSystems.SnomedCt, "372596005", "drug-ssri", "SNOMED CT 372596005")]
    // Reference sheet: SNOMED CT carbamazepine 387222003, ATC N03AF04 eslicarbazepine (verified).
    [InlineData(CodeSystems.SnomedCt, "387222003", "drug-carbamazepine-family", "SNOMED CT 387222003")]
    [InlineData(CodeSystems.Atc, "N03AF04", "drug-carbamazepine-family", "ATC N03AF04")]
    // Reference sheet: ATC class N06AB (SSRIs, verified): an SSRI not listed one by one is caught by the class prefix.
    [InlineData(CodeSystems.Atc, "N06AB99", "drug-ssri", "ATC N06AB99")]
    public void Match_EachCodingSystem(string system, string code, string setId, string by)
    {
        var match = Only(Product(null, new CodeRef(system, code)))!;
        Assert.Equal(setId, match.Set.Id);
        Assert.Equal(by, match.By);
        Assert.False(match.ByName);
    }

    [Theory]
    // Reference sheet (WHO ATC, verified classes): a thiazide inside an ACE-inhibitor (C09BA), ARB (C09DA) or
    // potassium-sparing (C03EA) combination must still be caught.
    [InlineData("C09BA03", "lisinopril and hydrochlorothiazide tablet")]
    [InlineData("C09DA01", "losartan and hydrochlorothiazide tablet")]
    [InlineData("C03EA01", "hydrochlorothiazide and amiloride tablet")]
    public void Match_CombinationProductByAtcClass_NamesTheThiazide(string atc, string text)
    {
        var match = Only(Product(text, new CodeRef(CodeSystems.Atc, atc)))!;
        Assert.Equal("drug-thiazide", match.Set.Id);
        Assert.Equal("hydrochlorothiazide", match.Ingredient);
    }

    [Fact]
    public void Match_CombinationProductByIngredient_EachIngredientTried()
    {
        var medication = new MedicationFact("MedicationRequest", "m2", [], [
            new([], "lisinopril"),
            new([new CodeRef(CodeSystems.RxNorm, "5487")], "hydrochlorothiazide"), // RxNorm 5487 (reference sheet, verified)
        ], "lisinopril 20 mg / hydrochlorothiazide 12.5 mg", MedicationUse.Active, null, null);
        var match = Only(medication)!;
        Assert.Equal("hydrochlorothiazide", match.Ingredient);
        Assert.Equal("RxNorm 5487", match.By);
    }

    [Theory]
    [InlineData("Chlortalidone 25 mg tablets", "drug-thiazide", "chlortalidone")]
    [InlineData("bendrofluazide 2.5 mg", "drug-thiazide", "bendrofluazide")] // an older British generic name (designation)
    [InlineData("CITALOPRAM 10MG TAB", "drug-ssri", "citalopram")]
    [InlineData("escitalopram 10 mg", "drug-ssri", "escitalopram")] // the longer name wins over "citalopram"
    [InlineData("furosemide 40 mg", "drug-loop-diuretic", "furosemide")]
    public void Match_TextOnly_WholeWordCaseInsensitive(string text, string setId, string ingredient)
    {
        var match = Only(Product(text))!;
        Assert.Equal(setId, match.Set.Id);
        Assert.Equal(ingredient, match.Ingredient);
        Assert.True(match.ByName);
    }

    [Theory]
    [InlineData("xindapamide 2.5 mg")]
    [InlineData("indapamides")]
    [InlineData("metolazonepro")]
    public void Match_NameInsideAnotherWord_NoMatch(string text)
        => Assert.Empty(MedicationMatching.MatchAll(Causes, Product(text)));

    [Fact]
    public void Match_SameCodeInAnotherSystem_NoMatch()
        // 5487 is hydrochlorothiazide only in RxNorm; the same digits in SNOMED CT are not it.
        => Assert.Empty(MedicationMatching.MatchAll(Causes, Product(null, new CodeRef(CodeSystems.SnomedCt, "5487"))));

    [Fact]
    public void Causes_ExcludeTheVaptansAndIncludeDesmopressin()
    {
        Assert.DoesNotContain(Causes, s => s.Id == "drug-vaptan");
        Assert.Contains(Causes, s => s.Id == "drug-desmopressin" && s.Tier == EvidenceTier.Secondary);
        Assert.NotNull(Knowledge.Find("drug-vaptan"));
    }
}
