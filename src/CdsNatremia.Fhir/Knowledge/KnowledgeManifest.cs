using System.Text.Json;

namespace CdsNatremia.Fhir.Knowledge;

/// <summary>
/// The list of knowledge files the service expects (<c>profiles/knowledge-manifest.json</c>): each file's path, resource
/// type, canonical URL and version, and the manifest's own version. <see cref="Verify"/> refuses a folder where a
/// listed file is missing, a file is present without being listed, or a file's type, URL or version differs, so a
/// deleted or swapped file stops the start-up instead of silently weakening the rules.
/// </summary>
public sealed record KnowledgeManifest(string Version, IReadOnlyList<KnowledgeManifestEntry> Files)
{
    /// <summary>The manifest's file name, at the top of the knowledge folder.</summary>
    public const string FileName = "knowledge-manifest.json";

    /// <summary>Reads the manifest and checks the folder against it; throws <see cref="KnowledgeLoadException"/> listing every difference.</summary>
    public static KnowledgeManifest Verify(string directory)
    {
        ArgumentException.ThrowIfNullOrEmpty(directory);
        var path = Path.Combine(directory, FileName);
        if (!File.Exists(path))
        {
            throw new KnowledgeLoadException($"{path} is missing: the knowledge folder must list its files in {FileName}.");
        }

        var manifest = Read(path);
        var problems = new List<string>();
        var listed = new HashSet<string>(StringComparer.Ordinal);
        foreach (var entry in manifest.Files)
        {
            if (!listed.Add(entry.Path))
            {
                problems.Add($"'{entry.Path}' is listed twice");
                continue;
            }

            var file = Path.Combine(directory, entry.Path);
            if (!File.Exists(file))
            {
                problems.Add($"'{entry.Path}' ({entry.Url} version {entry.Version}) is listed but missing");
                continue;
            }

            problems.AddRange(Compare(entry, file));
        }

        foreach (var file in Directory.EnumerateFiles(directory, "*.json", SearchOption.AllDirectories).Order(StringComparer.Ordinal))
        {
            var relative = Path.GetRelativePath(directory, file).Replace(Path.DirectorySeparatorChar, '/');
            if (relative != FileName && !listed.Contains(relative))
            {
                problems.Add($"'{relative}' is present but not listed");
            }
        }

        return problems.Count == 0
            ? manifest
            : throw new KnowledgeLoadException($"The knowledge files do not match {path} (manifest version {manifest.Version}): {string.Join("; ", problems)}.");
    }

    private static KnowledgeManifest Read(string path)
    {
        try
        {
            using var document = JsonDocument.Parse(File.ReadAllText(path));
            var root = document.RootElement;
            var version = Text(root, "manifestVersion") ?? throw new KnowledgeLoadException($"{path}: manifestVersion is required.");
            if (!root.TryGetProperty("files", out var files) || files.ValueKind != JsonValueKind.Array)
            {
                throw new KnowledgeLoadException($"{path}: files must be an array.");
            }

            var entries = files.EnumerateArray().Select((f, i) => new KnowledgeManifestEntry(
                Text(f, "path") ?? throw new KnowledgeLoadException($"{path}: files[{i}].path is required."),
                Text(f, "resourceType") ?? throw new KnowledgeLoadException($"{path}: files[{i}].resourceType is required."),
                Text(f, "url") ?? throw new KnowledgeLoadException($"{path}: files[{i}].url is required."),
                Text(f, "version") ?? throw new KnowledgeLoadException($"{path}: files[{i}].version is required."))).ToList();
            return new KnowledgeManifest(version, entries);
        }
        catch (JsonException ex)
        {
            throw new KnowledgeLoadException($"{path}: not valid JSON ({ex.Message}).", ex);
        }
    }

    private static IEnumerable<string> Compare(KnowledgeManifestEntry entry, string file)
    {
        JsonDocument document;
        try
        {
            document = JsonDocument.Parse(File.ReadAllText(file));
        }
        catch (JsonException)
        {
            return [$"'{entry.Path}' is not valid JSON"];
        }

        using (document)
        {
            var root = document.RootElement;
            var problems = new List<string>();
            Check(problems, entry, "resourceType", entry.ResourceType, Text(root, "resourceType"));
            Check(problems, entry, "url", entry.Url, Text(root, "url"));
            Check(problems, entry, "version", entry.Version, Text(root, "version"));
            return problems;
        }
    }

    private static void Check(List<string> problems, KnowledgeManifestEntry entry, string element, string expected, string? found)
    {
        if (!string.Equals(expected, found, StringComparison.Ordinal))
        {
            problems.Add($"'{entry.Path}' has {element} '{found ?? "(none)"}', the manifest lists '{expected}'");
        }
    }

    private static string? Text(JsonElement element, string name)
        => element.ValueKind == JsonValueKind.Object && element.TryGetProperty(name, out var value) && value.ValueKind == JsonValueKind.String ? value.GetString() : null;
}

/// <summary>One expected knowledge file.</summary>
/// <param name="Path">Path relative to the knowledge folder, with '/' (e.g. "valuesets/drug-snri.json").</param>
/// <param name="ResourceType">Its FHIR resource type.</param>
/// <param name="Url">Its canonical URL.</param>
/// <param name="Version">Its business version.</param>
public sealed record KnowledgeManifestEntry(string Path, string ResourceType, string Url, string Version);
