namespace CdsNatremia.Core.Facts;

/// <summary>What a medication record says about the patient taking the drug.</summary>
public enum MedicationUse
{
    /// <summary>Taking it now (MedicationStatement active, MedicationRequest active or on-hold).</summary>
    Active,
    /// <summary>Will take it (MedicationStatement intended; an order not yet started).</summary>
    Intended,
    /// <summary>A draft order from the hook context (order-select, order-sign): not yet signed.</summary>
    Draft,
}
