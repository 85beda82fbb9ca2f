using CdsNatremia.Core.Facts;
using CdsNatremia.Fhir.Knowledge;

namespace CdsNatremia.Fhir.Tests.Knowledge;

public class KnowledgeLoaderTests
{
    private static string ProfilesDirectory()
    {
        for (var dir = new DirectoryInfo(AppContext.BaseDirectory); dir is not null; dir = dir.Parent)
        {
            var candidate = Path.Combine(dir.FullName, "profiles");
            if (Directory.Exists(Path.Combine(candidate, "valuesets")))
            {
                return candidate;
            }
        }

        throw new DirectoryNotFoundException("profiles/ not found above the test binaries.");
    }

    [Fact]
    public void Load_TheProjectsProfiles_EveryFileParsesWithTheFirelySdk()
    {
        var loaded = KnowledgeLoader.Load(ProfilesDirectory());
        Assert.NotNull(loaded.Base.Find("drug-thiazide"));
        Assert.NotNull(loaded.Base.Find("drug-ssri"));
        Assert.NotNull(loaded.Base.Find("drug-carbamazepine-family"));
        Assert.StartsWith("knowledge-", loaded.Base.Version, StringComparison.Ordinal);
        Assert.NotEmpty(loaded.CodeSystems["override-reason"]);
    }

    [Fact]
    public void Load_MalformedFile_StopsWithTheFileNamed()
    {
        var dir = Directory.CreateTempSubdirectory("natremia-kb-");
        try
        {
            Directory.CreateDirectory(Path.Combine(dir.FullName, "valuesets"));
            File.WriteAllText(Path.Combine(dir.FullName, "valuesets", "drug-x.json"), "{ not json");
            var ex = Assert.Throws<KnowledgeLoadException>(() => KnowledgeLoader.Load(dir.FullName));
            Assert.Contains("drug-x.json", ex.Message, StringComparison.Ordinal);
        }
        finally
        {
            dir.Delete(recursive: true);
        }
    }

    [Fact]
    public void Load_FileNameNotTheId_Refused()
    {
        var dir = Directory.CreateTempSubdirectory("natremia-kb-");
        try
        {
            Directory.CreateDirectory(Path.Combine(dir.FullName, "valuesets"));
            File.WriteAllText(Path.Combine(dir.FullName, "valuesets", "other-name.json"), """
                {"resourceType":"ValueSet","id":"drug-x","url":"https://example.org/ValueSet/drug-x","status":"active",
                 "compose":{"include":[{"system":"http://www.nlm.nih.gov/research/umls/rxnorm","concept":[{"code":"5487","display":"hydrochlorothiazide"}]}]}}
                """);
            var ex = Assert.Throws<KnowledgeLoadException>(() => KnowledgeLoader.Load(dir.FullName));
            Assert.Contains("drug-x.json", ex.Message, StringComparison.Ordinal);
        }
        finally
        {
            dir.Delete(recursive: true);
        }
    }

    [Fact]
    public void Load_AtcIsAFilter_MatchesAsPrefix()
    {
        var thiazide = KnowledgeLoader.Load(ProfilesDirectory()).Base.Find("drug-thiazide")!;
        // ATC C09BA (ACE inhibitors and diuretics) hides a thiazide (reference sheet, verified WHO ATC class).
        Assert.True(thiazide.Matches(new CodeRef(CodeSystems.Atc, "C09BA03")));
        Assert.Equal("hydrochlorothiazide", thiazide.MatchName("lisinopril and hydrochlorothiazide tablet"));
    }
}
