using CdsNatremia.Core.Engine;
using CdsNatremia.Core.Facts;

namespace CdsNatremia.Core.CorrectionRate;

/// <summary>
/// Which draft orders an order hook speaks about, as the hook's definition says (<see cref="HookDefinition.DraftOrders"/>):
/// on order-select only the selected ones (a selection is a reference such as "MedicationRequest/draft-nacl3", matched to
/// the order's reference, to its bare id, or as the end of an absolute URL); on order-sign all of them. The one rule for
/// every producer that speaks about draft orders. A hook without draft orders has none to consider.
/// </summary>
public static class DraftOrders
{
    /// <summary>The draft orders to consider.</summary>
    public static IReadOnlyList<MedicationFact> Considered(DecisionRequest request)
    {
        Guard.NotNull(request, nameof(request));
        return HookDefinitions.Of(request.Hook).DraftOrders == DraftOrderScope.Selected
            ? request.DraftOrders.Where(o => IsConsidered(request, o)).ToList()
            : request.DraftOrders;
    }

    /// <summary>True when the hook speaks about <paramref name="order"/>: any draft on order-sign, a selected one on order-select.</summary>
    public static bool IsConsidered(DecisionRequest request, MedicationFact order)
    {
        Guard.NotNull(request, nameof(request));
        Guard.NotNull(order, nameof(order));
        return HookDefinitions.Of(request.Hook).DraftOrders != DraftOrderScope.Selected || request.SelectedOrders.Any(s => Names(s, order));
    }

    /// <summary>True when <paramref name="selection"/> names <paramref name="order"/> (relative reference, bare id or absolute URL).</summary>
    private static bool Names(string selection, MedicationFact order)
        => string.Equals(selection, order.Reference, StringComparison.Ordinal)
            || string.Equals(selection, order.ResourceId, StringComparison.Ordinal)
            || selection.EndsWith("/" + order.Reference, StringComparison.Ordinal);
}
