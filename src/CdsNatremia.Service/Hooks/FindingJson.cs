using System.Globalization;
using System.Text.Json.Nodes;
using CdsNatremia.Core.Findings;

namespace CdsNatremia.Service.Hooks;

/// <summary>
/// A finding as JSON for the card's extension: its kind, certainty, evidence and slot values as data (numbers as
/// numbers, names as strings, times in ISO 8601, a result as its reference, value and unit, a nested phrase as its kind
/// with its own values), so integration tooling compares decisions, not wording.
/// </summary>
internal static class FindingJson
{
    public static JsonObject Of(Finding finding)
    {
        var json = new JsonObject
        {
            ["kind"] = finding.Kind,
            ["certainty"] = Certainty(finding.Certainty),
        };
        if (finding.Evidence.Count > 0)
        {
            json["evidence"] = new JsonArray(finding.Evidence.Distinct(StringComparer.Ordinal).Select(e => (JsonNode)JsonValue.Create(e)!).ToArray());
        }

        // CDS Hooks forbids empty values ("", [], {}): a slot that words an absent clause (an empty text) is left out.
        var values = new JsonObject();
        foreach (var slot in finding.Slots)
        {
            if (Value(slot.Value) is { } node)
            {
                values[slot.Name] = node;
            }
        }

        if (values.Count > 0)
        {
            json["values"] = values;
        }

        return json;
    }

    private static JsonNode? Value(SlotValue value) => value switch
    {
        NumberValue n => JsonValue.Create(n.Decimals is { } d ? Math.Round(n.Value, d, MidpointRounding.AwayFromZero) : n.Value),
        TextValue { Value.Length: 0 } => null,
        TextValue t => JsonValue.Create(t.Value),
        TimeValue t => JsonValue.Create(t.Value.ToString("O", CultureInfo.InvariantCulture)),
        DurationValue d => new JsonObject { ["hours"] = d.Hours },
        ResultValue r => new JsonObject { ["reference"] = r.Result.Reference, ["value"] = r.Result.Value, ["unit"] = r.Result.Unit },
        PhraseValue p => Of(p.Finding),
        ListValue l when l.Values.Select(Value).OfType<JsonNode>().ToArray() is { Length: > 0 } items => new JsonArray(items),
        _ => null,
    };

    private static string Certainty(Certainty certainty) => certainty switch
    {
        Core.Findings.Certainty.Likely => "likely",
        Core.Findings.Certainty.Possible => "possible",
        Core.Findings.Certainty.Unknown => "unknown",
        Core.Findings.Certainty.CouldNotBeRead => "could-not-be-read",
        _ => "established",
    };
}
