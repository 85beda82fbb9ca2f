using CdsNatremia.Core.Engine;
using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Knowledge;
using CdsNatremia.Core.Tests.Support;

namespace CdsNatremia.Core.Tests.Workup;

/// <summary>Knowledge and facts for the work-up tests (invented patients).</summary>
internal static class WorkupTestData
{
    /// <summary>A small knowledge base: thiazides (RxNorm 5487 hydrochlorothiazide, reference sheet) and heart failure (ICD-10 I50).</summary>
    public static KnowledgeBase Knowledge { get; } = new(
    [
        new CodeSet("drug-thiazide", "urn:test:drug-thiazide", "1", "thiazide or thiazide-like diuretic",
            [new CodeRef(CodeSystems.RxNorm, "5487")], [], ["hydrochlorothiazide"]),
        new CodeSet("condition-heart-failure", "urn:test:condition-heart-failure", "1", "heart failure",
            [], [new CodeRef(CodeSystems.Icd10, "I50")], []),
        new CodeSet("condition-vomiting", "urn:test:condition-vomiting", "1", "vomiting or nausea",
            [], [new CodeRef(CodeSystems.Icd10, "R11")], []),
    ], "test");

    public static LabResult Lab(Analyte analyte, double value, double hoursAgo = 2, string? id = null, double? referenceLow = null, double? referenceHigh = null)
        => Some.Lab(analyte, value, hoursAgo, id: id) with { ReferenceLow = referenceLow, ReferenceHigh = referenceHigh };

    public static MedicationFact Hydrochlorothiazide(DateTimeOffset? startedAt)
        => new("MedicationStatement", "hctz", [new CodeRef(CodeSystems.RxNorm, "5487", "hydrochlorothiazide")], [], "hydrochlorothiazide 25 mg",
            MedicationUse.Active, startedAt, "effectivePeriod.start");

    public static ConditionFact HeartFailure() => new("hf", [new CodeRef(CodeSystems.Icd10, "I50.9")], "Heart failure", null);

    /// <summary>Runs the default engine and returns the single assessment card.</summary>
    public static CdsNatremia.Core.Cards.Card Card(PatientFacts facts, RuleOptions? options = null)
        => Assert.Single(Some.Engine(options, Knowledge).Decide(Some.Request(facts)));

    /// <summary>A complete hypotonic work-up: sodium 126, measured osmolality 262, glucose 5.4, urea 3.6 (all 2 h ago).</summary>
    public static List<LabResult> Hypotonic(double sodium = 126, double hoursAgo = 2) =>
    [
        Some.Sodium(sodium, hoursAgo),
        Some.Lab(Analyte.SerumOsmolality, 262, hoursAgo),
        Some.Lab(Analyte.Glucose, 5.4, hoursAgo),
        Some.Lab(Analyte.Urea, 3.6, hoursAgo),
    ];
}
