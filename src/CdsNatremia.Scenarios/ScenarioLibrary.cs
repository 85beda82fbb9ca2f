using System.Reflection;
using System.Text.Json;

namespace CdsNatremia.Scenarios;

/// <summary>
/// The scenario library, embedded in this assembly. Every scenario is written as if "now" were <see cref="Anchor"/>;
/// <see cref="DateShifter"/> moves a scenario to another time.
/// </summary>
public static class ScenarioLibrary
{
    private static readonly Lazy<(DateTimeOffset Anchor, IReadOnlyList<Scenario> All)> Loaded = new(Load);

    /// <summary>The time every scenario is written against.</summary>
    public static DateTimeOffset Anchor => Loaded.Value.Anchor;

    /// <summary>Every scenario, in id order.</summary>
    public static IReadOnlyList<Scenario> All => Loaded.Value.All;

    /// <summary>The scenario with this id (or id prefix such as "01"), or null.</summary>
    public static Scenario? Find(string id)
        => All.FirstOrDefault(s => s.Id == id) ?? All.FirstOrDefault(s => s.Id.StartsWith(id + "-", StringComparison.Ordinal));

    private static (DateTimeOffset, IReadOnlyList<Scenario>) Load()
    {
        var assembly = typeof(ScenarioLibrary).Assembly;
        using var manifest = JsonDocument.Parse(Read(assembly, "scenarios.json"));
        var root = manifest.RootElement;
        var anchor = DateTimeOffset.Parse(root.GetProperty("anchor").GetString()!, System.Globalization.CultureInfo.InvariantCulture);
        var list = new List<Scenario>();
        foreach (var item in root.GetProperty("scenarios").EnumerateArray())
        {
            list.Add(new Scenario
            {
                Id = item.GetProperty("id").GetString()!,
                Title = item.GetProperty("title").GetString()!,
                Story = item.GetProperty("story").GetString()!,
                PatientId = item.GetProperty("patientId").GetString()!,
                Hook = item.GetProperty("hook").GetString()!,
                BundleJson = Read(assembly, item.GetProperty("file").GetString()!),
                DraftOrdersJson = item.TryGetProperty("draftOrdersFile", out var d) ? Read(assembly, d.GetString()!) : null,
                Selections = Strings(item, "selections"),
                NewResultIds = Strings(item, "newResultIds"),
                Misdirected = item.TryGetProperty("misdirected", out var m) && m.ValueKind == JsonValueKind.Object
                    ? m.EnumerateObject().ToDictionary(k => k.Name, k => (IReadOnlyList<string>)k.Value.EnumerateArray().Select(e => e.GetString()!).ToList(), StringComparer.Ordinal)
                    : new Dictionary<string, IReadOnlyList<string>>(StringComparer.Ordinal),
                Expect = item.GetProperty("expect").Clone(),
            });
        }

        return (anchor, list.OrderBy(s => s.Id, StringComparer.Ordinal).ToList());
    }

    private static IReadOnlyList<string> Strings(JsonElement item, string name)
        => item.TryGetProperty(name, out var a) && a.ValueKind == JsonValueKind.Array ? a.EnumerateArray().Select(e => e.GetString()!).ToList() : [];

    private static string Read(Assembly assembly, string name)
    {
        using var stream = assembly.GetManifestResourceStream(name) ?? throw new InvalidOperationException($"Scenario resource '{name}' is missing.");
        using var reader = new StreamReader(stream);
        return reader.ReadToEnd();
    }
}
