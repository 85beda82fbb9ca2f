using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Knowledge;

namespace CdsNatremia.Core.Tests.Support;

/// <summary>Drug test data: small code sets with codes from the reference sheet, and medication records.</summary>
internal static class SomeDrugs
{
    // Reference sheet (/work/shared/guides/clinical-reference.md), medication codes: RxNorm hydrochlorothiazide 5487,
    // citalopram 2556, carbamazepine 2002 (verified); ATC C03AA thiazides, C09BA ACE inhibitors and diuretics, N06AB
    // SSRIs (verified); SNOMED CT citalopram 372596005 (verified).
    public static readonly CodeSet Thiazide = new(
        "drug-thiazide", "https://example.org/ValueSet/drug-thiazide", "1", "thiazide or thiazide-like diuretic",
        [new CodeRef(CodeSystems.RxNorm, "5487", "hydrochlorothiazide")],
        [new CodeRef(CodeSystems.Atc, "C03AA"), new CodeRef(CodeSystems.Atc, "C09BA")],
        ["hydrochlorothiazide"],
        EvidenceTier.Primary);

    public static readonly CodeSet Ssri = new(
        "drug-ssri", "https://example.org/ValueSet/drug-ssri", "1", "selective serotonin reuptake inhibitor (SSRI)",
        [new CodeRef(CodeSystems.RxNorm, "2556", "citalopram"), new CodeRef(CodeSystems.SnomedCt, "372596005", "citalopram")],
        [new CodeRef(CodeSystems.Atc, "N06AB")],
        ["citalopram", "sertraline"],
        EvidenceTier.Primary);

    // Loop diuretics are "other known contributors" (secondary tier); furosemide by name only (no code needed here).
    public static readonly CodeSet Loop = new(
        "drug-loop-diuretic", "https://example.org/ValueSet/drug-loop-diuretic", "1", "loop diuretic",
        [], [new CodeRef(CodeSystems.Atc, "C03CA")], ["furosemide"], EvidenceTier.Secondary);

    // Vaptans raise sodium: labelled like a drug group but never a cause. ATC C03XA (from memory).
    public static readonly CodeSet Vaptan = new(
        "drug-vaptan", "https://example.org/ValueSet/drug-vaptan", "1", "vaptan",
        [], [new CodeRef(CodeSystems.Atc, "C03XA")], ["tolvaptan"], EvidenceTier.Secondary);

    public static readonly CodeRef OverrideReason = new("https://example.org/CodeSystem/override-reason", "benefit-outweighs-risk", "Benefit outweighs the risk");

    public static KnowledgeBase Knowledge { get; } = new(
        [Thiazide, Ssri, Loop, Vaptan],
        "test",
        new Dictionary<string, IReadOnlyList<CodeRef>>(StringComparer.Ordinal) { ["override-reason"] = [OverrideReason] });

    public static MedicationFact Statement(string id, string text, DateTimeOffset? started, params CodeRef[] codes)
        => new("MedicationStatement", id, codes, [], text, MedicationUse.Active, started, started is null ? null : "effectivePeriod.start");

    public static MedicationFact Draft(string id, string text, params CodeRef[] codes)
        => new("MedicationRequest", id, codes, [], text, MedicationUse.Draft, Some.Now.AddMinutes(-5), "authoredOn");

    public static CodeRef RxNorm(string code) => new(CodeSystems.RxNorm, code);

    public static CodeRef Atc(string code) => new(CodeSystems.Atc, code);
}
