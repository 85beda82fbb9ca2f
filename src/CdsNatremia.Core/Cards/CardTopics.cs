using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Knowledge;

namespace CdsNatremia.Core.Cards;

/// <summary>
/// Card topics as data: the codes and displays of our card-topic CodeSystem (profiles/codesystems/card-topic.json) as
/// loaded. A producer names its card's topic by code; everything shown about a topic (its system, its display) and the
/// set of topics there are (e.g. telemetry's bounded label) is read from the loaded CodeSystem, never declared again.
/// </summary>
public static class CardTopics
{
    /// <summary>Our card-topic code system's id in the knowledge base.</summary>
    public const string SystemId = "card-topic";

    /// <summary>Every topic, as loaded (empty when the CodeSystem is not loaded).</summary>
    public static IReadOnlyList<CodeRef> All(KnowledgeBase knowledge)
        => Guard.NotNull(knowledge, nameof(knowledge)).CodeSystems.GetValueOrDefault(SystemId) ?? [];

    /// <summary>The topic with this code (system, code, display), or null when the loaded CodeSystem does not hold it.</summary>
    public static CodeRef? Find(string topic, KnowledgeBase knowledge)
    {
        Guard.NotNull(topic, nameof(topic));
        return All(knowledge).FirstOrDefault(c => string.Equals(c.Code, topic, StringComparison.Ordinal)) is { Code: not null } found ? found : null;
    }
}
