using System.Text.Json;

namespace CdsNatremia.Service.Security;

/// <summary>
/// Counts FHIR Bundle entries in a hook request's prefetch and context, nested Bundles included, stopping as soon as
/// the limit is passed. The walk is bounded by the JSON depth limit already applied when the body was parsed.
/// </summary>
internal static class BundleEntryCounter
{
    /// <summary>True when prefetch and context together hold more than <paramref name="limit"/> Bundle entries.</summary>
    public static bool Exceeds(JsonElement root, int limit, out int counted)
    {
        counted = 0;
        if (root.ValueKind != JsonValueKind.Object)
        {
            return false;
        }

        foreach (var name in (string[])["prefetch", "context"])
        {
            if (root.TryGetProperty(name, out var part) && Walk(part, limit, ref counted))
            {
                return true;
            }
        }

        return false;
    }

    private static bool Walk(JsonElement element, int limit, ref int counted)
    {
        switch (element.ValueKind)
        {
            case JsonValueKind.Object:
                if (element.TryGetProperty("resourceType", out var type) && type.ValueKind == JsonValueKind.String && type.ValueEquals("Bundle")
                    && element.TryGetProperty("entry", out var entries) && entries.ValueKind == JsonValueKind.Array)
                {
                    counted += entries.GetArrayLength();
                    if (counted > limit)
                    {
                        return true;
                    }
                }

                foreach (var property in element.EnumerateObject())
                {
                    if (property.Value.ValueKind is JsonValueKind.Object or JsonValueKind.Array && Walk(property.Value, limit, ref counted))
                    {
                        return true;
                    }
                }

                return false;
            case JsonValueKind.Array:
                foreach (var item in element.EnumerateArray())
                {
                    if (item.ValueKind is JsonValueKind.Object or JsonValueKind.Array && Walk(item, limit, ref counted))
                    {
                        return true;
                    }
                }

                return false;
            default:
                return false;
        }
    }
}
