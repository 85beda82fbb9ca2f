namespace CdsNatremia.Core.CorrectionRate;

/// <summary>The intravenous sodium-containing fluids the service predicts the effect of.</summary>
public enum InfusateKind
{
    /// <summary>Sodium chloride 0.9% (9 mg/mL).</summary>
    Saline09,
    /// <summary>Sodium chloride 3% (30 mg/mL), hypertonic.</summary>
    Saline3,
    /// <summary>Sodium chloride 0.45% (4.5 mg/mL), hypotonic.</summary>
    Saline045,
    /// <summary>Ringer's lactate (compound sodium lactate).</summary>
    RingersLactate,
}
