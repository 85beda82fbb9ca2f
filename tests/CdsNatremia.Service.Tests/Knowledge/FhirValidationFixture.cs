using System.Diagnostics;
using Firely.Fhir.Validation;
using Hl7.Fhir.Model;
using Hl7.Fhir.Serialization;
using Hl7.Fhir.Specification.Source;
using Hl7.Fhir.Specification.Terminology;

namespace CdsNatremia.Service.Tests.Knowledge;

/// <summary>
/// The Firely validator, offline: the FHIR R4 core definitions from the specification.zip of
/// Hl7.Fhir.Specification.Data.R4 (beside the test binaries) plus our own knowledge resources (profiles/), snapshots
/// generated on demand, and a local terminology service (no terminology server, no network). Built once per test
/// class: the first validation compiles the core schemas and takes tens of seconds.
/// </summary>
public sealed class FhirValidationFixture
{
    public FhirValidationFixture()
    {
        var clock = Stopwatch.StartNew();
        ProfilesDirectory = Path.Combine(AppContext.BaseDirectory, "profiles");
        var parser = new FhirJsonDeserializer(new DeserializerSettings().UsingMode(DeserializationMode.Strict));
        Knowledge = Directory.EnumerateFiles(ProfilesDirectory, "*.json", SearchOption.AllDirectories)
            .Where(f => Path.GetFileName(f) != "knowledge-manifest.json")
            .Order(StringComparer.Ordinal)
            .Select(f => (Path.GetRelativePath(ProfilesDirectory, f), parser.DeserializeResource(File.ReadAllText(f))))
            .ToList();
        var core = ZipSource.CreateValidationSource(Path.Combine(AppContext.BaseDirectory, "specification.zip"));
        var resolver = new CachedResolver(new SnapshotSource(new MultiResolver(new InMemoryResourceResolver(Knowledge.Select(k => k.Resource)), core)));
        Validator = new Validator(resolver, new LocalTerminologyService(resolver));
        SetUp = clock.Elapsed;
    }

    public string ProfilesDirectory { get; }

    /// <summary>Every knowledge resource with its path under profiles/.</summary>
    public IReadOnlyList<(string Path, Resource Resource)> Knowledge { get; }

    public Validator Validator { get; }

    /// <summary>Time to build the resolver (reported, never asserted).</summary>
    public TimeSpan SetUp { get; }

    /// <summary>Validates against the core definitions; every error and fatal issue, and every warning, as text.</summary>
    public (List<string> Errors, List<string> Warnings) Validate(Resource resource, string label)
    {
        var outcome = Validator.Validate(resource);
        var errors = outcome.Issue
            .Where(i => i.Severity is OperationOutcome.IssueSeverity.Error or OperationOutcome.IssueSeverity.Fatal)
            .Select(i => $"{label}: {i.Details?.Text ?? i.Diagnostics} at {string.Join(", ", i.Expression ?? i.Location ?? [])}")
            .ToList();
        var warnings = outcome.Issue
            .Where(i => i.Severity == OperationOutcome.IssueSeverity.Warning)
            .Select(i => $"{label}: {i.Details?.Text ?? i.Diagnostics} at {string.Join(", ", i.Expression ?? i.Location ?? [])}")
            .ToList();
        return (errors, warnings);
    }
}
