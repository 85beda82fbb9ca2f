using System.Globalization;
using System.Text.Json;
using CdsNatremia.Core.Findings;

namespace CdsNatremia.Service.Hooks;

/// <summary>
/// A finding as JSON for the card's extension: its kind, certainty, evidence and slot values as data (numbers as
/// numbers, names as strings, times in ISO 8601, a result as its reference, value and unit, a nested phrase as its kind
/// with its own values), so integration tooling compares decisions, not wording. Written straight to the response.
/// </summary>
internal static class FindingJson
{
    public static void Write(Utf8JsonWriter writer, Finding finding)
    {
        writer.WriteStartObject();
        writer.WriteString("kind", finding.Kind);
        writer.WriteString("certainty", Certainty(finding.Certainty));
        if (finding.Evidence.Count > 0)
        {
            writer.WriteStartArray("evidence");
            var seen = new HashSet<string>(StringComparer.Ordinal);
            foreach (var evidence in finding.Evidence)
            {
                if (seen.Add(evidence))
                {
                    writer.WriteStringValue(evidence);
                }
            }

            writer.WriteEndArray();
        }

        // CDS Hooks forbids empty values ("", [], {}): a slot that words an absent clause (an empty text) is left out.
        // A name given twice keeps its first place and its last value.
        var started = false;
        for (var i = 0; i < finding.Slots.Count; i++)
        {
            var slot = finding.Slots[i];
            if (!IsFirst(finding.Slots, i))
            {
                continue;
            }

            var value = LastValue(finding.Slots, slot.Name);
            if (IsEmpty(value))
            {
                continue;
            }

            if (!started)
            {
                writer.WriteStartObject("values");
                started = true;
            }

            writer.WritePropertyName(slot.Name);
            WriteValue(writer, value);
        }

        if (started)
        {
            writer.WriteEndObject();
        }

        writer.WriteEndObject();
    }

    private static bool IsFirst(IReadOnlyList<Slot> slots, int index)
    {
        for (var j = 0; j < index; j++)
        {
            if (string.Equals(slots[j].Name, slots[index].Name, StringComparison.Ordinal))
            {
                return false;
            }
        }

        return true;
    }

    private static SlotValue LastValue(IReadOnlyList<Slot> slots, string name)
    {
        for (var j = slots.Count - 1; j >= 0; j--)
        {
            if (string.Equals(slots[j].Name, name, StringComparison.Ordinal))
            {
                return slots[j].Value;
            }
        }

        throw new InvalidOperationException("A slot's own name was not found.");
    }

    /// <summary>True when the value writes nothing: an empty text, a list of such values, or a kind of value not sent.</summary>
    private static bool IsEmpty(SlotValue value) => value switch
    {
        TextValue t => t.Value.Length == 0,
        ListValue l => l.Values.All(IsEmpty),
        NumberValue or TimeValue or DurationValue or ResultValue or PhraseValue => false,
        _ => true,
    };

    private static void WriteValue(Utf8JsonWriter writer, SlotValue value)
    {
        switch (value)
        {
            case NumberValue n:
                writer.WriteNumberValue(n.Decimals is { } decimals ? Math.Round(n.Value, decimals, MidpointRounding.AwayFromZero) : n.Value);
                break;
            case TextValue t:
                writer.WriteStringValue(t.Value);
                break;
            case TimeValue t:
                writer.WriteStringValue(t.Value.ToString("O", CultureInfo.InvariantCulture));
                break;
            case DurationValue d:
                writer.WriteStartObject();
                writer.WriteNumber("hours", d.Hours);
                writer.WriteEndObject();
                break;
            case ResultValue r:
                writer.WriteStartObject();
                writer.WriteString("reference", r.Result.Reference);
                writer.WriteNumber("value", r.Result.Value);
                writer.WriteString("unit", r.Result.Unit);
                writer.WriteEndObject();
                break;
            case PhraseValue p:
                Write(writer, p.Finding);
                break;
            case ListValue l:
                writer.WriteStartArray();
                foreach (var item in l.Values)
                {
                    if (!IsEmpty(item))
                    {
                        WriteValue(writer, item);
                    }
                }

                writer.WriteEndArray();
                break;
        }
    }

    private static string Certainty(Certainty certainty) => certainty switch
    {
        Core.Findings.Certainty.Likely => "likely",
        Core.Findings.Certainty.Possible => "possible",
        Core.Findings.Certainty.Unknown => "unknown",
        Core.Findings.Certainty.CouldNotBeRead => "could-not-be-read",
        _ => "established",
    };
}
