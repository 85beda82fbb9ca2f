namespace CdsNatremia.Fhir.Tests.Support;

/// <summary>Finds the project's knowledge folder (profiles/) above the test binaries.</summary>
internal static class Profiles
{
    public static string Directory()
    {
        for (var dir = new DirectoryInfo(AppContext.BaseDirectory); dir is not null; dir = dir.Parent)
        {
            var candidate = Path.Combine(dir.FullName, "profiles");
            if (System.IO.Directory.Exists(Path.Combine(candidate, "valuesets")))
            {
                return candidate;
            }
        }

        throw new DirectoryNotFoundException("profiles/ not found above the test binaries.");
    }

    /// <summary>Every drug-group ValueSet file.</summary>
    public static IReadOnlyList<string> DrugFiles()
        => System.IO.Directory.GetFiles(Path.Combine(Directory(), "valuesets"), "drug-*.json").Order(StringComparer.Ordinal).ToList();
}
