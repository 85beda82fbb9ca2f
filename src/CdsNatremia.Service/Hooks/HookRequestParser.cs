using System.Text.Json;
using System.Text.RegularExpressions;
using CdsNatremia.Core.Engine;

namespace CdsNatremia.Service.Hooks;

/// <summary>
/// Checks a request body against CDS Hooks 2.0 and the service's hook definition. Every problem is a sentence a
/// client engineer can act on; the first problems found are all reported together.
/// </summary>
public static partial class HookRequestParser
{
    /// <summary>Parses and validates; returns null with problems when the request is not acceptable.</summary>
    public static HookRequest? Parse(JsonElement root, ServiceDefinition service, out List<string> problems)
    {
        ArgumentNullException.ThrowIfNull(service);
        problems = [];
        if (root.ValueKind != JsonValueKind.Object)
        {
            problems.Add("The request body must be a JSON object.");
            return null;
        }

        var hook = RequiredString(root, "hook", problems);
        if (hook is not null && !string.Equals(hook, service.Hook, StringComparison.Ordinal))
        {
            problems.Add($"'hook' is '{Clip(hook)}', but service '{service.Id}' answers the '{service.Hook}' hook.");
        }

        var instanceText = RequiredString(root, "hookInstance", problems);
        var instance = Guid.Empty;
        if (instanceText is not null && !Guid.TryParse(instanceText, out instance))
        {
            problems.Add("'hookInstance' must be a UUID.");
        }

        string? patientId = null;
        if (!root.TryGetProperty("context", out var context) || context.ValueKind != JsonValueKind.Object)
        {
            problems.Add("'context' is required and must be a JSON object.");
        }
        else
        {
            patientId = CheckContext(context, service, problems);
        }

        var prefetch = new Dictionary<string, JsonElement>(StringComparer.Ordinal);
        if (root.TryGetProperty("prefetch", out var pre))
        {
            if (pre.ValueKind != JsonValueKind.Object)
            {
                problems.Add("'prefetch' must be a JSON object of prefetch keys.");
            }
            else
            {
                foreach (var property in pre.EnumerateObject())
                {
                    prefetch[property.Name] = property.Value;
                }
            }
        }

        Uri? fhirServer = null;
        if (root.TryGetProperty("fhirServer", out var server))
        {
            if (server.ValueKind != JsonValueKind.String || !Uri.TryCreate(server.GetString(), UriKind.Absolute, out fhirServer)
                || (fhirServer.Scheme != Uri.UriSchemeHttps && fhirServer.Scheme != Uri.UriSchemeHttp))
            {
                problems.Add("'fhirServer' must be an absolute http(s) URL.");
                fhirServer = null;
            }
        }

        FhirAuthorization? authorization = null;
        if (root.TryGetProperty("fhirAuthorization", out var auth))
        {
            authorization = ParseAuthorization(auth, problems);
            if (!root.TryGetProperty("fhirServer", out _))
            {
                problems.Add("'fhirServer' is required when 'fhirAuthorization' is present.");
            }
        }

        if (problems.Count > 0)
        {
            return null;
        }

        return new HookRequest
        {
            Hook = hook!,
            HookInstance = instance,
            PatientId = patientId!,
            Context = context,
            Prefetch = prefetch,
            FhirServer = fhirServer,
            Authorization = authorization,
        };
    }

