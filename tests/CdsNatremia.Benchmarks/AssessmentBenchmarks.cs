using System.Text.Json;
using BenchmarkDotNet.Attributes;
using CdsNatremia.Core.Cards;
using CdsNatremia.Core.Engine;
using CdsNatremia.Fhir.Knowledge;
using CdsNatremia.Fhir.Reading;
using CdsNatremia.Service.Knowledge;

namespace CdsNatremia.Benchmarks;

/// <summary>
/// (b) The assessment alone on already-parsed facts: <see cref="DecisionEngine.Decide"/> with the real knowledge
/// from profiles/ and <see cref="CardProducers.Default"/>. Target: at most 20 µs per patient (issue 10).
/// </summary>
[MemoryDiagnoser]
public class AssessmentBenchmarks
{
    private DecisionEngine? _engine;
    private DecisionRequest? _request;

    [GlobalSetup]
    public void Setup()
    {
        var now = DateTimeOffset.UtcNow;
        var options = new RuleOptions();
        var knowledge = KnowledgeLoader.Load(KnowledgeDirectory.Resolve(null, AppContext.BaseDirectory));
        _engine = new DecisionEngine(CardProducers.Default(), options, knowledge.Base);

        using var document = JsonDocument.Parse(TypicalRequest.Utf8(now));
        var root = document.RootElement;
        var patientId = root.GetProperty("context").GetProperty("patientId").GetString()!;
        var bundles = new BundleReader(new ResourceParser());
        var values = root.GetProperty("prefetch").EnumerateObject()
            .Select(p => bundles.Read(p.Name, p.Value, Core.Facts.DataOrigin.Prefetch))
            .ToList();
        var facts = new FactsAssembler(options.Reading).Assemble(patientId, now, values, []).Facts;
        _request = new DecisionRequest { Hook = HookKind.PatientView, Facts = facts, Now = now };
        if (_engine.Decide(_request).Count == 0)
        {
            throw new InvalidOperationException("The typical prefetch produced no card; the benchmark would measure nothing useful.");
        }
    }

    [Benchmark(Description = "DecisionEngine.Decide on the typical patient")]
    public IReadOnlyList<Card> Decide() => _engine!.Decide(_request!);
}
