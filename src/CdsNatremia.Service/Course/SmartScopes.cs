namespace CdsNatremia.Service.Course;

/// <summary>The scopes the view asks for: patient-level reads of what it shows, the EHR launch context and the user's identity.</summary>
public static class SmartScopes
{
    /// <summary>Space-separated, as sent in the authorization request (SMART App Launch 2.0, "Scopes").</summary>
    public const string Requested =
        "launch openid fhirUser patient/Patient.read patient/Observation.read patient/Condition.read patient/MedicationStatement.read patient/MedicationRequest.read";
}
