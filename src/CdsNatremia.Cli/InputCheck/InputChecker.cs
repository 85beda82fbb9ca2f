using System.Globalization;
using System.Text.Json;
using System.Text.Json.Nodes;
using CdsNatremia.Cli.Prefetch;
using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Knowledge;
using CdsNatremia.Core.Sodium;
using CdsNatremia.Fhir.Reading;

namespace CdsNatremia.Cli.InputCheck;

/// <summary>
/// Explains, per resource of a Bundle, whether the service will use it and why not. The verdicts come from the
/// service's own FHIR readers (<see cref="BundleReader"/>, <see cref="FactsAssembler"/>, <see cref="ConditionReader"/>,
/// <see cref="MedicationMatching"/> against the knowledge files), not from a second implementation; the prefetch keys
/// that would carry each resource come from evaluating the service's templates.
/// </summary>
internal sealed class InputChecker
{
    private readonly SodiumReadingOptions _reading;
    private readonly KnowledgeBase _knowledge;
    private readonly IReadOnlyDictionary<string, string> _templates;
    private readonly ResourceParser _parser = new();

    public InputChecker(SodiumReadingOptions reading, KnowledgeBase knowledge, IReadOnlyDictionary<string, string> templates)
    {
        _reading = reading;
        _knowledge = knowledge;
        _templates = templates;
    }

    /// <summary>Checks a Bundle as of <paramref name="now"/>; the patient is <paramref name="patientId"/> or the Bundle's only Patient.</summary>
    public InputReport Check(string bundleJson, string? patientId, DateTimeOffset now)
    {
        var problems = new List<string>();
        JsonNode? root;
        try
        {
            root = JsonNode.Parse(bundleJson);
        }
        catch (JsonException ex)
        {
            var where = ex.LineNumber is { } line
                ? string.Create(CultureInfo.InvariantCulture, $" at line {line + 1}, column {(ex.BytePositionInLine ?? 0) + 1}")
                : string.Empty;
            var reason = ex.Message.Split(" LineNumber:", 2)[0].Split(" Path:", 2)[0].Trim();
            return new InputReport(null, [], []) { Unusable = $"not valid JSON{where}: {reason}" };
        }

        if (root is not JsonObject bundle || (string?)bundle["resourceType"] != "Bundle")
        {
            return new InputReport(null, [], []) { Unusable = "not a FHIR Bundle (resourceType must be \"Bundle\")" };
        }

        var spans = new ResourceSpans(bundleJson);
        var raw = FhirSearchEvaluator.ResourcesOf(bundle);
        var patients = raw.Where(r => FhirSearchEvaluator.TypeOf(r) == "Patient").Select(FhirSearchEvaluator.IdOf).OfType<string>().ToList();
        var patient = patientId ?? (patients.Count == 1 ? patients[0] : null);
        if (patient is null)
        {
            problems.Add($"the Bundle holds {patients.Count} Patient resources; name the patient with --patient");
        }

        var duplicates = raw.GroupBy(r => $"{FhirSearchEvaluator.TypeOf(r)}/{FhirSearchEvaluator.IdOf(r)}").Where(g => g.Count() > 1).Select(g => g.Key);
        problems.AddRange(duplicates.Select(d => $"{d} appears more than once; the service reads it once"));

        using var document = JsonDocument.Parse(bundle.ToJsonString());
        var value = new BundleReader(_parser).Read("bundle", document.RootElement, DataOrigin.Prefetch);
        var assembled = new FactsAssembler(_reading).Assemble(patient ?? string.Empty, now, [value], []);
        var facts = assembled.Facts;
        var context = new JsonObject { ["patientId"] = patient ?? string.Empty, ["userId"] = "Practitioner/toolkit" };
        var selectedBy = SelectedBy(raw, context);

        var verdicts = new List<ResourceVerdict>();
        var entries = bundle["entry"] as JsonArray ?? [];
        for (var i = 0; i < entries.Count; i++)
        {
            var resource = entries[i]?["resource"] as JsonObject;
            var type = resource is null ? null : FhirSearchEvaluator.TypeOf(resource);
            var id = resource is null ? null : FhirSearchEvaluator.IdOf(resource);
            var reference = type is not null && id is not null ? $"{type}/{id}" : $"entry {i.ToString(CultureInfo.InvariantCulture)}";
            var keys = resource is not null && selectedBy.TryGetValue(resource, out var k) ? k : [];
            if (resource is null || type is null)
            {
                verdicts.Add(new(reference, "unreadable", "the entry has no resource with a resourceType", keys));
                continue;
            }

            // The service's own parser decides whether it reads the resource; a strict parse says what is not valid FHIR.
            // Both read the resource as the file has it, so the positions they report are mapped to the file's.
            var text = spans.Text(i) ?? resource.ToJsonString();
            var issues = StrictFhirCheck.Issues(text).Select(issue => spans.InFile(i, issue)).ToList();
            if (_parser.TryParse(text, out var parseProblem) is null)
            {
                verdicts.Add(new(reference, "unreadable", $"not readable as FHIR R4 ({spans.InFile(i, parseProblem ?? string.Empty)}); the service refuses it whole", keys) { FhirIssues = issues });
                continue;
            }

            if (!IsKnownType(type))
            {
                verdicts.Add(new(reference, "unreadable", $"'{type}' is not a FHIR R4 resource type", keys) { FhirIssues = issues });
                continue;
            }

            var (verdict, reason) = type switch
            {
                "Observation" => Observation(id, facts, now),
                "Patient" => id == patient ? ("used", "the patient in the hook context (age and sex)") : ("set-aside", "not the patient in the hook context"),
                "Condition" => Condition(id, facts),
                "MedicationStatement" or "MedicationRequest" => Medication(type, id, facts),
                "Medication" => ("used", "read when a MedicationStatement or MedicationRequest refers to it"),
                _ => ("ignored", $"the service does not read {type} resources"),
            };
            verdicts.Add(new(reference, verdict, reason, keys) { FhirIssues = issues });
        }

        return new InputReport(patient, verdicts, problems);
    }

