using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Knowledge;

namespace CdsNatremia.Core.Tests.Knowledge;

public class CodeSetTests
{
    private static readonly CodeSet Thiazides = new(
        "drug-thiazide", "https://example.org/vs", "1", "thiazide",
        [new CodeRef(CodeSystems.RxNorm, "5487")],
        [new CodeRef(CodeSystems.Atc, "C03AA"), new CodeRef(CodeSystems.Icd10, "I50")],
        ["hydrochlorothiazide", "indapamide"]);

    [Theory]
    [InlineData(CodeSystems.RxNorm, "5487", true)] // RxNorm hydrochlorothiazide 5487 (reference sheet, verified)
    [InlineData(CodeSystems.RxNorm, "54870", false)]
    [InlineData(CodeSystems.Atc, "C03AA03", true)] // ATC C03AA03 under class C03AA (WHO ATC, verified)
    [InlineData(CodeSystems.Atc, "C03CA01", false)]
    [InlineData(CodeSystems.Icd10, "I50.9", true)] // dotted ICD-10 under the I50 category
    [InlineData(CodeSystems.SnomedCt, "5487", false)] // right code, wrong system
    public void Matches_ByCodeAndClassPrefix(string system, string code, bool expected)
        => Assert.Equal(expected, Thiazides.Matches(new CodeRef(system, code)));

    [Theory]
    [InlineData("Hydrochlorothiazide 25 mg tablet", "hydrochlorothiazide")]
    [InlineData("lisinopril/HYDROCHLOROTHIAZIDE", "hydrochlorothiazide")]
    [InlineData("xindapamidex", null)] // no substring matches
    [InlineData("chlorothiazide", null)]
    [InlineData(null, null)]
    public void MatchName_WholeWordsOnly(string? text, string? expected)
        => Assert.Equal(expected, Thiazides.MatchName(text));
}
