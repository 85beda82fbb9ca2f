using System.Runtime.InteropServices;
using System.Text.Json;

namespace CdsNatremia.Service.Endpoints;

/// <summary>
/// JSON may carry a "\ud800" escape that decodes to no valid text (a lone UTF-16 surrogate). System.Text.Json parses it
/// but throws when the string is read, wherever that happens; this finds it once, at the door, so the client gets a 400.
/// Only strings that contain an escape are decoded, so a normal request pays one scan of its raw bytes.
/// </summary>
internal static class JsonStrings
{
    /// <summary>True when every string value and property name in the element decodes to valid text.</summary>
    public static bool AllDecodable(JsonElement element)
    {
        switch (element.ValueKind)
        {
            case JsonValueKind.Object:
                foreach (var property in element.EnumerateObject())
                {
                    if ((HasEscape(JsonMarshal.GetRawUtf8PropertyName(property)) && !Decodes(() => property.Name))
                        || !AllDecodable(property.Value))
                    {
                        return false;
                    }
                }

                return true;
            case JsonValueKind.Array:
                foreach (var item in element.EnumerateArray())
                {
                    if (!AllDecodable(item))
                    {
                        return false;
                    }
                }

                return true;
            case JsonValueKind.String:
                return !HasEscape(JsonMarshal.GetRawUtf8Value(element)) || Decodes(element.GetString);
            default:
                return true;
        }
    }

    private static bool HasEscape(ReadOnlySpan<byte> raw) => raw.IndexOf((byte)'\\') >= 0;

    private static bool Decodes(Func<string?> read)
    {
        try
        {
            _ = read();
            return true;
        }
        catch (InvalidOperationException)
        {
            return false;
        }
    }
}
