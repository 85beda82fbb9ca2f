using System.Text.Json;
using System.Text.RegularExpressions;

namespace CdsNatremia.Service.Fetching;

/// <summary>
/// Fills a prefetch template's tokens from the request (CDS Hooks 2.0 prefetch tokens): {{context.&lt;field&gt;}} for a
/// root primitive context field, and {{userPractitionerId}}, {{userPractitionerRoleId}}, {{userPatientId}},
/// {{userRelatedPersonId}} from context.userId when it is a reference of that type. Every value is URL-encoded, so a
/// value can never add a path segment or a query parameter.
/// </summary>
internal static partial class PrefetchQuery
{
    private static readonly Dictionary<string, string> UserTokens = new(StringComparer.Ordinal)
    {
        ["userPractitionerId"] = "Practitioner",
        ["userPractitionerRoleId"] = "PractitionerRole",
        ["userPatientId"] = "Patient",
        ["userRelatedPersonId"] = "RelatedPerson",
    };

    /// <summary>The query relative to the FHIR base, or null with the reason.</summary>
    public static string? Build(string template, JsonElement context, out string? problem)
    {
        ArgumentNullException.ThrowIfNull(template);
        string? missing = null;
        var query = Token().Replace(template, match =>
        {
            var name = match.Groups[1].Value.Trim();
            var value = Resolve(name, context);
            if (value is null)
            {
                missing ??= name;
                return string.Empty;
            }

            return Uri.EscapeDataString(value);
        });
        problem = missing is null ? null : $"not fetched: its query needs {{{{{missing}}}}}, which the request's context does not give";
        return missing is null ? query : null;
    }

    /// <summary>The resource type the query asks for: "Patient" for "Patient/123", "Observation" for "Observation?…".</summary>
    public static string ResourceTypeOf(string template)
    {
        ArgumentNullException.ThrowIfNull(template);
        var end = template.IndexOfAny(['/', '?']);
        return end < 0 ? template : template[..end];
    }

    /// <summary>Whether the query reads one resource by id (rather than searching).</summary>
    public static bool IsRead(string template)
    {
        ArgumentNullException.ThrowIfNull(template);
        var slash = template.IndexOf('/', StringComparison.Ordinal);
        var question = template.IndexOf('?', StringComparison.Ordinal);
        return slash >= 0 && (question < 0 || slash < question);
    }

    private static string? Resolve(string name, JsonElement context)
    {
        if (context.ValueKind != JsonValueKind.Object)
        {
            return null;
        }

        if (name.StartsWith("context.", StringComparison.Ordinal))
        {
            var field = name["context.".Length..];
            if (field.Length == 0 || field.Contains('.', StringComparison.Ordinal) || !context.TryGetProperty(field, out var value))
            {
                return null;
            }

            return value.ValueKind switch
            {
                JsonValueKind.String when value.GetString()!.Length > 0 => value.GetString(),
                JsonValueKind.Number => value.GetRawText(),
                JsonValueKind.True => "true",
                JsonValueKind.False => "false",
                _ => null,
            };
        }

        if (UserTokens.TryGetValue(name, out var type)
            && context.TryGetProperty("userId", out var user) && user.ValueKind == JsonValueKind.String
            && user.GetString() is { } reference && reference.StartsWith(type + "/", StringComparison.Ordinal)
            && reference.Length > type.Length + 1)
        {
            return reference[(type.Length + 1)..];
        }

        return null;
    }

    [GeneratedRegex("\\{\\{([^{}]+)\\}\\}", RegexOptions.CultureInvariant)]
    private static partial Regex Token();
}
