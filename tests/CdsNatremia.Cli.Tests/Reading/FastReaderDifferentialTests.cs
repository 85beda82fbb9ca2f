using System.Text;
using System.Text.Json;
using System.Text.Json.Nodes;
using CdsNatremia.Cli.Population;
using CdsNatremia.Cli.Tests.Support;
using CdsNatremia.Core.Engine;
using CdsNatremia.Core.Facts;
using CdsNatremia.Fhir.Reading;
using CdsNatremia.Scenarios;
using Xunit.Abstractions;

namespace CdsNatremia.Cli.Tests.Reading;

/// <summary>
/// The fast prefetch reader (<see cref="FastResourceReader"/>, tried first by <see cref="BundleReader"/>) held equal to
/// the FHIR SDK path: both read the same request (prefetch and hook context, as the service does) and must give
/// structurally identical facts, draft orders, data notes and set-aside reasons, over every scenario of the library, a
/// synthetic population, and a corpus of malformed and hostile inputs derived from valid resources. It lives here, beside
/// the population generator it needs. Each test also checks that the fast reader took most resources of the valid
/// inputs, so that "identical" cannot come from a fast reader that never reads anything.
/// </summary>
public sealed class FastReaderDifferentialTests(ITestOutputHelper output)
{
    private static readonly BundleReader Sdk = new(new ResourceParser());
    private static readonly BundleReader Fast = new(new ResourceParser(), new FastResourceReader());
    private static readonly FactsAssembler Assembler = new(new RuleOptions().Reading);

    [Fact]
    public void Read_EveryScenario_IdenticalFactsAndSetAsideReasons()
    {
        var coverage = new Coverage();
        foreach (var scenario in ScenarioLibrary.All)
        {
            var request = HookRequestBuilder.Build(scenario, scenario.Hook == "result" ? "org.example.lab-result-arrive" : scenario.Hook, TimeSpan.Zero, Guid.NewGuid());
            AssertSame($"scenario {scenario.Id}", request, scenario.PatientId, ScenarioLibrary.Anchor, coverage);
        }

        output.WriteLine(coverage.ToString());
        Assert.True(coverage.FastShare >= 0.9, $"the fast reader took only {coverage}");
    }

    [Fact]
    public void Read_SyntheticPopulation_IdenticalFactsAndSetAsideReasons()
    {
        var coverage = new Coverage();
        foreach (var patient in PopulationGenerator.Generate(seed: 19, count: 300, ScenarioLibrary.Anchor))
        {
            var resources = patient.Bundle["entry"]!.AsArray().Select(e => e!["resource"]!.AsObject()).ToList();
            var request = new JsonObject { ["prefetch"] = HookRequestBuilder.Prefetch(resources) };
            AssertSame($"population patient {patient.Id}", request, patient.Id, ScenarioLibrary.Anchor, coverage);
        }

        output.WriteLine(coverage.ToString());
        Assert.True(coverage.FastShare >= 0.9, $"the fast reader took only {coverage}");
    }

    [Fact]
    public void Read_TypicalPrefetch_IdenticalFactsAndEveryResourceReadFast()
    {
        var coverage = new Coverage();
        var request = TypicalPrefetch.Request(ScenarioLibrary.Anchor, Guid.NewGuid());
        AssertSame("typical prefetch", request, TypicalPrefetch.PatientId, ScenarioLibrary.Anchor, coverage);
        Assert.Equal(0, coverage.Sdk); // the benchmarked request stays entirely on the fast path
        Assert.True(coverage.Fast > 50, coverage.ToString());
    }

    [Fact]
    public void Read_MalformedAndHostileCorpus_IdenticalFactsAndSetAsideReasons()
    {
        var coverage = new Coverage();
        var cases = 0;
        var failures = new List<string>();
        foreach (var (name, prefetch) in HostileCorpus.Cases())
        {
            cases++;
            try
            {
                AssertSame(name, new JsonObject { ["prefetch"] = prefetch }, HostileCorpus.PatientId, ScenarioLibrary.Anchor, coverage, raw: true);
            }
            catch (Exception ex) when (ex is not OutOfMemoryException)
            {
                failures.Add(name + ": " + ex.GetType().Name + ": " + ex.Message.Split('\n')[0] + " | " + ex.StackTrace?.Split('\n').FirstOrDefault()?.Trim());
            }
        }

        output.WriteLine($"{cases} cases; {coverage}");
        Assert.True(failures.Count == 0, $"{failures.Count} of {cases} cases failed:\n" + string.Join("\n", failures.Take(60)));
        Assert.True(cases > 500, $"only {cases} corpus cases");
        Assert.True(coverage.Sdk > 100, "the corpus should send many entries to the SDK path: " + coverage); // the fallback is exercised
        Assert.True(coverage.Fast > 100, "the corpus should keep many entries on the fast path: " + coverage); // and so is the fast path
    }

