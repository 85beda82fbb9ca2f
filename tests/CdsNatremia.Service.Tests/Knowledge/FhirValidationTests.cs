using System.Diagnostics;
using System.Text.Json.Nodes;
using CdsNatremia.Scenarios;
using CdsNatremia.Service.Tests.Support;
using Hl7.Fhir.Model;
using Hl7.Fhir.Serialization;
using Xunit.Abstractions;

namespace CdsNatremia.Service.Tests.Knowledge;

/// <summary>
/// What the service reads and writes is valid FHIR R4 by the Firely validator, offline: every knowledge resource in
/// profiles/ (ValueSets, CodeSystems, the StructureDefinitions of our extensions) and every suggestion resource of
/// every scenario's cards. 0 errors; the extensions resolve to their published StructureDefinitions, so no warning
/// says an extension is unknown.
/// </summary>
public sealed class FhirValidationTests(FhirValidationFixture fhir, NatremiaFactory factory, ITestOutputHelper output)
    : IClassFixture<FhirValidationFixture>, IClassFixture<NatremiaFactory>
{
    [Fact]
    public void Validate_EveryKnowledgeResource_NoErrorAndEveryExtensionResolved()
    {
        var clock = Stopwatch.StartNew();
        var errors = new List<string>();
        var warnings = new List<string>();
        foreach (var (path, resource) in fhir.Knowledge)
        {
            var one = Stopwatch.StartNew();
            var (e, w) = fhir.Validate(resource, path);
            output.WriteLine($"{path}: {one.Elapsed.TotalSeconds:F2} s");
            errors.AddRange(e);
            warnings.AddRange(w);
        }

        output.WriteLine($"{fhir.Knowledge.Count} knowledge resources: {errors.Count} errors, {warnings.Count} warnings; resolver {fhir.SetUp.TotalSeconds:F1} s, validation {clock.Elapsed.TotalSeconds:F1} s");
        warnings.ForEach(output.WriteLine);
        Assert.True(fhir.Knowledge.Count >= 30, $"only {fhir.Knowledge.Count} knowledge resources found");
        Assert.Contains(fhir.Knowledge, k => k.Resource is StructureDefinition { Url: "https://cdsnatremia.example.org/fhir/StructureDefinition/drug-group-tier" });
        Assert.True(errors.Count == 0, string.Join(Environment.NewLine, errors));
        Assert.DoesNotContain(warnings, w => w.Contains("cdsnatremia.example.org/fhir/StructureDefinition", StringComparison.Ordinal));
    }

    [Fact]
    public async System.Threading.Tasks.Task Validate_EverySuggestionResourceOfEveryScenario_NoError()
    {
        var client = factory.CreateClient();
        var parser = new FhirJsonDeserializer(new DeserializerSettings().UsingMode(DeserializationMode.Strict));
        var resources = new List<(string Label, Resource Resource)>();
        foreach (var scenario in ScenarioLibrary.All)
        {
            var cards = await HookCalls.RunAsync(client, scenario);
            foreach (var card in cards)
            {
                foreach (var suggestion in card!["suggestions"]?.AsArray() ?? [])
                {
                    foreach (var action in suggestion!["actions"]?.AsArray() ?? [])
                    {
                        if (action!["resource"] is JsonObject resource)
                        {
                            resources.Add(($"scenario {scenario.Id} '{(string?)suggestion["label"]}'", parser.DeserializeResource(resource.ToJsonString())));
                        }
                    }
                }
            }
        }

        var clock = Stopwatch.StartNew();
        var errors = new List<string>();
        var warnings = 0;
        foreach (var (label, resource) in resources)
        {
            var (e, w) = fhir.Validate(resource, label);
            errors.AddRange(e);
            warnings += w.Count;
        }

        output.WriteLine($"{resources.Count} suggestion resources from {ScenarioLibrary.All.Count} scenarios: {errors.Count} errors, {warnings} warnings; validation {clock.Elapsed.TotalSeconds:F1} s");
        Assert.True(resources.Count >= 5, $"only {resources.Count} suggestion resources: the scenarios should produce orders to check");
        Assert.True(errors.Count == 0, string.Join(Environment.NewLine, errors));
    }
}
