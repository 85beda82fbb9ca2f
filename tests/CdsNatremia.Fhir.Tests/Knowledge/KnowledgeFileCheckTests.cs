using CdsNatremia.Fhir.Knowledge;

namespace CdsNatremia.Fhir.Tests.Knowledge;

/// <summary>A malformed or invalid knowledge file stops loading with a message that names the file and the problem.</summary>
public class KnowledgeFileCheckTests
{
    private const string Rx = "http://www.nlm.nih.gov/research/umls/rxnorm";
    private const string Atc = "http://www.whocc.no/atc";

    private static string DrugSet(string includes, string extensions = "default", string description = "| RxNorm | `5487` | concept | hydrochlorothiazide | verified |\n| WHO ATC | `C03AA` | is-a class | thiazides | verified |", string url = "https://example.org/fhir/ValueSet/drug-x")
    {
        var ext = extensions == "default"
            ? """[{"url":"https://cdsnatremia.example.org/fhir/StructureDefinition/drug-group-tier","valueCode":"primary"},{"url":"https://cdsnatremia.example.org/fhir/StructureDefinition/drug-group-label","valueString":"test group"}]"""
            : extensions;
        return "{\"resourceType\":\"ValueSet\",\"id\":\"drug-x\",\"extension\":" + ext
            + ",\"url\":\"" + url + "\",\"version\":\"1\",\"status\":\"active\",\"description\":"
            + System.Text.Json.JsonSerializer.Serialize(description)
            + ",\"compose\":{\"include\":[" + includes + "]}}";
    }

    private static string Load(string fileContent, string fileName = "drug-x.json")
    {
        var dir = Directory.CreateTempSubdirectory("natremia-kb-");
        try
        {
            Directory.CreateDirectory(Path.Combine(dir.FullName, "valuesets"));
            File.WriteAllText(Path.Combine(dir.FullName, "valuesets", fileName), fileContent);
            var ex = Assert.Throws<KnowledgeLoadException>(() => KnowledgeLoader.Load(dir.FullName));
            Assert.Contains(fileName, ex.Message, StringComparison.Ordinal);
            return ex.Message;
        }
        finally
        {
            dir.Delete(recursive: true);
        }
    }

    private const string GoodRx = $$"""{"system":"{{Rx}}","concept":[{"code":"5487","display":"hydrochlorothiazide"}]}""";

    [Fact]
    public void Load_AValidDrugSet_Loads()
    {
        var dir = Directory.CreateTempSubdirectory("natremia-kb-");
        try
        {
            Directory.CreateDirectory(Path.Combine(dir.FullName, "valuesets"));
            File.WriteAllText(Path.Combine(dir.FullName, "valuesets", "drug-x.json"), DrugSet(GoodRx));
            Assert.NotNull(KnowledgeLoader.Load(dir.FullName).Base.Find("drug-x"));
        }
        finally
        {
            dir.Delete(recursive: true);
        }
    }

    [Fact]
    public void Load_EmptyFile_Refused()
        => Load(string.Empty);

    [Fact]
    public void Load_ACodeSystemInTheValueSetFolder_Refused()
        => Assert.Contains("expected a ValueSet", Load("""{"resourceType":"CodeSystem","id":"drug-x","url":"https://example.org/cs","status":"active","content":"complete"}"""), StringComparison.Ordinal);

    [Fact]
    public void Load_MissingStatus_Refused()
        => Load(DrugSet(GoodRx).Replace("\"status\":\"active\",", string.Empty, StringComparison.Ordinal));

    [Fact]
    public void Load_UrlNotEndingInTheId_Refused()
        => Assert.Contains("must end with", Load(DrugSet(GoodRx, url: "https://example.org/fhir/ValueSet/other")), StringComparison.Ordinal);

    [Fact]
    public void Load_DrugGroupWithoutTier_Refused()
        => Assert.Contains("drug-group-tier", Load(DrugSet(GoodRx, extensions: """[{"url":"https://cdsnatremia.example.org/fhir/StructureDefinition/drug-group-label","valueString":"x"}]""")), StringComparison.Ordinal);

    [Fact]
    public void Load_DrugGroupWithoutLabel_Refused()
        => Assert.Contains("drug-group-label", Load(DrugSet(GoodRx, extensions: """[{"url":"https://cdsnatremia.example.org/fhir/StructureDefinition/drug-group-tier","valueCode":"primary"}]""")), StringComparison.Ordinal);

    [Fact]
    public void Load_UnknownTier_Refused()
        => Assert.Contains("'tertiary'", Load(DrugSet(GoodRx, extensions: """[{"url":"https://cdsnatremia.example.org/fhir/StructureDefinition/drug-group-tier","valueCode":"tertiary"},{"url":"https://cdsnatremia.example.org/fhir/StructureDefinition/drug-group-label","valueString":"x"}]""")), StringComparison.Ordinal);

    [Fact]
    public void Load_ConceptAndFilterInOneInclude_Refused()
        => Assert.Contains("both concepts and a filter", Load(DrugSet($$"""{"system":"{{Atc}}","concept":[{"code":"C03AA03","display":"hydrochlorothiazide"}],"filter":[{"property":"concept","op":"is-a","value":"C03AA"}]}""")), StringComparison.Ordinal);

    [Fact]
    public void Load_TwoFiltersInOneInclude_Refused()
        => Assert.Contains("AND", Load(DrugSet($$"""{"system":"{{Atc}}","filter":[{"property":"concept","op":"is-a","value":"C03AA"},{"property":"concept","op":"is-a","value":"C09BA"}]}""")), StringComparison.Ordinal);

    [Theory]
    [InlineData(Rx, "548 7")]        // RxNorm ids are digits
    [InlineData(Atc, "N06AB4")]      // a WHO ATC substance code has 7 characters
    [InlineData("http://snomed.info/sct", "38752")] // SNOMED CT ids have at least 6 digits
    public void Load_MalformedCode_Refused(string system, string code)
        => Assert.Contains($"code '{code}'", Load(DrugSet($$"""{"system":"{{system}}","concept":[{"code":"{{code}}","display":"x"}]}""", description: $"| x | `{code}` | concept | x | verified |")), StringComparison.Ordinal);

    [Fact]
    public void Load_TooShortAtcClass_Refused()
        // "C03" (all diuretics) would catch loop and potassium-sparing diuretics too.
        => Assert.Contains("too short", Load(DrugSet($$"""{"system":"{{Atc}}","filter":[{"property":"concept","op":"is-a","value":"C03"}]}""", description: "| WHO ATC | `C03` | is-a | diuretics | verified |")), StringComparison.Ordinal);

    [Fact]
    public void Load_DrugConceptWithoutDisplay_Refused()
        => Assert.Contains("no display", Load(DrugSet($$"""{"system":"{{Rx}}","concept":[{"code":"5487"}]}""")), StringComparison.Ordinal);

    [Fact]
    public void Load_CodeWithoutASourceRow_Refused()
        => Assert.Contains("no row in the description", Load(DrugSet($$"""{"system":"{{Rx}}","concept":[{"code":"5487","display":"hydrochlorothiazide"},{"code":"2409","display":"chlorthalidone"}]}""")), StringComparison.Ordinal);

    [Fact]
    public void Load_UnknownElement_Refused()
        => Assert.Contains("not valid FHIR R4", Load(DrugSet(GoodRx).Replace("\"version\":\"1\"", "\"versoin\":\"1\"", StringComparison.Ordinal)), StringComparison.Ordinal);
}
