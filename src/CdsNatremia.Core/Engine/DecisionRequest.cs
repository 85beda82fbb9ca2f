using CdsNatremia.Core.Facts;

namespace CdsNatremia.Core.Engine;

/// <summary>What the engine decides on: the hook, the patient's facts, the time, and the hook's own context.</summary>
public sealed record DecisionRequest
{
    /// <summary>The hook that fired.</summary>
    public required HookKind Hook { get; init; }

    /// <summary>The patient's facts.</summary>
    public required PatientFacts Facts { get; init; }

    /// <summary>The assessment time (from the host's TimeProvider).</summary>
    public required DateTimeOffset Now { get; init; }

    /// <summary>Draft orders from the hook context (order-select, order-sign).</summary>
    public IReadOnlyList<MedicationFact> DraftOrders { get; init; } = [];

    /// <summary>For order-select: references of the selected draft orders (e.g. "MedicationRequest/draft-1").</summary>
    public IReadOnlyList<string> SelectedOrders { get; init; } = [];

    /// <summary>For the result hook: ids of the newly arrived Observations.</summary>
    public IReadOnlyList<string> NewResultIds { get; init; } = [];
}