    private static string? CheckContext(JsonElement context, ServiceDefinition service, List<string> problems)
    {
        string? patientId = null;
        foreach (var field in service.Context)
        {
            if (!context.TryGetProperty(field.Name, out var value) || value.ValueKind == JsonValueKind.Null)
            {
                if (field.Required)
                {
                    problems.Add($"'context.{field.Name}' is required by the {service.Hook} hook.");
                }

                continue;
            }

            var ok = field.Kind switch
            {
                ContextFieldKind.String => value.ValueKind == JsonValueKind.String && value.GetString()!.Length > 0,
                ContextFieldKind.FhirId => value.ValueKind == JsonValueKind.String && FhirId().IsMatch(value.GetString()!),
                ContextFieldKind.Bundle => value.ValueKind == JsonValueKind.Object
                    && value.TryGetProperty("resourceType", out var rt) && rt.ValueKind == JsonValueKind.String && rt.GetString() == "Bundle",
                ContextFieldKind.StringArray => value.ValueKind == JsonValueKind.Array && value.EnumerateArray().All(e => e.ValueKind == JsonValueKind.String),
                ContextFieldKind.UserReference => value.ValueKind == JsonValueKind.String && IsReference(value.GetString()!, UserTypes),
                ContextFieldKind.ReferenceArray => value.ValueKind == JsonValueKind.Array && value.GetArrayLength() is > 0 and <= MaxReferences
                    && value.EnumerateArray().All(e => e.ValueKind == JsonValueKind.String && IsReference(e.GetString()!, null)),
                _ => false,
            };
            if (!ok)
            {
                problems.Add(field.Kind switch
                {
                    ContextFieldKind.FhirId => $"'context.{field.Name}' must be a FHIR id (1–64 letters, digits, '-' or '.').",
                    ContextFieldKind.Bundle => $"'context.{field.Name}' must be a FHIR Bundle.",
                    ContextFieldKind.StringArray => $"'context.{field.Name}' must be an array of strings.",
                    ContextFieldKind.UserReference => $"'context.{field.Name}' must be a FHIR reference to the user, [ResourceType]/[id] with type Practitioner, PractitionerRole, Patient or RelatedPerson and an id of 1–64 letters, digits, '-' or '.' (at most {MaxReferenceLength} characters).",
                    ContextFieldKind.ReferenceArray => $"'context.{field.Name}' must be an array of 1–{MaxReferences} FHIR references, each [ResourceType]/[id] with an id of 1–64 letters, digits, '-' or '.' (at most {MaxReferenceLength} characters).",
                    _ => $"'context.{field.Name}' must be a non-empty string.",
                });
            }
            else if (field.Name == "patientId")
            {
                patientId = value.GetString();
            }
        }

        return patientId;
    }

    private static FhirAuthorization? ParseAuthorization(JsonElement auth, List<string> problems)
    {
        if (auth.ValueKind != JsonValueKind.Object)
        {
            problems.Add("'fhirAuthorization' must be a JSON object.");
            return null;
        }

        var token = Field(auth, "access_token");
        var type = Field(auth, "token_type");
        var scope = Field(auth, "scope");
        var subject = Field(auth, "subject");
        long expires = 0;
        var hasExpires = auth.TryGetProperty("expires_in", out var e) && e.ValueKind == JsonValueKind.Number && e.TryGetInt64(out expires);
        if (token is null || scope is null || subject is null || !hasExpires || !string.Equals(type, "Bearer", StringComparison.Ordinal))
        {
            problems.Add("'fhirAuthorization' needs access_token, token_type \"Bearer\", expires_in (number), scope and subject.");
            return null;
        }

        return new FhirAuthorization(token, type!, expires, scope, subject);
    }

    private static string? Field(JsonElement obj, string name)
        => obj.TryGetProperty(name, out var v) && v.ValueKind == JsonValueKind.String && v.GetString()!.Length > 0 ? v.GetString() : null;

    private static string? RequiredString(JsonElement root, string name, List<string> problems)
    {
        if (root.TryGetProperty(name, out var value) && value.ValueKind == JsonValueKind.String && value.GetString()!.Length > 0)
        {
            return value.GetString();
        }

        problems.Add($"'{name}' is required and must be a non-empty string.");
        return null;
    }

    /// <summary>Longest reference accepted: a 64-character type name, '/', a 64-character id (FHIR id length).</summary>
    private const int MaxReferenceLength = 129;

    /// <summary>Most references accepted in one array field.</summary>
    private const int MaxReferences = 200;

    private static readonly HashSet<string> UserTypes = new(StringComparer.Ordinal) { "Practitioner", "PractitionerRole", "Patient", "RelatedPerson" };

    /// <summary>A FHIR relative reference "[ResourceType]/[id]" (FHIR R4 §2.3.0 Literal references; id per the id datatype).</summary>
    private static bool IsReference(string text, HashSet<string>? types)
    {
        if (text.Length > MaxReferenceLength || !Reference().IsMatch(text))
        {
            return false;
        }

        return types is null || types.Contains(text[..text.IndexOf('/', StringComparison.Ordinal)]);
    }

    private static string Clip(string text) => text.Length <= 80 ? text : text[..80] + "…";

    [GeneratedRegex("^[A-Za-z0-9\\-\\.]{1,64}$", RegexOptions.CultureInvariant)]
    private static partial Regex FhirId();

    [GeneratedRegex("^[A-Z][A-Za-z]{0,63}/[A-Za-z0-9\\-\\.]{1,64}$", RegexOptions.CultureInvariant)]
    private static partial Regex Reference();
}
