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
/// from profiles/ and <see cref="CardProducers.Default"/> (issue 19's target: at most 50 µs and 60 KB per patient), and
/// the same work in its parts, to say where the time and memory go: the rules alone (every producer's findings, no
/// words), the short cards rendered from those findings, and the full reports rendered from them.
/// </summary>
[MemoryDiagnoser]
public class AssessmentBenchmarks
{
    private DecisionEngine? _engine;
    private DecisionRequest? _request;
    private RuleOptions? _options;
    private Core.Knowledge.KnowledgeBase? _knowledge;
    private Core.Findings.CardContent[] _contents = [];
    private Core.Rendering.RenderContext? _render;

    [GlobalSetup]
    public void Setup()
    {
        var now = DateTimeOffset.UtcNow;
        var options = _options = new RuleOptions();
        var knowledge = KnowledgeLoader.Load(KnowledgeDirectory.Resolve(null, AppContext.BaseDirectory));
        _knowledge = knowledge.Base;
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

        _contents = [.. Rules().Select(c => c.Content).OfType<Core.Findings.CardContent>()];
        _render = new Core.Rendering.RenderContext(facts, _engine.DisplayAt(now));
    }

    [Benchmark(Description = "DecisionEngine.Decide on the typical patient")]
    public IReadOnlyList<Card> Decide() => _engine!.Decide(_request!);

    [Benchmark(Description = "Part: the rules alone (every producer's findings, no words)")]
    public List<Card> Rules()
    {
        var context = new DecisionContext(_request!, _options!, _knowledge!);
        var cards = new List<Card>();
        var hook = HookDefinitions.Of(_request!.Hook);
        foreach (var producer in _engine!.Producers)
        {
            if (hook.Runs(producer))
            {
                cards.AddRange(producer.Produce(context));
            }
        }

        return cards;
    }

    [Benchmark(Description = "Part: the short cards (summary and detail) from those findings")]
    public int ShortCards()
    {
        var length = 0;
        foreach (var content in _contents)
        {
            length += Core.Rendering.CardRenderer.Summary(content, _render!).Length + Core.Rendering.CardRenderer.Detail(content, _render!).Length;
        }

        return length;
    }

    [Benchmark(Description = "Part: the full reports from those findings")]
    public int Reports()
    {
        var length = 0;
        foreach (var content in _contents)
        {
            length += Core.Rendering.ReportRenderer.Render(content, _render!).Length;
        }

        return length;
    }
}
