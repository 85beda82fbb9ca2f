using CdsNatremia.Core.Cards;
using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Knowledge;
using CdsNatremia.Core.Tests.Support;

namespace CdsNatremia.Core.Tests.Cards;

/// <summary>Override reasons on every card kind, from our override-reason CodeSystem.</summary>
public class OverrideReasonChoiceTests
{
    private const string System = "https://example.org/CodeSystem/override-reason";

    private static KnowledgeBase Knowledge(params string[] codes) => new(
        [],
        "test",
        new Dictionary<string, IReadOnlyList<CodeRef>>(StringComparer.Ordinal) { ["override-reason"] = codes.Select(c => new CodeRef(System, c, c + " display")).ToList() });

    [Fact]
    public void For_SodiumAssessment_CodesOfItsKindWithDisplaysFromTheCodeSystem()
    {
        var reasons = OverrideReasonChoice.For("sodium-assessment", Knowledge("already-reviewed", "benefit-outweighs-risk", "not-relevant-to-patient"));
        Assert.Equal(["already-reviewed", "not-relevant-to-patient"], reasons.Select(r => r.Code)); // the drug-only code is not offered
        Assert.All(reasons, r => Assert.Equal(r.Code + " display", r.Display));
    }

    [Fact]
    public void For_CodeMissingFromTheLoadedCodeSystem_LeftOutNotInvented()
        => Assert.Empty(OverrideReasonChoice.For("correction-rate", Knowledge("medication-not-current")));

    [Fact]
    public void For_NoOverrideReasonCodeSystem_Empty()
        => Assert.Empty(OverrideReasonChoice.For("sodium-assessment", new KnowledgeBase([], "test")));

    [Fact]
    public void Decide_WorkupCard_CarriesOverrideReasons()
    {
        var engine = Some.Engine(knowledge: Knowledge("already-reviewed", "sodium-being-monitored"));
        var card = engine.Decide(Some.Request(Some.Facts(Some.Sodium(124)))).Single(c => c.Topic == "sodium-assessment");
        Assert.Equal(["already-reviewed", "sodium-being-monitored"], card.OverrideReasons.Select(r => r.Code));
    }
}
