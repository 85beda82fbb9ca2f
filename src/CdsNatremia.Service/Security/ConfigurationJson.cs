using System.Text.Json.Nodes;

namespace CdsNatremia.Service.Security;

/// <summary>
/// Turns a configuration section back into JSON text, so a JWK Set can be written in appsettings.json as a plain object
/// (<c>"Jwks": {"keys": [...]}</c>) as well as a JSON string. Children named 0, 1, 2… become arrays; leaves stay strings,
/// which is what every JWK member is.
/// </summary>
internal static class ConfigurationJson
{
    public static string? Read(IConfigurationSection section)
    {
        ArgumentNullException.ThrowIfNull(section);
        if (!string.IsNullOrEmpty(section.Value))
        {
            return section.Value;
        }

        return section.GetChildren().Any() ? Node(section)!.ToJsonString() : null;
    }

    private static JsonNode? Node(IConfigurationSection section)
    {
        var children = section.GetChildren().ToList();
        if (children.Count == 0)
        {
            return section.Value is null ? null : JsonValue.Create(section.Value);
        }

        var indexes = children.Select(c => int.TryParse(c.Key, System.Globalization.NumberStyles.None, System.Globalization.CultureInfo.InvariantCulture, out var i) ? i : -1).ToList();
        if (indexes.All(i => i >= 0))
        {
            var array = new JsonArray();
            foreach (var child in children.Zip(indexes).OrderBy(p => p.Second).Select(p => p.First))
            {
                array.Add(Node(child));
            }

            return array;
        }

        var obj = new JsonObject();
        foreach (var child in children)
        {
            obj[child.Key] = Node(child);
        }

        return obj;
    }
}
