using CdsNatremia.Core.Facts;
using Hl7.Fhir.Model;

namespace CdsNatremia.Fhir.Reading;

/// <summary>A resource as received, with where it came from.</summary>
/// <param name="Resource">The parsed resource.</param>
/// <param name="FullUrl">The Bundle entry's fullUrl, when it had one (for resolving references).</param>
/// <param name="Source">Where it came from, as problems name it: "prefetch 'sodium'", "context 'draftOrders'", …</param>
/// <param name="Origin">Prefetch, context or FHIR server.</param>
public sealed record ParsedResource(Resource Resource, string? FullUrl, string Source, DataOrigin Origin)
{
    /// <summary>What a resource from the hook context is (the hook's definition names its fields); none for prefetch and fetched data.</summary>
    public ContextRole Role { get; init; } = ContextRole.None;
}

/// <summary>The part a hook context field plays (<c>HookDefinition.DraftOrdersField</c>, <c>HookDefinition.ArrivedResultsField</c>).</summary>
public enum ContextRole
{
    /// <summary>Not from the hook context, or from a field with no special part.</summary>
    None,

    /// <summary>A newly arrived result (the result hook's results).</summary>
    ArrivedResult,

    /// <summary>A draft order (order-select, order-sign).</summary>
    DraftOrder,
}
