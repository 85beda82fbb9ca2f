using CdsNatremia.Fhir.Knowledge;
using CdsNatremia.Service.Tests.Support;

namespace CdsNatremia.Service.Tests.Drugs;

/// <summary>A bad knowledge file stops the real service at start-up, with the file and the problem named.</summary>
public class KnowledgeStartupTests
{
    [Fact]
    public void Startup_DrugSetWithAMalformedAtcCode_StopsNamingFileAndProblem()
    {
        var dir = Directory.CreateTempSubdirectory("natremia-kb-");
        try
        {
            Directory.CreateDirectory(Path.Combine(dir.FullName, "valuesets"));
            // "N06AB4" is a typo for an SSRI's 7-character ATC code (e.g. N06AB04 citalopram, reference sheet).
            File.WriteAllText(Path.Combine(dir.FullName, "valuesets", "drug-ssri.json"), """
                {"resourceType":"ValueSet","id":"drug-ssri",
                 "extension":[{"url":"https://cdsnatremia.example.org/fhir/StructureDefinition/drug-group-tier","valueCode":"primary"},
                              {"url":"https://cdsnatremia.example.org/fhir/StructureDefinition/drug-group-label","valueString":"SSRI"}],
                 "url":"https://cdsnatremia.example.org/fhir/ValueSet/drug-ssri","version":"1","status":"active",
                 "description":"| WHO ATC | `N06AB4` | concept | citalopram | verified |",
                 "compose":{"include":[{"system":"http://www.whocc.no/atc","concept":[{"code":"N06AB4","display":"citalopram"}]}]}}
                """);
            using var factory = NatremiaFactory.With(new() { ["Natremia:KnowledgeDirectory"] = dir.FullName });
            var ex = Record.Exception(() => factory.CreateClient());
            var load = FindLoadException(ex);
            Assert.NotNull(load);
            Assert.Contains("drug-ssri.json", load.Message, StringComparison.Ordinal);
            Assert.Contains("'N06AB4' is not a well-formed WHO ATC code", load.Message, StringComparison.Ordinal);
        }
        finally
        {
            dir.Delete(recursive: true);
        }
    }

    private static KnowledgeLoadException? FindLoadException(Exception? ex)
    {
        for (var e = ex; e is not null; e = e.InnerException)
        {
            if (e is KnowledgeLoadException load)
            {
                return load;
            }

            if (e is AggregateException aggregate && aggregate.InnerExceptions.Select(FindLoadException).FirstOrDefault(x => x is not null) is { } found)
            {
                return found;
            }
        }

        return null;
    }
}
