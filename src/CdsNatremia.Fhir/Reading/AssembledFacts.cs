using CdsNatremia.Core.Facts;

namespace CdsNatremia.Fhir.Reading;

/// <summary>The facts read from a hook request, plus the draft orders from its context.</summary>
/// <param name="Facts">The patient's facts.</param>
/// <param name="DraftOrders">Draft medication orders (order-select, order-sign).</param>
public sealed record AssembledFacts(PatientFacts Facts, IReadOnlyList<MedicationFact> DraftOrders);
