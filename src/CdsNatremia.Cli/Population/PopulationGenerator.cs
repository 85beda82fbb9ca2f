using System.Globalization;
using System.Text.Json.Nodes;

namespace CdsNatremia.Cli.Population;

/// <summary>
/// Generates synthetic adult patients from a seed: same seed, count and as-of → byte-identical Bundles. The mix is
/// invented to be plausible for a hospital laboratory population, not drawn from data: about one result in six below
/// 135 mmol/L (low sodium is the commonest electrolyte disorder in inpatients; common practice), most of them mild;
/// 1 to 5 sodium results over 30 days drifting from a normal baseline; glucose, urea nitrogen, potassium and creatinine
/// with most results; osmolality and urine studies sent for about half of the low results; thiazides, SSRIs,
/// carbamazepine, loop diuretics and proton pump inhibitors; and the condition clues the service knows.
/// A few results are preliminary, older than the stale limit, or entered in error, as real feeds have.
/// </summary>
internal static class PopulationGenerator
{
    /// <summary>Largest population one run may generate.</summary>
    public const int MaxCount = 100_000;

    /// <summary>Generates <paramref name="count"/> patients for the seed, their data timed before <paramref name="asOf"/>.</summary>
    public static IEnumerable<GeneratedPatient> Generate(int seed, int count, DateTimeOffset asOf)
    {
        if (count is < 0 or > MaxCount)
        {
            throw new ToolException(ExitCodes.Usage, $"--count must be between 0 and {MaxCount}.");
        }

        for (var i = 0; i < count; i++)
        {
            // One generator per patient, seeded from (seed, index): patient i is the same whatever the count.
            var random = new SplitMix64(((ulong)(uint)seed << 32) ^ (ulong)i ^ 0x5DEECE66DUL);
            yield return One(random, $"pop-{seed.ToString(CultureInfo.InvariantCulture)}-{i.ToString("D5", CultureInfo.InvariantCulture)}", asOf);
        }
    }

