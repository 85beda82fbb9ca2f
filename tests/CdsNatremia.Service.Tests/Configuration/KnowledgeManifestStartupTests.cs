using System.Text.Json;
using CdsNatremia.Service.Tests.Support;

namespace CdsNatremia.Service.Tests.Configuration;

/// <summary>Knowledge cannot silently go missing: a file missing from the manifest's list stops the real process; /readyz shows the manifest version.</summary>
public sealed class KnowledgeManifestStartupTests(NatremiaFactory factory) : IClassFixture<NatremiaFactory>
{
    [Fact]
    public async Task Readyz_Loaded_ShowsTheKnowledgeManifestVersion()
    {
        using var ready = JsonDocument.Parse(await factory.CreateClient().GetStringAsync("/readyz"));

        Assert.Equal("ready", ready.RootElement.GetProperty("status").GetString());
        Assert.Equal("1.1.0", ready.RootElement.GetProperty("knowledgeManifestVersion").GetString());
    }

    [Fact]
    public async Task Start_KnowledgeFileDeleted_ProcessRefusesNamingTheFile()
    {
        var copy = Directory.CreateTempSubdirectory("natremia-profiles-");
        try
        {
            var source = Path.Combine(AppContext.BaseDirectory, "profiles");
            foreach (var file in Directory.EnumerateFiles(source, "*.json", SearchOption.AllDirectories))
            {
                var target = Path.Combine(copy.FullName, Path.GetRelativePath(source, file));
                Directory.CreateDirectory(Path.GetDirectoryName(target)!);
                File.Copy(file, target);
            }

            File.Delete(Path.Combine(copy.FullName, "valuesets", "drug-snri.json"));
            await using var service = ServiceProcess.Start("Development", new Dictionary<string, string?> { ["Natremia:KnowledgeDirectory"] = copy.FullName });

            var exit = await service.WaitForExitAsync(TimeSpan.FromSeconds(90));

            Assert.Equal(78, exit);
            var line = Assert.Single(service.StandardError.Trim().Split('\n', StringSplitOptions.RemoveEmptyEntries));
            Assert.StartsWith("crit: CdsNatremia.Service refused to start: Natremia:KnowledgeDirectory:", line, StringComparison.Ordinal);
            Assert.Contains("'valuesets/drug-snri.json' (https://cdsnatremia.example.org/fhir/ValueSet/drug-snri version 1.0.0) is listed but missing", line, StringComparison.Ordinal);
            Assert.DoesNotContain("Unhandled exception", service.StandardError + service.StandardOutput, StringComparison.Ordinal);
        }
        finally
        {
            copy.Delete(recursive: true);
        }
    }
}