    [Fact]
    public void Differences_OneValueChanged_NamesThePathAndBothValues()
    {
        // The comparison itself must be able to fail, readably.
        var request = HookRequestBuilder.Build(ScenarioLibrary.Find("01")!, "patient-view", TimeSpan.Zero, Guid.NewGuid());
        using var document = JsonDocument.Parse(request.ToJsonString());
        var facts = Read(Sdk, document.RootElement, "s01-pt", ScenarioLibrary.Anchor);
        var changed = facts with { Facts = facts.Facts with { Labs = [.. facts.Facts.Labs.Select((l, i) => i == 0 ? l with { Value = l.Value + 1 } : l)] } };

        var differences = FactsComparison.Differences(facts, changed);

        var difference = Assert.Single(differences);
        Assert.StartsWith("facts.Facts.Labs[0].Value: ", difference, StringComparison.Ordinal);
    }

    [Fact]
    public void HostileCorpus_MarkedName_WrittenWithItsFirstLetterEscapedAndReadBackAsTheSameName()
    {
        // JSON (RFC 8259, section 7): "\u0069d" is the name "id"; the corpus uses it to reach the readers' unescaping path.
        var text = HostileCorpus.Serialize(new JsonObject { ["\u0002id"] = "x" });

        Assert.Equal("{\"\\u0069d\":\"x\"}", text);
        using var document = JsonDocument.Parse(text);
        Assert.Equal("x", document.RootElement.GetProperty("id").GetString());
    }

    private static void AssertSame(string name, JsonObject request, string patientId, DateTimeOffset now, Coverage coverage, bool raw = false)
    {
        var text = raw ? HostileCorpus.Serialize(request) : request.ToJsonString();
        using var document = JsonDocument.Parse(text, new JsonDocumentOptions { MaxDepth = 256 });
        coverage.Count(document.RootElement);
        var sdk = Read(Sdk, document.RootElement, patientId, now);
        var fast = Read(Fast, document.RootElement, patientId, now);
        var differences = FactsComparison.Differences(sdk, fast);
        Assert.True(differences.Count == 0, $"{name}: the fast path differs from the SDK path (left SDK, right fast):\n  " + string.Join("\n  ", differences.Take(20)) + "\ninput: " + Shorten(text));
    }

    /// <summary>What the service reads from a request: every prefetch value, and the Bundles of the hook context.</summary>
    private static AssembledFacts Read(BundleReader reader, JsonElement root, string patientId, DateTimeOffset now)
    {
        var values = new List<PrefetchValue>();
        if (root.TryGetProperty("prefetch", out var prefetch) && prefetch.ValueKind == JsonValueKind.Object)
        {
            foreach (var property in prefetch.EnumerateObject())
            {
                values.Add(reader.Read(property.Name, property.Value, DataOrigin.Prefetch));
            }
        }

        var context = new List<ParsedResource>();
        var unreadable = new List<UnreadableObservation>();
        if (root.TryGetProperty("context", out var ctx) && ctx.ValueKind == JsonValueKind.Object)
        {
            foreach (var field in ctx.EnumerateObject().Where(f => f.Value.ValueKind == JsonValueKind.Object))
            {
                var value = reader.Read("context." + field.Name, field.Value, DataOrigin.Context);
                context.AddRange(value.Resources.Select(r => r with { Source = "context." + field.Name }));
                unreadable.AddRange(value.UnreadableObservations);
            }
        }

        return Assembler.Assemble(patientId, now, values, context, unreadable);
    }

    private static string Shorten(string text) => text.Length <= 3000 ? text : text[..3000] + "…";

    /// <summary>How many resources of the inputs the fast reader took, and how many it left to the SDK.</summary>
    private sealed class Coverage
    {
        private static readonly FastResourceReader Reader = new();

        public int Fast { get; private set; }

        public int Sdk { get; private set; }

        public double FastShare => Fast + Sdk == 0 ? 0 : (double)Fast / (Fast + Sdk);

        public void Count(JsonElement root)
        {
            foreach (var section in new[] { "prefetch", "context" })
            {
                if (!root.TryGetProperty(section, out var values) || values.ValueKind != JsonValueKind.Object)
                {
                    continue;
                }

                foreach (var value in values.EnumerateObject().Select(p => p.Value))
                {
                    foreach (var resource in Resources(value))
                    {
                        if (Reader.TryRead(resource) is null)
                        {
                            Sdk++;
                        }
                        else
                        {
                            Fast++;
                        }
                    }
                }
            }
        }

        public override string ToString() => $"fast {Fast}, SDK {Sdk} ({FastShare:P1} fast)";

        private static IEnumerable<JsonElement> Resources(JsonElement value)
        {
            if (value.ValueKind != JsonValueKind.Object)
            {
                yield break;
            }

            var isBundle = value.TryGetProperty("resourceType", out var type) && type.ValueKind == JsonValueKind.String && type.GetString() == "Bundle";
            if (isBundle && value.TryGetProperty("entry", out var entries) && entries.ValueKind == JsonValueKind.Array)
            {
                foreach (var entry in entries.EnumerateArray())
                {
                    if (entry.ValueKind == JsonValueKind.Object && entry.TryGetProperty("resource", out var resource) && resource.ValueKind == JsonValueKind.Object)
                    {
                        yield return resource;
                    }
                }
            }
            else if (!isBundle && value.TryGetProperty("resourceType", out _))
            {
                yield return value;
            }
        }
    }
}
