using System.Text.Json;
using BenchmarkDotNet.Attributes;
using CdsNatremia.Core.Engine;
using CdsNatremia.Core.Facts;
using CdsNatremia.Fhir.Reading;

namespace CdsNatremia.Benchmarks;

/// <summary>
/// (a) The FHIR layer on the typical prefetch: every prefetch value through <see cref="BundleReader"/> (Firely parse
/// of each entry) and <see cref="FactsAssembler"/>, to <see cref="PatientFacts"/>. The request JSON is parsed once in
/// setup; only the FHIR layer's work is measured.
/// </summary>
[MemoryDiagnoser]
public class PrefetchParsingBenchmarks
{
    private readonly BundleReader _bundles = new(new ResourceParser());
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

    [Benchmark(Description = "Prefetch to PatientFacts (BundleReader + FactsAssembler)")]
    public PatientFacts ReadTypicalPrefetch()
    {
        var values = new List<PrefetchValue>(_prefetch.Length);
        foreach (var (key, value) in _prefetch)
        {
            values.Add(_bundles.Read(key, value, DataOrigin.Prefetch));
        }

        return _assembler.Assemble(_patientId, _now, values, []).Facts;
    }
}
