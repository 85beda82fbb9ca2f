namespace CdsNatremia.Core.Workup;

/// <summary>The state of one SIADH essential criterion on the data the service has.</summary>
public enum CriterionStatus
{
    /// <summary>The data show it is met.</summary>
    Met,

    /// <summary>The data show it is not met.</summary>
    NotMet,

    /// <summary>The data needed are missing (looked for, not there), or a bound does not decide it.</summary>
    Unknown,

    /// <summary>
    /// The data needed were received but could not be used (set aside, another patient's): unknown, and the card says
    /// what could not be read. Never to be read as met or not met.
    /// </summary>
    CouldNotBeRead,

    /// <summary>Only the clinician can judge it (clinical euvolaemia).</summary>
    ClinicianToAssess,
}
