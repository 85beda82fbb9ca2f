using System.Text.Json.Nodes;
using CdsNatremia.Fhir.Knowledge;
using CdsNatremia.Fhir.Tests.Support;

namespace CdsNatremia.Fhir.Tests.Knowledge;

/// <summary>The knowledge folder is checked against its manifest: nothing missing, nothing unlisted, no other version.</summary>
public sealed class KnowledgeManifestTests : IDisposable
{
    private readonly DirectoryInfo _copy = Directory.CreateTempSubdirectory("natremia-manifest-");

    public KnowledgeManifestTests()
    {
        foreach (var file in Directory.EnumerateFiles(Profiles.Directory(), "*.json", SearchOption.AllDirectories))
        {
            var target = Path.Combine(_copy.FullName, Path.GetRelativePath(Profiles.Directory(), file));
            Directory.CreateDirectory(Path.GetDirectoryName(target)!);
            File.Copy(file, target);
        }
    }

    [Fact]
    public void Verify_TheProjectsProfiles_EveryFileListedWithItsVersion()
    {
        var manifest = KnowledgeManifest.Verify(Profiles.Directory());

        Assert.Equal("1.1.0", manifest.Version);
        Assert.Contains(manifest.Files, f => f.Path == "valuesets/drug-snri.json" && f.Url == "https://cdsnatremia.example.org/fhir/ValueSet/drug-snri");
        Assert.Contains(manifest.Files, f => f.Path == "structuredefinitions/drug-group-tier.json" && f.ResourceType == "StructureDefinition");
    }

    [Fact]
    public void Verify_ListedFileDeleted_RefusedNamingIt()
    {
        File.Delete(Path.Combine(_copy.FullName, "valuesets", "drug-snri.json"));

        var error = Assert.Throws<KnowledgeLoadException>(() => KnowledgeManifest.Verify(_copy.FullName));

        Assert.Contains("'valuesets/drug-snri.json' (https://cdsnatremia.example.org/fhir/ValueSet/drug-snri version 1.0.0) is listed but missing", error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Verify_UnlistedFile_RefusedNamingIt()
    {
        File.Copy(Path.Combine(_copy.FullName, "valuesets", "drug-snri.json"), Path.Combine(_copy.FullName, "valuesets", "drug-extra.json"));

        var error = Assert.Throws<KnowledgeLoadException>(() => KnowledgeManifest.Verify(_copy.FullName));

        Assert.Contains("'valuesets/drug-extra.json' is present but not listed", error.Message, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("version", "0.9.0", "has version '0.9.0', the manifest lists '1.0.0'")]
    [InlineData("url", "https://elsewhere.example.org/ValueSet/drug-ssri", "has url 'https://elsewhere.example.org/ValueSet/drug-ssri'")]
    public void Verify_FileOfAnotherVersionOrUrl_RefusedNamingIt(string element, string value, string expected)
    {
        var file = Path.Combine(_copy.FullName, "valuesets", "drug-ssri.json");
        var json = JsonNode.Parse(File.ReadAllText(file))!;
        json[element] = value;
        File.WriteAllText(file, json.ToJsonString());

        var error = Assert.Throws<KnowledgeLoadException>(() => KnowledgeManifest.Verify(_copy.FullName));

        Assert.Contains("'valuesets/drug-ssri.json' " + expected, error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Verify_NoManifest_Refused()
    {
        File.Delete(Path.Combine(_copy.FullName, KnowledgeManifest.FileName));

        Assert.Contains("knowledge-manifest.json is missing", Assert.Throws<KnowledgeLoadException>(() => KnowledgeManifest.Verify(_copy.FullName)).Message, StringComparison.Ordinal);
    }

    public void Dispose() => _copy.Delete(recursive: true);
}
