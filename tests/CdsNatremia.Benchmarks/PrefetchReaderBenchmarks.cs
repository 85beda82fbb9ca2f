using System.Text.Json;
using BenchmarkDotNet.Attributes;
using CdsNatremia.Core.Engine;
using CdsNatremia.Core.Facts;
using CdsNatremia.Fhir.Reading;

namespace CdsNatremia.Benchmarks;

/// <summary>
/// (a2) Prefetch reading, the FHIR SDK against the fast reader, on the typical prefetch: each prefetch value through
/// <see cref="BundleReader"/> (parse only), and the same through <see cref="FactsAssembler"/> to <see cref="PatientFacts"/>.
/// The SDK rows are the baseline; the fast reader takes every resource of the typical prefetch (checked by
/// FastReaderDifferentialTests), so its rows time the fast path alone.
/// </summary>
[MemoryDiagnoser]
[GroupBenchmarksBy(BenchmarkDotNet.Configs.BenchmarkLogicalGroupRule.ByCategory)]
[CategoriesColumn]
public class PrefetchReaderBenchmarks
{
    private readonly BundleReader _sdk = new(new ResourceParser());
    private readonly BundleReader _fast = new(new ResourceParser(), new FastResourceReader());
    private readonly FactsAssembler _assembler = new(new RuleOptions().Reading);
    private JsonDocument? _document;
    private (string Key, JsonElement Value)[] _prefetch = [];
    private string _patientId = string.Empty;
    private DateTimeOffset _now;

    [GlobalSetup]
    public void Setup()
    {
        _now = DateTimeOffset.UtcNow;
        _document = JsonDocument.Parse(TypicalRequest.Utf8(_now));
        var root = _document.RootElement;
        _patientId = root.GetProperty("context").GetProperty("patientId").GetString()!;
        _prefetch = root.GetProperty("prefetch").EnumerateObject().Select(p => (p.Name, p.Value)).ToArray();
    }

    [GlobalCleanup]
    public void Cleanup() => _document?.Dispose();

    [Benchmark(Baseline = true, Description = "Read prefetch: SDK (Firely)")]
    [BenchmarkCategory("read")]
    public int ReadSdk() => Read(_sdk).Sum(v => v.Resources.Count);

    [Benchmark(Description = "Read prefetch: fast reader")]
    [BenchmarkCategory("read")]
    public int ReadFast() => Read(_fast).Sum(v => v.Resources.Count);

    [Benchmark(Baseline = true, Description = "Read + assemble facts: SDK (Firely)")]
    [BenchmarkCategory("facts")]
    public PatientFacts FactsSdk() => _assembler.Assemble(_patientId, _now, Read(_sdk), []).Facts;

    [Benchmark(Description = "Read + assemble facts: fast reader")]
    [BenchmarkCategory("facts")]
    public PatientFacts FactsFast() => _assembler.Assemble(_patientId, _now, Read(_fast), []).Facts;

    private List<PrefetchValue> Read(BundleReader reader)
    {
        var values = new List<PrefetchValue>(_prefetch.Length);
        foreach (var (key, value) in _prefetch)
        {
            values.Add(reader.Read(key, value, DataOrigin.Prefetch));
        }

        return values;
    }
}