    private static GeneratedPatient One(SplitMix64 random, string id, DateTimeOffset asOf)
    {
        var entries = new JsonArray();
        var female = random.Chance(0.52);
        var age = random.Chance(0.55) ? random.Between(65, 95) : random.Between(18, 64);
        var birth = asOf.AddYears(-age).AddDays(-random.Between(0, 364));
        entries.Add(Entry(new JsonObject
        {
            ["resourceType"] = "Patient",
            ["id"] = id,
            ["name"] = new JsonArray(new JsonObject { ["text"] = "Synthetic patient " + id }),
            ["gender"] = female ? "female" : "male",
            ["birthDate"] = birth.ToString("yyyy-MM-dd", CultureInfo.InvariantCulture),
        }));

        var roll = random.NextDouble();
        var (band, latest) = roll switch
        {
            < 0.03 => ("profound", Math.Round(random.Between(110.0, 125.0))),
            < 0.08 => ("moderate", Math.Round(random.Between(125.0, 130.0))),
            < 0.17 => ("mild", Math.Round(random.Between(130.0, 135.0))),
            _ => ("normal", Math.Round(random.Between(135.0, 145.0))),
        };
        band = latest switch { < 125 => "profound", < 130 => "moderate", < 135 => "mild", _ => "normal" };

        // The newest result: mostly within the last day, some older than the 72 h stale limit.
        var latestAt = asOf.AddMinutes(-(random.Chance(0.85) ? random.Between(60, 24 * 60) : random.Between(73 * 60, 10 * 24 * 60)));
        var baseline = Math.Round(random.Between(136.0, 142.0));
        var earlier = random.Between(0, 4);
        var n = 0;
        for (var k = earlier; k >= 1; k--)
        {
            var at = latestAt.AddHours(-k * random.Between(12, 24 * 7));
            var value = Math.Round(latest + ((baseline - latest) * k / (earlier + 1.0)) + random.Between(-1.0, 1.0));
            var status = random.Chance(0.02) ? "entered-in-error" : "final";
            entries.Add(Entry(Lab(id, ++n, random.Chance(0.1) ? "sodium-blood" : "sodium", value, at, status)));
        }

        entries.Add(Entry(Lab(id, ++n, "sodium", latest, latestAt, random.Chance(0.03) ? "preliminary" : "final")));

        if (random.Chance(0.9))
        {
            var hyperglycaemic = random.Chance(0.04);
            var glucose = Math.Round(hyperglycaemic ? random.Between(300.0, 700.0) : random.Between(70.0, 160.0));
            var bun = Math.Round(random.Between(7.0, 35.0));
            entries.Add(Entry(Lab(id, ++n, "glucose", glucose, latestAt, "final")));
            entries.Add(Entry(Lab(id, ++n, "urea-nitrogen", bun, latestAt, "final")));
            entries.Add(Entry(Lab(id, ++n, "potassium", Math.Round(random.Chance(0.1) ? random.Between(2.6, 3.5) : random.Between(3.5, 5.1), 1), latestAt, "final")));
            entries.Add(Entry(Lab(id, ++n, "creatinine", Math.Round(random.Between(0.5, 2.2), 2), latestAt, "final")));
            if (band != "normal" && random.Chance(0.5))
            {
                // Measured osmolality near the calculated one, 2 × Na + glucose/18 + BUN/2.8 (US units; reference sheet, secondary).
                var calculated = (2 * latest) + (glucose / 18) + (bun / 2.8);
                entries.Add(Entry(Lab(id, ++n, "serum-osmolality", Math.Round(calculated + random.Between(-4.0, 12.0)), latestAt, "final")));
            }

            if (band != "normal" && random.Chance(0.45))
            {
                entries.Add(Entry(Lab(id, ++n, "urine-osmolality", Math.Round(random.Between(60.0, 700.0)), latestAt, "final")));
                entries.Add(Entry(Lab(id, ++n, "urine-sodium", Math.Round(random.Between(10.0, 120.0)), latestAt, "final")));
            }

            if (random.Chance(0.08))
            {
                entries.Add(Entry(Lab(id, ++n, "thyrotropin", Math.Round(random.Between(0.4, 6.0), 2), latestAt.AddDays(-random.Between(0, 20)), "final")));
            }

            if (random.Chance(0.01))
            {
                entries.Add(Entry(Lab(id, ++n, "triglyceride", Math.Round(random.Between(1000.0, 3000.0)), latestAt, "final")));
            }
        }

        var medications = new List<string>();
        var lowSodium = band != "normal";
        foreach (var (code, name, group) in PopulationCodes.Medications)
        {
            var p = group switch
            {
                "thiazide" => lowSodium ? 0.07 : 0.03,
                "ssri" => lowSodium ? 0.04 : 0.02,
                "carbamazepine" => lowSodium ? 0.03 : 0.005,
                "loop-diuretic" => 0.08,
                _ => 0.06,
            };
            if (!random.Chance(p))
            {
                continue;
            }

            medications.Add(name);
            entries.Add(Entry(new JsonObject
            {
                ["resourceType"] = "MedicationStatement",
                ["id"] = $"{id}-med-{medications.Count.ToString(CultureInfo.InvariantCulture)}",
                ["status"] = "active",
                ["medicationCodeableConcept"] = new JsonObject
                {
                    ["coding"] = new JsonArray(new JsonObject { ["system"] = PopulationCodes.RxNorm, ["code"] = code, ["display"] = name }),
                    ["text"] = name,
                },
                ["subject"] = new JsonObject { ["reference"] = "Patient/" + id },
                ["effectivePeriod"] = new JsonObject { ["start"] = Instant(latestAt.AddDays(-random.Between(7, 2000))) },
            }));
        }

        var conditions = new List<string>();
        foreach (var (code, name) in PopulationCodes.Conditions)
        {
            if (!random.Chance(lowSodium ? 0.06 : 0.03))
            {
                continue;
            }

            conditions.Add(name);
            entries.Add(Entry(new JsonObject
            {
                ["resourceType"] = "Condition",
                ["id"] = $"{id}-cond-{conditions.Count.ToString(CultureInfo.InvariantCulture)}",
                ["clinicalStatus"] = Concept("http://terminology.hl7.org/CodeSystem/condition-clinical", "active"),
                ["verificationStatus"] = Concept("http://terminology.hl7.org/CodeSystem/condition-ver-status", "confirmed"),
                ["code"] = new JsonObject
                {
                    ["coding"] = new JsonArray(new JsonObject { ["system"] = PopulationCodes.Snomed, ["code"] = code, ["display"] = name }),
                    ["text"] = name,
                },
                ["subject"] = new JsonObject { ["reference"] = "Patient/" + id },
                ["onsetDateTime"] = Instant(latestAt.AddDays(-random.Between(3, 3000))),
            }));
        }

        var bundle = new JsonObject { ["resourceType"] = "Bundle", ["id"] = id, ["type"] = "collection", ["entry"] = entries };
        return new GeneratedPatient(id, bundle, latest, band, medications, conditions);
    }

    private static JsonObject Lab(string patientId, int n, string kind, double value, DateTimeOffset at, string status)
    {
        var (code, display, unit) = PopulationCodes.Labs[kind];
        return new JsonObject
        {
            ["resourceType"] = "Observation",
            ["id"] = $"{patientId}-lab-{n.ToString(CultureInfo.InvariantCulture)}",
            ["status"] = status,
            ["category"] = new JsonArray(Concept("http://terminology.hl7.org/CodeSystem/observation-category", "laboratory")),
            ["code"] = new JsonObject { ["coding"] = new JsonArray(new JsonObject { ["system"] = PopulationCodes.Loinc, ["code"] = code, ["display"] = display }) },
            ["subject"] = new JsonObject { ["reference"] = "Patient/" + patientId },
            ["effectiveDateTime"] = Instant(at),
            ["issued"] = Instant(at.AddMinutes(45)),
            ["valueQuantity"] = new JsonObject { ["value"] = value, ["unit"] = unit, ["system"] = "http://unitsofmeasure.org", ["code"] = unit },
        };
    }

    private static JsonObject Concept(string system, string code)
        => new() { ["coding"] = new JsonArray(new JsonObject { ["system"] = system, ["code"] = code }) };

    private static JsonObject Entry(JsonObject resource)
        => new() { ["fullUrl"] = $"https://ehr.example.org/fhir/{(string?)resource["resourceType"]}/{(string?)resource["id"]}", ["resource"] = resource };

    private static string Instant(DateTimeOffset at) => at.ToUniversalTime().ToString("yyyy-MM-dd'T'HH:mm:ss'Z'", CultureInfo.InvariantCulture);
}
