using System.Text.Json.Nodes;
using System.Text.RegularExpressions;

namespace CdsNatremia.Cli.Prefetch;

/// <summary>
/// Replaces CDS Hooks prefetch tokens in a template: <c>{{context.&lt;field&gt;}}</c> for a primitive context field and
/// the user tokens <c>{{userPractitionerId}}</c>, <c>{{userPractitionerRoleId}}</c>, <c>{{userPatientId}}</c>,
/// <c>{{userRelatedPersonId}}</c>, which the standard derives from <c>context.userId</c>.
/// </summary>
internal static partial class PrefetchTokens
{
    /// <summary>The template with every token replaced; throws <see cref="FormatException"/> for a token with no value.</summary>
    public static string Substitute(string template, JsonObject context)
    {
        ArgumentNullException.ThrowIfNull(template);
        ArgumentNullException.ThrowIfNull(context);
        return Token().Replace(template, match =>
        {
            var name = match.Groups[1].Value.Trim();
            var value = Resolve(name, context)
                ?? throw new FormatException($"The prefetch token '{{{{{name}}}}}' has no value in this hook's context.");
            return Uri.EscapeDataString(value);
        });
    }

    private static string? Resolve(string name, JsonObject context)
    {
        if (name.StartsWith("context.", StringComparison.Ordinal))
        {
            return context[name["context.".Length..]] is JsonValue v && v.TryGetValue<string>(out var text) ? text : null;
        }

        var userId = context["userId"] is JsonValue u && u.TryGetValue<string>(out var user) ? user : null;
        var type = name switch
        {
            "userPractitionerId" => "Practitioner",
            "userPractitionerRoleId" => "PractitionerRole",
            "userPatientId" => "Patient",
            "userRelatedPersonId" => "RelatedPerson",
            _ => null,
        };
        return type is not null && userId is not null && userId.StartsWith(type + "/", StringComparison.Ordinal) ? userId[(type.Length + 1)..] : null;
    }

    [GeneratedRegex("\\{\\{([^}]+)\\}\\}", RegexOptions.CultureInvariant)]
    private static partial Regex Token();
}
