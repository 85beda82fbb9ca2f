namespace CdsNatremia.Fhir.Reading;

/// <summary>Helpers for FHIR references: "Patient/123", "https://ehr/fhir/Patient/123/_history/2", "#contained".</summary>
public static class References
{
    /// <summary>The logical id a reference points to for a resource type, or null when it is not of that type.</summary>
    public static string? IdOf(string? reference, string resourceType)
    {
        if (string.IsNullOrWhiteSpace(reference))
        {
            return null;
        }

        var marker = resourceType + "/";
        var start = reference.StartsWith(marker, StringComparison.Ordinal) ? 0 : reference.LastIndexOf("/" + marker, StringComparison.Ordinal) + 1;
        if (start < 0 || (start == 0 && !reference.StartsWith(marker, StringComparison.Ordinal)))
        {
            return null;
        }

        var rest = reference[(start + marker.Length)..];
        var slash = rest.IndexOf('/', StringComparison.Ordinal);
        var id = slash >= 0 ? rest[..slash] : rest;
        return id.Length > 0 ? id : null;
    }

    /// <summary>True when the reference points to this patient.</summary>
    public static bool IsPatient(string? reference, string patientId) => string.Equals(IdOf(reference, "Patient"), patientId, StringComparison.Ordinal);
}
