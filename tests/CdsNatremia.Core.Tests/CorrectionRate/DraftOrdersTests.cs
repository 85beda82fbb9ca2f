using CdsNatremia.Core.CorrectionRate;
using CdsNatremia.Core.Engine;
using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Tests.Support;

namespace CdsNatremia.Core.Tests.CorrectionRate;

/// <summary>
/// The one rule for which draft orders a hook speaks about (<see cref="DraftOrders"/>), and that no other core class
/// decides it. Selections are "[ResourceType]/[id]" references (CDS Hooks 2.0 order-select); a bare id is accepted too.
/// </summary>
public class DraftOrdersTests
{
    private static readonly MedicationFact First = SomeDrugs.Draft("draft-first", "first draft", SomeDrugs.RxNorm("2556"));
    private static readonly MedicationFact Second = SomeDrugs.Draft("draft-second", "second draft", SomeDrugs.RxNorm("2556"));

    private static DecisionRequest Request(HookKind hook, params string[] selections) => Some.Request(Some.Facts(Some.Sodium(129)), hook) with
    {
        DraftOrders = [First, Second],
        SelectedOrders = selections,
    };

    [Theory]
    [InlineData("draft-first")]                                          // bare id
    [InlineData("MedicationRequest/draft-first")]                        // ResourceType/id
    [InlineData("https://ehr.example.org/fhir/MedicationRequest/draft-first")] // absolute URL
    public void Considered_OrderSelectWithOneSelection_OnlyThatOrder(string selection)
    {
        var request = Request(HookKind.OrderSelect, selection);
        Assert.Equal([First], DraftOrders.Considered(request));
        Assert.True(DraftOrders.IsConsidered(request, First));
        Assert.False(DraftOrders.IsConsidered(request, Second));
    }

    [Fact]
    public void Considered_OrderSelectBothFormsMixed_BothOrders()
    {
        var request = Request(HookKind.OrderSelect, "draft-first", "MedicationRequest/draft-second");
        Assert.Equal([First, Second], DraftOrders.Considered(request));
    }

    [Theory]
    [InlineData("MedicationStatement/draft-first")] // same id, another resource type
    [InlineData("draft-firs")]                      // a prefix of the id
    [InlineData("MedicationRequest/draft-first-2")] // an id that only starts like it
    public void IsConsidered_OrderSelectSelectionNamingSomethingElse_False(string selection)
        => Assert.False(DraftOrders.IsConsidered(Request(HookKind.OrderSelect, selection), First));

    [Fact]
    public void Considered_OrderSignWithoutSelections_EveryDraft()
    {
        var request = Request(HookKind.OrderSign);
        Assert.Equal([First, Second], DraftOrders.Considered(request));
        Assert.True(DraftOrders.IsConsidered(request, Second));
    }

    [Fact]
    public void CoreSource_OnlyDraftOrdersReadsTheSelections()
    {
        var root = SourceRoot();
        var readers = Directory.EnumerateFiles(root, "*.cs", SearchOption.AllDirectories)
            .Where(f => !f.Contains($"{Path.DirectorySeparatorChar}obj{Path.DirectorySeparatorChar}", StringComparison.Ordinal))
            .Where(f => File.ReadAllText(f).Contains(".SelectedOrders", StringComparison.Ordinal))
            .Select(Path.GetFileName)
            .ToList();
        Assert.Equal(["DraftOrders.cs"], readers);
    }

    private static string SourceRoot()
    {
        for (var dir = new DirectoryInfo(AppContext.BaseDirectory); dir is not null; dir = dir.Parent)
        {
            var candidate = Path.Combine(dir.FullName, "src", "CdsNatremia.Core");
            if (Directory.Exists(candidate))
            {
                return candidate;
            }
        }

        throw new DirectoryNotFoundException("src/CdsNatremia.Core not found above the test binaries.");
    }
}
