using System.Globalization;
using System.Text.Json.Nodes;
using System.Text.RegularExpressions;

namespace CdsNatremia.Scenarios;

/// <summary>
/// Moves every FHIR dateTime and instant in a JSON document by a fixed offset, so a scenario written for its anchor
/// reads the same relative story at any other time. Dates without a time (birthDate) are left alone: age barely moves.
/// </summary>
public static partial class DateShifter
{
    /// <summary>Returns a copy of the JSON with each full date-time shifted by <paramref name="offset"/>.</summary>
    public static string Shift(string json, TimeSpan offset)
    {
        var node = JsonNode.Parse(json) ?? throw new ArgumentException("Empty JSON.", nameof(json));
        Walk(node, offset);
        return node.ToJsonString();
    }

    private static void Walk(JsonNode node, TimeSpan offset)
    {
        switch (node)
        {
            case JsonObject obj:
                foreach (var (key, value) in obj.ToList())
                {
                    if (value is JsonValue v && v.TryGetValue<string>(out var text) && DateTime().IsMatch(text)
                        && DateTimeOffset.TryParse(text, CultureInfo.InvariantCulture, DateTimeStyles.RoundtripKind, out var when))
                    {
                        obj[key] = when.Add(offset).ToUniversalTime().ToString("yyyy-MM-dd'T'HH:mm:ss'Z'", CultureInfo.InvariantCulture);
                    }
                    else if (value is not null)
                    {
                        Walk(value, offset);
                    }
                }

                break;
            case JsonArray array:
                foreach (var item in array)
                {
                    if (item is not null)
                    {
                        Walk(item, offset);
                    }
                }

                break;
        }
    }

    [GeneratedRegex("^\\d{4}-\\d{2}-\\d{2}T\\d{2}:\\d{2}(:\\d{2}(\\.\\d+)?)?(Z|[+-]\\d{2}:\\d{2})$")]
    private static partial Regex DateTime();
}
