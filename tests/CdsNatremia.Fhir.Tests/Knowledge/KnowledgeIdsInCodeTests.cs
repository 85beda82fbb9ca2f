using System.Text.RegularExpressions;
using CdsNatremia.Core.Cards;
using CdsNatremia.Fhir.Knowledge;
using CdsNatremia.Fhir.Tests.Support;

namespace CdsNatremia.Fhir.Tests.Knowledge;

/// <summary>
/// The core names knowledge by id (a ValueSet such as "condition-cirrhosis", a card topic such as "correction-rate");
/// every id it names must be one the project's profiles/ define, so a renamed or removed file cannot silently turn a
/// rule off and a card cannot carry a topic the card-topic CodeSystem does not define.
/// </summary>
public partial class KnowledgeIdsInCodeTests
{
    private static readonly LoadedKnowledge Loaded = KnowledgeLoader.Load(Profiles.Directory());

    [Fact]
    public void CoreSource_EveryValueSetIdItNames_IsLoaded()
    {
        // Card topics share the naming scheme ("drug-order-warning"); the next test checks them against their CodeSystem.
        var topics = CardTopics.All(Loaded.Base).Select(t => t.Code).ToHashSet(StringComparer.Ordinal);
        var named = Literals(ValueSetId()).Where(id => !topics.Contains(id)).ToList();
        Assert.NotEmpty(named);
        var missing = named.Where(id => Loaded.Base.Find(id) is null).ToList();
        Assert.Empty(missing);
    }

    [Fact]
    public void CoreSource_EveryCardTopicItSets_IsInTheCardTopicCodeSystem()
    {
        var topics = CardTopics.All(Loaded.Base).Select(t => t.Code).ToHashSet(StringComparer.Ordinal);
        var named = Literals(TopicAssignment()).ToList();
        Assert.NotEmpty(named);
        Assert.All(named, topic => Assert.Contains(topic, topics));
    }

    private static IEnumerable<string> Literals(Regex pattern)
        => Directory.EnumerateFiles(CoreSource(), "*.cs", SearchOption.AllDirectories)
            .Where(f => !f.Contains($"{Path.DirectorySeparatorChar}obj{Path.DirectorySeparatorChar}", StringComparison.Ordinal))
            .SelectMany(f => pattern.Matches(File.ReadAllText(f)).Select(m => m.Groups["id"].Value))
            .Distinct(StringComparer.Ordinal);

    private static string CoreSource()
        => Path.Combine(Directory.GetParent(Profiles.Directory())!.FullName, "src", "CdsNatremia.Core");

    /// <summary>A string literal that is a whole ValueSet id of our naming scheme (not a bare prefix such as "drug-").</summary>
    [GeneratedRegex("\"(?<id>(?:drug|condition|fluid)-[a-z0-9]+(?:-[a-z0-9]+)*)\"")]
    private static partial Regex ValueSetId();

    /// <summary>A card's topic as the core sets it: <c>Topic = "…"</c> or <c>const string Topic = "…"</c>.</summary>
    [GeneratedRegex("Topic = \"(?<id>[a-z0-9-]+)\"")]
    private static partial Regex TopicAssignment();
}
