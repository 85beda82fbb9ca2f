using CdsNatremia.Core.Cards;
using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Knowledge;

namespace CdsNatremia.Core.Tests.Cards;

/// <summary>Card topics are read from the loaded card-topic CodeSystem, never declared again in code.</summary>
public class CardTopicsTests
{
    private const string System = "https://example.org/CodeSystem/card-topic";

    private static readonly KnowledgeBase Knowledge = new(
        [],
        "test",
        new Dictionary<string, IReadOnlyList<CodeRef>>(StringComparer.Ordinal)
        {
            [CardTopics.SystemId] = [new CodeRef(System, "sodium-assessment", "Shown display A"), new CodeRef(System, "correction-rate", "Shown display B")],
        });

    [Fact]
    public void Find_LoadedTopic_SystemCodeAndDisplayFromTheCodeSystem()
        => Assert.Equal(new CodeRef(System, "correction-rate", "Shown display B"), CardTopics.Find("correction-rate", Knowledge));

    [Fact]
    public void Find_TopicTheCodeSystemDoesNotHold_Null()
        => Assert.Null(CardTopics.Find("infusion-prediction", Knowledge));

    [Fact]
    public void All_NoCardTopicCodeSystemLoaded_Empty()
        => Assert.Empty(CardTopics.All(KnowledgeBase.Empty));

    [Fact]
    public void All_Loaded_EveryTopicInFileOrder()
        => Assert.Equal(["sodium-assessment", "correction-rate"], CardTopics.All(Knowledge).Select(t => t.Code));
}
