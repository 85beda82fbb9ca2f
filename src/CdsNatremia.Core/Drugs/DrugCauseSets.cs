using CdsNatremia.Core.Knowledge;

namespace CdsNatremia.Core.Drugs;

/// <summary>
/// Which loaded code sets are drug causes of low sodium: every "drug-" set with an evidence tier, except the vaptans.
/// Vaptans carry the drug-group extensions only so order checks can label them; they raise sodium and must never be
/// named as a cause.
/// </summary>
public static class DrugCauseSets
{
    /// <summary>The vasopressin-receptor antagonists' set id: labelled like a drug group, but never a cause.</summary>
    public const string Vaptans = "drug-vaptan";

    /// <summary>The cause sets, in id order.</summary>
    public static IReadOnlyList<CodeSet> Causes(KnowledgeBase knowledge)
        => Guard.NotNull(knowledge, nameof(knowledge))
            .WithIdPrefix("drug-")
            .Where(s => s.Tier is not null && !string.Equals(s.Id, Vaptans, StringComparison.Ordinal))
            .ToList();
}
