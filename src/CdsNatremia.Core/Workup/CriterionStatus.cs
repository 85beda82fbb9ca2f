namespace CdsNatremia.Core.Workup;

/// <summary>The state of one SIADH essential criterion on the data the service has.</summary>
public enum CriterionStatus
{
    /// <summary>The data show it is met.</summary>
    Met,

    /// <summary>The data show it is not met.</summary>
    NotMet,

    /// <summary>The data needed are missing.</summary>
    Unknown,

    /// <summary>Only the clinician can judge it (clinical euvolaemia).</summary>
    ClinicianToAssess,
}
