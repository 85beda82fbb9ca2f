using System.Collections.Frozen;
using CdsNatremia.Core.Facts;

namespace CdsNatremia.Core.Knowledge;

/// <summary>
/// The code sets the rules use, by ValueSet id. Loaded once at start-up and shared read-only by every request.
/// </summary>
public sealed class KnowledgeBase
{
    private readonly CodeSet[] _inOrder;
    private readonly CodeSet[] _byId;
    private readonly FrozenDictionary<string, CodeSet> _sets;

    /// <summary>Creates a knowledge base from code sets; ids must be unique.</summary>
    /// <param name="sets">The code sets (from ValueSets).</param>
    /// <param name="version">A version covering every file loaded.</param>
    /// <param name="codeSystems">Our own code systems by id (e.g. "override-reason"), each as its codes with displays.</param>
    public KnowledgeBase(IEnumerable<CodeSet> sets, string version, IReadOnlyDictionary<string, IReadOnlyList<CodeRef>>? codeSystems = null)
    {
        CodeSystems = codeSystems ?? new Dictionary<string, IReadOnlyList<CodeRef>>(StringComparer.Ordinal);
        var unique = new Dictionary<string, CodeSet>(StringComparer.Ordinal);
        foreach (var set in Guard.NotNull(sets, nameof(sets)))
        {
            if (!unique.TryAdd(set.Id, set))
            {
                throw new ArgumentException($"Two code sets share the id '{set.Id}'.", nameof(sets));
            }
        }

        // Read by every request: a frozen look-up by id, the sets in load order, and once sorted by id for prefix queries.
        _inOrder = [.. unique.Values];
        _byId = [.. _inOrder.OrderBy(s => s.Id, StringComparer.Ordinal)];
        _sets = unique.ToFrozenDictionary(StringComparer.Ordinal);

        Version = Guard.NotNull(version, nameof(version));
    }

    /// <summary>An empty knowledge base, for tests of rules that need none.</summary>
    public static KnowledgeBase Empty { get; } = new([], "empty");

    /// <summary>A version string covering every loaded set (for audit: which knowledge produced a card).</summary>
    public string Version { get; }

    /// <summary>Our own code systems by id, e.g. "override-reason" (codes with display).</summary>
    public IReadOnlyDictionary<string, IReadOnlyList<CodeRef>> CodeSystems { get; }

    /// <summary>All sets.</summary>
    public IReadOnlyCollection<CodeSet> Sets => _inOrder;

    /// <summary>The set with this id, or null.</summary>
    public CodeSet? Find(string id) => _sets.GetValueOrDefault(id);

    /// <summary>Sets whose id starts with a prefix, e.g. "drug-" or "condition-".</summary>
    public IEnumerable<CodeSet> WithIdPrefix(string prefix)
        => _byId.Where(s => s.Id.StartsWith(prefix, StringComparison.Ordinal));
}
