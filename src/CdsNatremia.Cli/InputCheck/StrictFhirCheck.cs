using Hl7.Fhir.Serialization;

namespace CdsNatremia.Cli.InputCheck;

/// <summary>
/// Parses a resource with the Firely SDK in strict mode and returns every issue (unknown resource type or element,
/// wrong JSON type, invalid date, unknown code...). The service reads leniently; this says what an EHR should fix.
/// </summary>
internal static class StrictFhirCheck
{
    private static readonly FhirJsonDeserializer Deserializer = new(new DeserializerSettings().UsingMode(DeserializationMode.Strict));

    /// <summary>The issues, at most five, each as "message"; empty when the resource is valid FHIR R4 JSON.</summary>
    public static IReadOnlyList<string> Issues(string json)
    {
        try
        {
            _ = Deserializer.TryDeserializeResource(json, out _, out var issues);
            return issues?.Select(i => i.Message).Take(5).ToList() ?? [];
        }
        catch (Exception ex) when (ex is DeserializationFailedException or FormatException or InvalidOperationException or System.Text.Json.JsonException)
        {
            return [ex.Message];
        }
    }
}