    private static bool IsKnownType(string type) => Hl7.Fhir.Model.ModelInfo.IsKnownResource(type);

    private (string, string) Observation(string? id, PatientFacts facts, DateTimeOffset now)
    {
        var lab = facts.Labs.FirstOrDefault(l => l.ResourceId == id);
        if (lab is not null)
        {
            var what = $"{AnalyteUnits.DisplayName(lab.Analyte)} {lab.Value.ToString("0.##", CultureInfo.InvariantCulture)} {lab.Unit} at {lab.EffectiveAt.ToString("yyyy-MM-dd HH:mm", CultureInfo.InvariantCulture)} UTC";
            var ageHours = (now - lab.EffectiveAt).TotalHours;
            if (ageHours > _reading.StaleAfterHours && lab.Analyte == Analyte.Sodium)
            {
                return ("used-stale", $"{what}; older than {_reading.StaleAfterHours.ToString(CultureInfo.InvariantCulture)} h, so the card labels it stale and suggests a recheck");
            }

            return ("used", what + (lab.IsPreliminary ? " (preliminary: counted and labelled)" : string.Empty));
        }

        var aside = facts.SetAside.FirstOrDefault(s => s.Reference == "Observation/" + id);
        return aside is not null
            ? ("set-aside", $"{aside.What}: {aside.Reason}")
            : ("ignored", "no LOINC code the service reads (see the 'sodium' and 'labs' prefetch templates for the codes it reads)");
    }

    private (string, string) Condition(string? id, PatientFacts facts)
    {
        var fact = facts.Conditions.FirstOrDefault(c => c.ResourceId == id);
        if (fact is null)
        {
            return ("ignored", "not an active, confirmed condition of this patient (clinical status, verification status or subject)");
        }

        var clue = _knowledge.WithIdPrefix("condition-").FirstOrDefault(set => fact.Codes.Any(set.Matches));
        return clue is not null
            ? ("used", $"a clue the work-up names: {clue.Label}")
            : ("ignored", "active and confirmed, but none of its codes is in a condition set the service knows (profiles/valuesets/condition-*), so the work-up does not use it");
    }

    private (string, string) Medication(string type, string? id, PatientFacts facts)
    {
        var fact = facts.Medications.FirstOrDefault(m => m.ResourceType == type && m.ResourceId == id);
        if (fact is null)
        {
            var aside = facts.SetAside.FirstOrDefault(s => s.Reference == $"{type}/{id}");
            return aside is not null
                ? ("set-aside", aside.Reason)
                : ("ignored", type == "MedicationStatement"
                    ? "not active, intended or on-hold for this patient"
                    : "not an active or on-hold order for this patient");
        }

        var match = MedicationMatching.MatchAll(_knowledge.WithIdPrefix("drug-"), fact).FirstOrDefault();
        return match is not null
            ? ("used", $"matched {match.Set.Label}: {match.Ingredient} by {match.By}")
            : ("ignored", "taken, but in no drug group the service checks (codes and name did not match), so the work-up does not use it");
    }

    private Dictionary<JsonObject, List<string>> SelectedBy(IReadOnlyList<JsonObject> resources, JsonObject context)
    {
        var result = new Dictionary<JsonObject, List<string>>(ReferenceEqualityComparer.Instance);
        foreach (var (key, template) in _templates)
        {
            FhirQuery query;
            try
            {
                query = FhirQuery.Parse(PrefetchTokens.Substitute(template, context));
            }
            catch (FormatException)
            {
                continue;
            }

            var outcome = FhirSearchEvaluator.Evaluate(query, resources);
            foreach (var resource in outcome.Matches.Take(outcome.PageSize ?? int.MaxValue).Concat(outcome.Included))
            {
                if (!result.TryGetValue(resource, out var keys))
                {
                    result[resource] = keys = [];
                }

                keys.Add(key);
            }
        }

        return result;
    }
}
