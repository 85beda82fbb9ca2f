using CdsNatremia.Core.Cards;
using CdsNatremia.Core.Engine;
using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Knowledge;

namespace CdsNatremia.Core.Tests.Support;

/// <summary>
/// Knowledge and invented patients for the clinical-safety rules of issue 13 (high risk, child, desalination, Furst,
/// vaptan and desmopressin, low cortisol, hypertonic, heart failure). Codes: ATC C03CA loop diuretics, C03XA vaptans,
/// H01BA desmopressin class (project ValueSets; C03XA from memory, H01BA verified there); ICD-10 I50 heart failure,
/// K74 fibrosis and cirrhosis of liver (from memory).
/// </summary>
internal static class SomeClinical
{
    public static readonly CodeSet Desmopressin = new(
        "drug-desmopressin", "https://example.org/ValueSet/drug-desmopressin", "1", "desmopressin or vasopressin analogue",
        [], [new CodeRef(CodeSystems.Atc, "H01BA")], ["desmopressin"], EvidenceTier.Secondary);

    public static readonly CodeSet HeartFailure = new(
        "condition-heart-failure", "https://example.org/ValueSet/condition-heart-failure", "1", "heart failure",
        [], [new CodeRef(CodeSystems.Icd10, "I50")], []);

    public static readonly CodeSet Cirrhosis = new(
        "condition-cirrhosis", "https://example.org/ValueSet/condition-cirrhosis", "1", "cirrhosis",
        [], [new CodeRef(CodeSystems.Icd10, "K74")], []);

    public static KnowledgeBase Knowledge { get; } = new(
        [SomeDrugs.Thiazide, SomeDrugs.Ssri, SomeDrugs.Loop, SomeDrugs.Vaptan, Desmopressin, HeartFailure, Cirrhosis],
        "test",
        new Dictionary<string, IReadOnlyList<CodeRef>>(StringComparer.Ordinal) { ["override-reason"] = [SomeDrugs.OverrideReason] });

    public static ConditionFact Condition(string id, string icd10, string text) => new(id, [new CodeRef(CodeSystems.Icd10, icd10)], text, null);

    public static MedicationFact Draft(string id, string text, double? millilitres = null, string? route = null, params CodeRef[] codes)
        => new("MedicationRequest", id, codes, [], text, MedicationUse.Draft, Some.Now.AddMinutes(-5), "authoredOn") { VolumeMilliliters = millilitres, Route = route };

    public static PatientFacts Woman(int ageYears, params LabResult[] labs)
        => Some.Facts(labs) with { Sex = PatientSex.Female, BirthDate = DateOnly.FromDateTime(Some.Now.UtcDateTime).AddYears(-ageYears).AddDays(-10) };

    public static IReadOnlyList<Card> Decide(PatientFacts facts, HookKind hook = HookKind.PatientView, IReadOnlyList<MedicationFact>? drafts = null, RuleOptions? options = null)
        => Some.Engine(options, Knowledge).Decide(Some.Request(facts, hook) with { DraftOrders = drafts ?? [] });

    public static Card Assessment(PatientFacts facts, RuleOptions? options = null)
        => Assert.Single(Decide(facts, options: options), c => c.Topic == "sodium-assessment");
}
