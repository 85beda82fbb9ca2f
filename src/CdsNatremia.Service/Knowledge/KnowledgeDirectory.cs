namespace CdsNatremia.Service.Knowledge;

/// <summary>Finds the knowledge folder: configured, else the nearest "profiles" above the content root, else beside the binaries.</summary>
public static class KnowledgeDirectory
{
    /// <summary>Resolves the folder to load.</summary>
    public static string Resolve(string? configured, string contentRoot)
    {
        if (!string.IsNullOrWhiteSpace(configured))
        {
            return Path.GetFullPath(configured, contentRoot);
        }

        for (var dir = new DirectoryInfo(contentRoot); dir is not null; dir = dir.Parent)
        {
            var candidate = Path.Combine(dir.FullName, "profiles");
            if (Directory.Exists(Path.Combine(candidate, "valuesets")))
            {
                return candidate;
            }
        }

        return Path.Combine(AppContext.BaseDirectory, "profiles");
    }
}
