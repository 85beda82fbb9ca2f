using System.Text.Json.Nodes;
using CdsNatremia.Cli.Population;
using CdsNatremia.Cli.Tests.Support;
using CdsNatremia.Scenarios;

namespace CdsNatremia.Cli.Tests.Population;

public class PopulationGeneratorTests(NatremiaFactory factory) : IClassFixture<NatremiaFactory>
{
    [Fact]
    public void Write_SameSeed_ByteIdenticalFiles()
    {
        var a = Folder();
        var b = Folder();
        try
        {
            PopulationWriter.Write(a, seed: 42, count: 60, ScenarioLibrary.Anchor, null);
            PopulationWriter.Write(b, seed: 42, count: 60, ScenarioLibrary.Anchor, null);
            var files = Directory.GetFiles(a, "*.json", SearchOption.AllDirectories).Select(f => Path.GetRelativePath(a, f)).Order().ToList();
            Assert.Equal(61, files.Count);
            Assert.All(files, f => Assert.Equal(File.ReadAllBytes(Path.Combine(a, f)), File.ReadAllBytes(Path.Combine(b, f))));
        }
        finally
        {
            Directory.Delete(a, true);
            Directory.Delete(b, true);
        }
    }

    [Fact]
    public void Generate_DifferentSeed_DifferentPatients()
    {
        var one = PopulationGenerator.Generate(1, 20, ScenarioLibrary.Anchor).Select(p => p.Bundle.ToJsonString()).ToList();
        var two = PopulationGenerator.Generate(2, 20, ScenarioLibrary.Anchor).Select(p => p.Bundle.ToJsonString()).ToList();
        Assert.NotEqual(one, two);
    }

    [Fact]
    public void Generate_PatientDoesNotDependOnCount()
        => Assert.Equal(
            PopulationGenerator.Generate(5, 3, ScenarioLibrary.Anchor).Last().Bundle.ToJsonString(),
            PopulationGenerator.Generate(5, 10, ScenarioLibrary.Anchor).ElementAt(2).Bundle.ToJsonString());

    [Fact]
    public void Generate_Thousand_EveryBandPresentAndBandMatchesTheLatestSodium()
    {
        var patients = PopulationGenerator.Generate(7, 1000, ScenarioLibrary.Anchor).ToList();
        var bands = patients.GroupBy(p => p.Band).ToDictionary(g => g.Key, g => g.Count());
        Assert.Equal(["mild", "moderate", "normal", "profound"], bands.Keys.Order());
        Assert.InRange(bands["normal"], 750, 900); // about five in six normal, as documented on the generator
        foreach (var p in patients)
        {
            // 2014 European guideline bands (Spasovski et al.): profound < 125, moderate 125–129, mild 130–134, normal ≥ 135.
            var expected = p.LatestSodium switch { < 125 => "profound", < 130 => "moderate", < 135 => "mild", _ => "normal" };
            Assert.Equal(expected, p.Band);
        }
    }

    [Fact]
    public void Generate_EveryCodeComesFromTheReferenceSheetOrProfiles()
    {
        // LOINC codes of the clinical reference sheet's LOINC table (all "verified" there).
        string[] sheetLoinc = ["2951-2", "2947-0", "2823-3", "2345-7", "3094-0", "2160-0", "2692-2", "2695-5", "2955-3", "3016-3", "2571-8"];
        var profileCodes = ProfileCodes();
        foreach (var patient in PopulationGenerator.Generate(11, 300, ScenarioLibrary.Anchor))
        {
            foreach (var resource in ((JsonArray)patient.Bundle["entry"]!).Select(e => e!["resource"]!))
            {
                var coding = (resource["code"] ?? resource["medicationCodeableConcept"])?["coding"]?[0];
                if (coding is null)
                {
                    continue;
                }

                var (system, code) = ((string)coding["system"]!, (string)coding["code"]!);
                Assert.True(system == "http://loinc.org" ? sheetLoinc.Contains(code) : profileCodes.Contains((system, code)), $"{system}|{code}");
            }
        }
    }

    [Fact]
    public async Task Survey_InTheService_CountsCardsPerThousand()
    {
        var report = await PopulationSurvey.RunAsync(factory.CreateClient(), seed: 9, count: 120, ScenarioLibrary.Anchor, null, CancellationToken.None);
        Assert.Empty(report.Failures);
        var low = report.PatientsByBand.Where(kv => kv.Key != "normal").Sum(kv => kv.Value);
        Assert.True(report.PatientsWithCards >= low * 0.8, $"{report.PatientsWithCards} patients with cards, {low} with low sodium");
        Assert.Equal(Math.Round(report.Cards * 1000.0 / 120, 1), report.CardsPer1000);
        Assert.InRange(report.Per1000ByIndicator.Values.Sum() - report.CardsPer1000, -0.2, 0.2); // each figure rounded to 0.1
    }

    private static HashSet<(string, string)> ProfileCodes()
    {
        var dir = new DirectoryInfo(AppContext.BaseDirectory);
        while (!Directory.Exists(Path.Combine(dir!.FullName, "profiles", "valuesets")))
        {
            dir = dir.Parent;
        }

        var codes = new HashSet<(string, string)>();
        foreach (var file in Directory.GetFiles(Path.Combine(dir.FullName, "profiles", "valuesets"), "*.json"))
        {
            foreach (var include in (JsonArray?)JsonNode.Parse(File.ReadAllText(file))!["compose"]?["include"] ?? [])
            {
                foreach (var concept in (JsonArray?)include!["concept"] ?? [])
                {
                    codes.Add(((string)include["system"]!, (string)concept!["code"]!));
                }
            }
        }

        return codes;
    }

    private static string Folder() => Path.Combine(Path.GetTempPath(), "natremia-pop-" + Guid.NewGuid().ToString("N"));
}
