namespace CdsNatremia.Core.Engine;

/// <summary>The JSON shape a context field must have.</summary>
public enum ContextFieldKind
{
    /// <summary>A non-empty string.</summary>
    String,
    /// <summary>A FHIR resource id (string matching the FHIR id pattern).</summary>
    FhirId,
    /// <summary>A FHIR Bundle object.</summary>
    Bundle,
    /// <summary>An array of strings.</summary>
    StringArray,
    /// <summary>
    /// The current user as a FHIR relative reference "[ResourceType]/[id]" of a Practitioner, PractitionerRole,
    /// Patient or RelatedPerson (CDS Hooks 2.0, context.userId).
    /// </summary>
    UserReference,
    /// <summary>An array of FHIR relative references "[ResourceType]/[id]" (e.g. order-select's selections).</summary>
    ReferenceArray,
}

/// <summary>One field of a hook's context, as the hook's definition documents it.</summary>
/// <param name="Name">The field name.</param>
/// <param name="Required">Whether the hook requires it.</param>
/// <param name="Kind">Its JSON shape.</param>
public sealed record ContextField(string Name, bool Required, ContextFieldKind Kind);
