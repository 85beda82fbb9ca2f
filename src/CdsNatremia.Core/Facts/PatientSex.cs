namespace CdsNatremia.Core.Facts;

/// <summary>Administrative sex as FHIR Patient.gender gives it; used only for total-body-water fractions.</summary>
public enum PatientSex
{
    /// <summary>Not sent or not known.</summary>
    Unknown,
    /// <summary>female</summary>
    Female,
    /// <summary>male</summary>
    Male,
    /// <summary>other</summary>
    Other,
}
