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
    /// <summary>
    /// Stopped or completed (MedicationStatement stopped/completed, MedicationRequest stopped/completed). Kept apart in
    /// <see cref="PatientFacts.StoppedMedications"/>; the rules count one only when it stopped within their look-back.
    /// </summary>
    Stopped,
}
