using CdsNatremia.Core.Engine;
using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Knowledge;

namespace CdsNatremia.Core.Tests.Support;

/// <summary>Test data factory: invented patients and results with sensible defaults.</summary>
internal static class Some
{
    /// <summary>The fixed "now" of core tests.</summary>
    public static readonly DateTimeOffset Now = new(2026, 3, 10, 12, 0, 0, TimeSpan.Zero);

    public const string PatientId = "pt-test";

    private static int _next;

    public static LabResult Sodium(double value, double hoursAgo = 2, bool preliminary = false, SpecimenKind specimen = SpecimenKind.SerumOrPlasma, string? id = null)
        => Lab(Analyte.Sodium, value, hoursAgo, preliminary, specimen, id);

    public static LabResult Lab(Analyte analyte, double value, double hoursAgo = 2, bool preliminary = false, SpecimenKind specimen = SpecimenKind.SerumOrPlasma, string? id = null)
        => new(id ?? $"obs-{Interlocked.Increment(ref _next)}", analyte, value, Now.AddHours(-hoursAgo), preliminary, specimen, "2951-2");

    public static PatientFacts Facts(params LabResult[] labs) => new() { PatientId = PatientId, Labs = labs };

    public static DecisionRequest Request(PatientFacts facts, HookKind hook = HookKind.PatientView)
        => new() { Hook = hook, Facts = facts, Now = Now };

    public static DecisionEngine Engine(RuleOptions? options = null, KnowledgeBase? knowledge = null)
        => new(CardProducers.Default(), options ?? new RuleOptions(), knowledge ?? KnowledgeBase.Empty);
}
