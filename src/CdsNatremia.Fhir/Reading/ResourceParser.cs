using System.Runtime.InteropServices;
using System.Text.Json;
using Hl7.Fhir.Model;
using Hl7.Fhir.Serialization;

namespace CdsNatremia.Fhir.Reading;

/// <summary>
/// Parses one FHIR R4 resource from JSON with the Firely SDK. A resource whose JSON does not fit its type (structure
/// errors Firely reports) is refused whole. Firely's per-element validator is switched off: in Recoverable mode its
/// findings are discarded anyway (measured: identical outcomes on every scenario and malformed fixture), and it cost
/// about half the parse time. The value-level safety checks live where the data is used: the readers check codes,
/// statuses, units, subjects, times and plausibility, and a value that cannot be interpreted sets its resource aside.
/// Thread-safe; one instance serves the process.
/// </summary>
public sealed class ResourceParser
{
    private readonly FhirJsonDeserializer _deserializer = new(new DeserializerSettings { Validator = null }.UsingMode(DeserializationMode.Recoverable));

    /// <summary>
    /// The reader options Firely itself uses when it parses a string (comments skipped, trailing commas allowed,
    /// default depth), so that parsing an element's bytes accepts and refuses exactly what parsing its text would.
    /// </summary>
    private static readonly JsonReaderOptions ReaderOptions = new() { CommentHandling = JsonCommentHandling.Skip, AllowTrailingCommas = true };

    /// <summary>Parses a resource, or returns null with the first problem in plain words.</summary>
    public Resource? TryParse(string json, out string? problem)
    {
        ArgumentNullException.ThrowIfNull(json);
        return TryParse(System.Text.Encoding.UTF8.GetBytes(json), out problem);
    }

    /// <summary>
    /// Parses a resource straight from an element of a parsed request, without copying it to a string and back:
    /// the element's own UTF-8 bytes are read. Same outcome as <see cref="TryParse(string, out string?)"/> on
    /// <see cref="JsonElement.GetRawText"/>. The element's document must stay alive during the call.
    /// </summary>
    public Resource? TryParse(JsonElement element, out string? problem) => TryParse(JsonMarshal.GetRawUtf8Value(element), out problem);

    private Resource? TryParse(ReadOnlySpan<byte> utf8, out string? problem)
    {
        try
        {
            var reader = new Utf8JsonReader(utf8, ReaderOptions);
            var ok = _deserializer.TryDeserializeResource(ref reader, out var resource, out var issues);
            var first = issues?.FirstOrDefault();
            if (ok && resource is not null && first is null)
            {
                // Firely checks element types lazily: an id of the wrong JSON type only fails when read. Every caller
                // reads the id, so read it here, where a failure refuses the resource instead of escaping later.
                _ = resource.Id;
                if (!ModelInfo.IsKnownResource(resource.TypeName))
                {
                    // The lenient parser keeps a resource of a type R4 does not define; no rule could read it, so it is
                    // refused here and named as not used, never dropped in silence.
                    problem = $"'{resource.TypeName}' is not a FHIR R4 resource type";
                    return null;
                }

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
