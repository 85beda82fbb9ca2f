using System.Text.RegularExpressions;
using CdsNatremia.Core.Cards;

namespace CdsNatremia.Core.Tests.Conventions;

/// <summary>Holds the architecture: the core is pure (no web, HTTP, FHIR SDK, wall clock).</summary>
public partial class CorePurityTests
{
    [Fact]
    public void CoreAssembly_ReferencesNoWebHttpOrFhirAssembly()
    {
        var forbidden = new[] { "Microsoft.AspNetCore", "System.Net.Http", "Hl7.Fhir", "Microsoft.Data", "Npgsql" };
        var references = typeof(Card).Assembly.GetReferencedAssemblies().Select(a => a.Name ?? string.Empty).ToList();
        Assert.DoesNotContain(references, r => forbidden.Any(f => r.StartsWith(f, StringComparison.Ordinal)));
    }

    [Fact]
    public void CoreSource_NeverReadsTheWallClockOrDoesIo()
    {
        var root = FindSourceRoot();
        var offenders = Directory.EnumerateFiles(root, "*.cs", SearchOption.AllDirectories)
            .Where(f => !f.Contains($"{Path.DirectorySeparatorChar}obj{Path.DirectorySeparatorChar}", StringComparison.Ordinal))
            .Where(f => Forbidden().IsMatch(File.ReadAllText(f)))
            .Select(Path.GetFileName)
            .ToList();
        Assert.Empty(offenders);
    }

    private static string FindSourceRoot()
    {
        for (var dir = new DirectoryInfo(AppContext.BaseDirectory); dir is not null; dir = dir.Parent)
        {
            var candidate = Path.Combine(dir.FullName, "src", "CdsNatremia.Core");
            if (Directory.Exists(candidate))
            {
                return candidate;
            }
        }

        throw new DirectoryNotFoundException("src/CdsNatremia.Core not found above the test binaries.");
    }

    [GeneratedRegex(@"DateTime(Offset)?\.(Utc)?Now|TimeProvider\.System|File\.|Directory\.|HttpClient|Console\.")]
    private static partial Regex Forbidden();
}
