using CdsNatremia.Core.Engine;
using CdsNatremia.Core.Facts;

namespace CdsNatremia.Core.CorrectionRate;

/// <summary>
/// Which draft orders an order hook speaks about: on order-select only the selected ones (a selection is a reference
/// such as "MedicationRequest/draft-nacl3", matched to the order's reference, to its id, or as the end of an absolute
/// URL); on order-sign all of them.
/// </summary>
public static class DraftOrders
{
    /// <summary>The draft orders to consider.</summary>
    public static IReadOnlyList<MedicationFact> Considered(DecisionRequest request)
    {
        Guard.NotNull(request, nameof(request));
        if (request.Hook != HookKind.OrderSelect)
        {
            return request.DraftOrders;
        }

        return request.DraftOrders.Where(o => request.SelectedOrders.Any(s => IsSelected(s, o))).ToList();
    }

    private static bool IsSelected(string selection, MedicationFact order)
        => string.Equals(selection, order.Reference, StringComparison.Ordinal)
            || string.Equals(selection, order.ResourceId, StringComparison.Ordinal)
            || selection.EndsWith("/" + order.Reference, StringComparison.Ordinal);
}
