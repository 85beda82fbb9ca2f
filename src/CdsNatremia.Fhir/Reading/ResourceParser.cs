using Hl7.Fhir.Model;
using Hl7.Fhir.Serialization;

namespace CdsNatremia.Fhir.Reading;

/// <summary>
/// Parses one FHIR R4 resource from JSON with the Firely SDK. A resource with any parse error is refused whole:
/// partly read clinical data is not trusted. Thread-safe; one instance serves the process.
/// </summary>
public sealed class ResourceParser
{
    private readonly FhirJsonDeserializer _deserializer = new(new DeserializerSettings().UsingMode(DeserializationMode.Recoverable));

    /// <summary>Parses a resource, or returns null with the first problem in plain words.</summary>
    public Resource? TryParse(string json, out string? problem)
    {
        try
        {
            var ok = _deserializer.TryDeserializeResource(json, out var resource, out var issues);
            var first = issues?.FirstOrDefault();
            if (ok && resource is not null && first is null)
            {
                problem = null;
                return resource;
            }

            problem = first?.Message ?? "not a FHIR R4 resource";
            return null;
        }
        catch (Exception ex) when (ex is DeserializationFailedException or FormatException or InvalidOperationException or System.Text.Json.JsonException or Hl7.Fhir.Utility.CodedException)
        {
            problem = ex.Message;
            return null;
        }
    }
}
