using System.Globalization;
using CdsNatremia.Cli.Commands;

namespace CdsNatremia.Cli.Population;

/// <summary>Writes a population to a folder: patients/&lt;id&gt;.json Bundles and population.json (the index).</summary>
internal static class PopulationWriter
{
    /// <summary>What population.json holds.</summary>
    internal sealed record Summary(int Seed, int Count, string AsOf, IReadOnlyDictionary<string, int> ByBand, IReadOnlyList<Entry> Patients);

    /// <summary>One patient in the index.</summary>
    internal sealed record Entry(string Id, string File, double LatestSodium, string Band, IReadOnlyList<string> Medications, IReadOnlyList<string> Conditions);

    public static Summary Write(string folder, int seed, int count, DateTimeOffset asOf, IProgress<int>? progress)
    {
        var patientsFolder = Path.Combine(folder, "patients");
        Directory.CreateDirectory(patientsFolder);
        var entries = new List<Entry>();
        var byBand = new SortedDictionary<string, int>(StringComparer.Ordinal);
        foreach (var patient in PopulationGenerator.Generate(seed, count, asOf))
        {
            var file = Path.Combine("patients", patient.Id + ".json");
            File.WriteAllText(Path.Combine(folder, file), patient.Bundle.ToJsonString(CommandSupport.Json) + "\n");
            entries.Add(new Entry(patient.Id, file.Replace('\\', '/'), patient.LatestSodium, patient.Band, patient.Medications, patient.Conditions));
            byBand[patient.Band] = byBand.GetValueOrDefault(patient.Band) + 1;
            progress?.Report(entries.Count);
        }

        var summary = new Summary(seed, count, asOf.ToString("yyyy-MM-dd'T'HH:mm:ss'Z'", CultureInfo.InvariantCulture), byBand, entries);
        CommandSupport.WriteJsonFile(Path.Combine(folder, "population.json"), summary);
        return summary;
    }
}
