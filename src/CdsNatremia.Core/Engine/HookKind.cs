namespace CdsNatremia.Core.Engine;

/// <summary>The moments the EHR calls the service.</summary>
public enum HookKind
{
    /// <summary>patient-view: a chart was opened.</summary>
    PatientView,
    /// <summary>The organisation-specific hook for a newly arrived laboratory result.</summary>
    ResultArrive,
    /// <summary>order-select: a prescriber selected orders.</summary>
    OrderSelect,
    /// <summary>order-sign: a prescriber is about to sign orders.</summary>
    OrderSign,
}
