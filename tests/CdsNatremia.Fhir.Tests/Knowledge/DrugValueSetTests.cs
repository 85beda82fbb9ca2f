using System.Text.RegularExpressions;
using CdsNatremia.Fhir.Knowledge;
using CdsNatremia.Fhir.Tests.Support;
using Hl7.Fhir.Model;
using Hl7.Fhir.Serialization;

namespace CdsNatremia.Fhir.Tests.Knowledge;

/// <summary>
/// Every drug-group ValueSet parses with the Firely SDK (strict mode: unknown elements, wrong types and missing
/// required elements of the FHIR R4 ValueSet definition fail) and holds the project's structure (profiles/README.md).
/// Full profile validation with Firely.Fhir.Validation.R4 was tried offline and works, but took over a minute per run
/// on this machine, so these structural checks stand in for it.
/// </summary>
public class DrugValueSetTests
{
    private static readonly FhirJsonDeserializer Strict = new(new DeserializerSettings().UsingMode(DeserializationMode.Strict));

    public static TheoryData<string> DrugFiles()
    {
        var data = new TheoryData<string>();
        foreach (var file in Profiles.DrugFiles())
        {
            data.Add(Path.GetFileName(file));
        }

        return data;
    }

    private static ValueSet Parse(string fileName)
        => Strict.Deserialize<ValueSet>(File.ReadAllText(Path.Combine(Profiles.Directory(), "valuesets", fileName)));

    [Fact]
    public void DrugFiles_TheGroupsTheIssueNames_ArePresent()
    {
        var names = Profiles.DrugFiles().Select(Path.GetFileName).ToList();
        foreach (var expected in new[] { "drug-thiazide.json", "drug-ssri.json", "drug-carbamazepine-family.json", "drug-desmopressin.json", "drug-snri.json", "drug-tricyclic.json", "drug-loop-diuretic.json", "drug-chemotherapy.json", "drug-proton-pump-inhibitor.json" })
        {
            Assert.Contains(expected, names);
        }
    }

    [Theory]
    [MemberData(nameof(DrugFiles))]
    public void Parse_WithTheFirelySdk_IsAValueSetWithOurMetadata(string fileName)
    {
        var valueSet = Parse(fileName);
        Assert.Equal(Path.GetFileNameWithoutExtension(fileName), valueSet.Id);
        Assert.Equal(KnowledgeExtensions.Base + "/ValueSet/" + valueSet.Id, valueSet.Url);
        Assert.False(string.IsNullOrWhiteSpace(valueSet.Version));
        Assert.Equal("CdsNatremia knowledge maintainers", valueSet.Publisher);
        Assert.Equal(PublicationStatus.Active, valueSet.Status);
        Assert.Contains(valueSet.GetStringExtension(KnowledgeExtensions.DrugGroupTier) ?? (valueSet.GetExtension(KnowledgeExtensions.DrugGroupTier)?.Value as Code)?.Value, new[] { "primary", "secondary" });
        Assert.False(string.IsNullOrWhiteSpace(valueSet.GetStringExtension(KnowledgeExtensions.DrugGroupLabel)));
    }

    [Theory]
    [MemberData(nameof(DrugFiles))]
    public void Parse_EveryIncludeIsConceptsOrOneFilter_NeverAWholeCodeSystem(string fileName)
    {
        foreach (var include in Parse(fileName).Compose!.Include)
        {
            // FHIR R4 ValueSet invariant vsd-3: concept and filter are not combined; one filter per class (README).
            Assert.True(include.Concept.Count > 0 ^ include.Filter.Count > 0, $"{fileName}: include of {include.System}");
            Assert.True(include.Filter.Count <= 1, $"{fileName}: more than one filter");
            Assert.All(include.Filter, f => Assert.Equal(FilterOperator.IsA, f.Op));
        }
    }

    [Theory]
    [MemberData(nameof(DrugFiles))]
    public void Parse_EveryCodeHasARowWithAStatusWord(string fileName)
    {
        var valueSet = Parse(fileName);
        var rows = DescriptionTable.Rows(valueSet.Description);
        var codes = valueSet.Compose!.Include.SelectMany(i => i.Concept.Select(c => c.Code).Concat(i.Filter.Select(f => f.Value))).OfType<string>().ToList();
        Assert.NotEmpty(codes);
        foreach (var code in codes)
        {
            Assert.True(rows.TryGetValue(code, out var status), $"{fileName}: no row for {code}");
            // Status words of the reference sheet: verified, secondary, from memory (common practice is not used for codes).
            Assert.Matches(new Regex("^(verified|secondary|from memory)", RegexOptions.CultureInvariant), status);
        }
    }
}
