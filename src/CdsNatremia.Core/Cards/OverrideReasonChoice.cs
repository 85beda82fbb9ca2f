using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Knowledge;

namespace CdsNatremia.Core.Cards;

/// <summary>
/// The override reasons each card kind offers, chosen from our override-reason CodeSystem
/// (profiles/codesystems/override-reason.json), so an override of any card can say why. Applied once to every card by
/// the engine. A code the loaded CodeSystem does not hold is left out (never invented here); displays come from the file.
/// </summary>
public static class OverrideReasonChoice
{
    /// <summary>Our override-reason code system's id in the knowledge base.</summary>
    public const string SystemId = "override-reason";

    /// <summary>Codes per card topic, in the order offered.</summary>
    public static IReadOnlyDictionary<string, IReadOnlyList<string>> ByTopic { get; } = new Dictionary<string, IReadOnlyList<string>>(StringComparer.Ordinal)
    {
        ["drug-order-warning"] =
            ["benefit-outweighs-risk", "sodium-being-monitored", "long-standing-stable-use", "no-suitable-alternative", "cause-already-addressed", "not-relevant-to-patient", "medication-not-current"],
        ["sodium-assessment"] = ["already-reviewed", "cause-already-addressed", "sodium-being-monitored", "not-relevant-to-patient"],
        ["correction-rate"] = ["managed-under-plan", "sodium-being-monitored", "already-reviewed", "not-relevant-to-patient"],
        ["infusion-prediction"] = ["managed-under-plan", "sodium-being-monitored", "benefit-outweighs-risk", "not-relevant-to-patient"],
        ["rate-caution-order"] = ["managed-under-plan", "benefit-outweighs-risk", "sodium-being-monitored", "no-suitable-alternative", "not-relevant-to-patient"],
    };

    /// <summary>For a card kind not listed in <see cref="ByTopic"/>.</summary>
    public static IReadOnlyList<string> Default { get; } = ["already-reviewed", "not-relevant-to-patient"];

    /// <summary>The reasons for a card of <paramref name="topic"/>, as codes with displays from the loaded CodeSystem.</summary>
    public static IReadOnlyList<CodeRef> For(string topic, KnowledgeBase knowledge)
    {
        Guard.NotNull(topic, nameof(topic));
        Guard.NotNull(knowledge, nameof(knowledge));
        if (!knowledge.CodeSystems.TryGetValue(SystemId, out var loaded))
        {
            return [];
        }

        var wanted = ByTopic.GetValueOrDefault(topic) ?? Default;
        return wanted
            .Select(code => loaded.FirstOrDefault(c => string.Equals(c.Code, code, StringComparison.Ordinal)))
            .Where(c => c.Code is not null)
            .ToList();
    }
}
