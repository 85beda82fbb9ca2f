using System.Text;
using System.Text.Json;
using System.Text.Json.Nodes;

namespace CdsNatremia.Cli.Tests.Support;

/// <summary>
/// Malformed and hostile prefetch, for holding the fast reader equal to the SDK. Starts from one valid prefetch of an
/// invented patient (every element the fast reader knows appears at least once) and derives one case per mutation of
/// one element of one resource: removed, JSON null, empty or blank string, wrong JSON type, empty array or object,
/// unwrapped or wrapped array, unknown code, odd numbers (exponent, huge, tiny, quoted), odd dates and times, padded and
/// control-character strings, unknown properties, extensions, primitive extensions, a property written twice, a second
/// choice of the same element, contained resources, another patient, and odd resource types. Deterministic.
/// </summary>
public static class HostileCorpus
{
    public const string PatientId = "hx-pt";

    /// <summary>A property name with this prefix is written without it (by <see cref="Serialize"/>): a JSON property twice.</summary>
    private const string Duplicate = "\u0001dup\u0001";

    /// <summary>A property name with this prefix is written with its first letter as a JSON \uXXXX escape (by <see cref="Serialize"/>).</summary>
    private const string Escaped = "\u0002";

    private static readonly string[] Keys = ["patient", "sodium", "labs", "conditions", "medicationStatements", "medicationRequests"];

    /// <summary>Every case: a name and a prefetch object.</summary>
    public static IEnumerable<(string Name, JsonObject Prefetch)> Cases()
    {
        yield return ("valid base", Prefetch(Base()));
        var baseResources = Base();
        for (var r = 0; r < baseResources.Count; r++)
        {
            var (key, resource) = baseResources[r];
            var label = $"{key}/{(string?)resource["resourceType"]}/{(string?)resource["id"]}";
            foreach (var (path, mutated) in Mutations(resource))
            {
                var copy = Base();
                copy[r] = (key, mutated);
                yield return ($"{label} {path}", Prefetch(copy));
            }
        }

        // Whole-value oddities (the Bundle reader's own paths; the same for both readers).
        yield return ("sodium is a single Observation", new JsonObject { ["patient"] = Patient(), ["sodium"] = Sodium("hx-na-single", "2026-03-09T08:00:00Z", 126) });
        yield return ("sodium entry not an array", new JsonObject { ["sodium"] = new JsonObject { ["resourceType"] = "Bundle", ["type"] = "searchset", ["entry"] = new JsonObject() } });
        yield return ("sodium is an OperationOutcome", new JsonObject { ["sodium"] = new JsonObject { ["resourceType"] = "OperationOutcome", ["issue"] = new JsonArray(new JsonObject { ["severity"] = "error", ["code"] = "processing", ["diagnostics"] = "timeout" }) } });
        yield return ("sodium is a number", new JsonObject { ["sodium"] = 5 });
        yield return ("sodium entry without resource", new JsonObject { ["sodium"] = Bundle(new JsonObject { ["fullUrl"] = "urn:x" }) });
        yield return ("same Observation twice", new JsonObject { ["patient"] = Patient(), ["sodium"] = Bundle(Sodium("hx-na-1", "2026-03-09T08:00:00Z", 126), Sodium("hx-na-1", "2026-03-09T09:00:00Z", 127)) });
        yield return ("patient is another patient", new JsonObject { ["patient"] = Patient("someone-else") });
    }

    /// <summary>Writes the tree as JSON, turning marked property names into a second property of the same name.</summary>
    public static string Serialize(JsonNode node)
    {
        using var stream = new MemoryStream();
        using (var writer = new Utf8JsonWriter(stream, new JsonWriterOptions { Encoder = System.Text.Encodings.Web.JavaScriptEncoder.UnsafeRelaxedJsonEscaping, SkipValidation = true }))
        {
            Write(writer, node);
        }

        // A marked name: the encoder wrote the mark as \u0002; its next character becomes an escape of itself.
        return System.Text.RegularExpressions.Regex.Replace(Encoding.UTF8.GetString(stream.ToArray()), @"""\\u0002(.)",
            m => "\"\\u" + ((int)m.Groups[1].Value[0]).ToString("x4", System.Globalization.CultureInfo.InvariantCulture));
    }

    private static void Write(Utf8JsonWriter writer, JsonNode? node)
    {
        switch (node)
        {
            case null:
                writer.WriteNullValue();
                break;
            case JsonObject o:
                writer.WriteStartObject();
                foreach (var (name, value) in o)
                {
                    writer.WritePropertyName(name.StartsWith(Duplicate, StringComparison.Ordinal) ? name[Duplicate.Length..] : name);
                    Write(writer, value);
                }

                writer.WriteEndObject();
                break;
            case JsonArray a:
                writer.WriteStartArray();
                foreach (var item in a)
                {
                    Write(writer, item);
                }

                writer.WriteEndArray();
                break;
            default:
                node.WriteTo(writer);
                break;
        }
    }

    private static JsonObject Prefetch(List<(string Key, JsonObject Resource)> resources)
    {
        var prefetch = new JsonObject();
        foreach (var key in Keys)
        {
            var mine = resources.Where(r => r.Key == key).Select(r => r.Resource).ToList();
            prefetch[key] = key == "patient" ? mine.Single().DeepClone() : Bundle([.. mine.Select(m => (JsonObject)m.DeepClone())]);
        }

        return prefetch;
    }

    private static JsonObject Bundle(params JsonObject[] resources) => new()
    {
        ["resourceType"] = "Bundle",
        ["type"] = "searchset",
        ["entry"] = new JsonArray([.. resources.Select(r => (JsonNode)(r.ContainsKey("resourceType") ? new JsonObject { ["fullUrl"] = $"https://ehr.example.org/fhir/{Text(r["resourceType"])}/{Text(r["id"])}", ["resource"] = r } : r))]),
    };

    private static string Text(JsonNode? node) => node is JsonValue v && v.TryGetValue<string>(out var s) ? s : "odd";

    /// <summary>The valid base: every element the fast reader knows, at least once.</summary>
    private static List<(string Key, JsonObject Resource)> Base() =>
    [
        ("patient", Patient()),
        ("sodium", Sodium("hx-na-1", "2026-03-09T08:00:00Z", 126)),
        ("sodium", new JsonObject
        {
            ["resourceType"] = "Observation",
            ["id"] = "hx-na-2",
            ["identifier"] = new JsonArray(new JsonObject { ["use"] = "official", ["system"] = "urn:hx:lab", ["value"] = "acc-2" }),
            ["basedOn"] = new JsonArray(new JsonObject { ["reference"] = "ServiceRequest/hx-sr" }),
            ["status"] = "corrected",
            ["category"] = new JsonArray(Concept("http://terminology.hl7.org/CodeSystem/observation-category", "laboratory", "Laboratory")),
            ["code"] = Concept("http://loinc.org", "2951-2", "Sodium [Moles/volume] in Serum or Plasma"),
            ["subject"] = new JsonObject { ["reference"] = "Patient/" + PatientId, ["display"] = "Hx" },
            ["encounter"] = new JsonObject { ["reference"] = "Encounter/hx-enc" },
            ["effectivePeriod"] = new JsonObject { ["start"] = "2026-03-10T06:00:00+01:00", ["end"] = "2026-03-10T06:05:00+01:00" },
            ["issued"] = "2026-03-10T06:40:00.250+01:00",
            ["valueQuantity"] = new JsonObject { ["value"] = 124.0m, ["comparator"] = "<", ["unit"] = "mmol/L", ["system"] = "http://unitsofmeasure.org", ["code"] = "mmol/L" },
            ["interpretation"] = new JsonArray(Concept("http://terminology.hl7.org/CodeSystem/v3-ObservationInterpretation", "L", "Low")),
            ["note"] = new JsonArray(new JsonObject { ["text"] = "haemolysed?", ["time"] = "2026-03-10T06:41:00Z", ["authorString"] = "lab" }),
            ["specimen"] = new JsonObject { ["reference"] = "Specimen/hx-sp" },
            ["derivedFrom"] = new JsonArray(new JsonObject { ["reference"] = "Observation/hx-na-1" }),
            ["referenceRange"] = new JsonArray(new JsonObject
            {
                ["low"] = new JsonObject { ["value"] = 135, ["unit"] = "mmol/L", ["system"] = "http://unitsofmeasure.org", ["code"] = "mmol/L" },
                ["high"] = new JsonObject { ["value"] = 145, ["unit"] = "mmol/L", ["system"] = "http://unitsofmeasure.org", ["code"] = "mmol/L" },
                ["text"] = "135-145",
            }),
        }),
        ("labs", new JsonObject
        {
            ["resourceType"] = "Observation",
            ["id"] = "hx-uosm",
            ["status"] = "final",
            ["code"] = Concept("http://loinc.org", "2695-5", "Osmolality of Urine"),
            ["subject"] = new JsonObject { ["reference"] = "Patient/" + PatientId },
            ["effectiveDateTime"] = "2026-03-09T09:00:00Z",
            ["valueString"] = "pending",
            ["dataAbsentReason"] = Concept("http://terminology.hl7.org/CodeSystem/data-absent-reason", "not-performed", "Not Performed", "not done"),
        }),
        ("conditions", new JsonObject
        {
            ["resourceType"] = "Condition",
            ["id"] = "hx-cond",
            ["clinicalStatus"] = Concept("http://terminology.hl7.org/CodeSystem/condition-clinical", "active", "Active"),
            ["verificationStatus"] = Concept("http://terminology.hl7.org/CodeSystem/condition-ver-status", "confirmed", "Confirmed"),
            ["category"] = new JsonArray(Concept("http://terminology.hl7.org/CodeSystem/condition-category", "problem-list-item", "Problem List Item")),
            ["code"] = Concept("http://hl7.org/fhir/sid/icd-10", "I50.9", "Heart failure, unspecified", "heart failure"),
            ["subject"] = new JsonObject { ["reference"] = "Patient/" + PatientId },
            ["onsetDateTime"] = "2025-11",
            ["recordedDate"] = "2025-11-20",
        }),
        ("medicationStatements", new JsonObject
        {
            ["resourceType"] = "MedicationStatement",
            ["id"] = "hx-ms",
            ["status"] = "active",
            ["medicationCodeableConcept"] = new JsonObject
            {
                ["coding"] = new JsonArray(
                    new JsonObject { ["system"] = "http://www.nlm.nih.gov/research/umls/rxnorm", ["version"] = "2024", ["code"] = "5487", ["display"] = "hydrochlorothiazide" },
                    new JsonObject { ["system"] = "http://www.whocc.no/atc", ["code"] = "C03AA03" }),
                ["text"] = "hydrochlorothiazide 25 mg tablet",
            },
            ["subject"] = new JsonObject { ["reference"] = "Patient/" + PatientId },
            ["effectivePeriod"] = new JsonObject { ["start"] = "2026-02-10" },
            ["dateAsserted"] = "2026-03-09T10:00:00Z",
            ["dosage"] = new JsonArray(new JsonObject { ["text"] = "one daily", ["route"] = Concept("http://snomed.info/sct", "26643006", "Oral route") }),
        }),
        ("medicationRequests", new JsonObject
        {
            ["resourceType"] = "MedicationRequest",
            ["id"] = "hx-mr",
            ["status"] = "active",
            ["intent"] = "order",
            ["medicationReference"] = new JsonObject { ["reference"] = "Medication/hx-med", ["display"] = "saline 3%" },
            ["subject"] = new JsonObject { ["reference"] = "Patient/" + PatientId },
            ["authoredOn"] = "2026-03-10T05:00:00Z",
            ["dosageInstruction"] = new JsonArray(new JsonObject
            {
                ["text"] = "150 mL over 20 min",
                ["timing"] = new JsonObject
                {
                    ["repeat"] = new JsonObject { ["count"] = 1, ["duration"] = 20, ["durationUnit"] = "min", ["frequency"] = 1, ["period"] = 1.5, ["periodUnit"] = "h" },
                    ["code"] = Concept("http://terminology.hl7.org/CodeSystem/v3-GTSAbbreviation", "ONCE", "once"),
                },
                ["route"] = Concept("http://snomed.info/sct", "47625008", "Intravenous route"),
                ["doseAndRate"] = new JsonArray(new JsonObject
                {
                    ["type"] = Concept("http://terminology.hl7.org/CodeSystem/dose-rate-type", "ordered", "Ordered"),
                    ["doseQuantity"] = new JsonObject { ["value"] = 150, ["unit"] = "mL", ["system"] = "http://unitsofmeasure.org", ["code"] = "mL" },
                    ["rateQuantity"] = new JsonObject { ["value"] = 450, ["unit"] = "mL/h" },
                }),
            }),
            ["dispenseRequest"] = new JsonObject
            {
                ["quantity"] = new JsonObject { ["value"] = 0.5, ["unit"] = "L", ["code"] = "L" },
                ["validityPeriod"] = new JsonObject { ["start"] = "2026-03-10", ["end"] = "2026-03-11" },
            },
        }),
        ("medicationRequests", new JsonObject
        {
            ["resourceType"] = "Medication",
            ["id"] = "hx-med",
            ["code"] = Concept("http://www.nlm.nih.gov/research/umls/rxnorm", "313002", "sodium chloride 30 MG/ML injectable solution"),
            ["ingredient"] = new JsonArray(
                new JsonObject
                {
                    ["itemCodeableConcept"] = Concept("http://www.nlm.nih.gov/research/umls/rxnorm", "9863", "sodium chloride"),
                    ["isActive"] = true,
                    ["strength"] = new JsonObject
                    {
                        ["numerator"] = new JsonObject { ["value"] = 30, ["unit"] = "mg", ["system"] = "http://unitsofmeasure.org", ["code"] = "mg" },
                        ["denominator"] = new JsonObject { ["value"] = 1, ["unit"] = "mL", ["system"] = "http://unitsofmeasure.org", ["code"] = "mL" },
                    },
                },
                new JsonObject { ["itemReference"] = new JsonObject { ["reference"] = "Substance/water", ["display"] = "water" } }),
        }),
    ];

    private static JsonObject Patient(string id = PatientId) => new()
    {
        ["resourceType"] = "Patient",
        ["id"] = id,
        ["name"] = new JsonArray(new JsonObject { ["use"] = "official", ["text"] = "Ida Hx", ["family"] = "Hx", ["given"] = new JsonArray("Ida", "M"), ["prefix"] = new JsonArray("Ms"), ["suffix"] = new JsonArray("II") }),
        ["gender"] = "female",
        ["birthDate"] = "1950-06-15",
    };

    private static JsonObject Sodium(string id, string at, decimal value) => new()
    {
        ["resourceType"] = "Observation",
        ["id"] = id,
        ["status"] = "final",
        ["category"] = new JsonArray(Concept("http://terminology.hl7.org/CodeSystem/observation-category", "laboratory", "Laboratory")),
        ["code"] = Concept("http://loinc.org", "2951-2", "Sodium [Moles/volume] in Serum or Plasma"),
        ["subject"] = new JsonObject { ["reference"] = "Patient/" + PatientId },
        ["effectiveDateTime"] = at,
        ["issued"] = "2026-03-09T08:45:00Z",
        ["valueQuantity"] = new JsonObject { ["value"] = value, ["unit"] = "mmol/L", ["system"] = "http://unitsofmeasure.org", ["code"] = "mmol/L" },
    };

    private static JsonObject Concept(string system, string code, string display, string? text = null)
    {
        var concept = new JsonObject { ["coding"] = new JsonArray(new JsonObject { ["system"] = system, ["code"] = code, ["display"] = display }) };
        if (text is not null)
        {
            concept["text"] = text;
        }

        return concept;
    }

    /// <summary>Every mutation of every element of the resource, each on a fresh copy.</summary>
    private static IEnumerable<(string Path, JsonObject Resource)> Mutations(JsonObject resource)
    {
        // Resource-level additions.
        foreach (var (name, add) in ResourceAdditions())
        {
            var copy = (JsonObject)resource.DeepClone();
            add(copy);
            yield return (name, copy);
        }

        // Element-level: every property of every object, at every depth.
        var paths = new List<(string Path, Func<JsonObject, (JsonObject Parent, string Name)> Locate)>();
        Collect(resource, string.Empty, root => root, paths);
        foreach (var (path, locate) in paths)
        {
            foreach (var (what, mutate) in ElementMutations())
            {
                var copy = (JsonObject)resource.DeepClone();
                var (parent, name) = locate(copy);
                if (mutate(parent, name))
                {
                    yield return ($"{path} {what}", copy);
                }
            }
        }
    }

    private static void Collect(JsonObject node, string path, Func<JsonObject, JsonObject> find, List<(string, Func<JsonObject, (JsonObject, string)>)> paths)
    {
        foreach (var (name, value) in node.ToList())
        {
            var here = path.Length == 0 ? name : path + "." + name;
            paths.Add((here, root => (find(root), name)));
            switch (value)
            {
                case JsonObject child:
                    Collect(child, here, root => (JsonObject)find(root)[name]!, paths);
                    break;
                case JsonArray array:
                    for (var i = 0; i < array.Count; i++)
                    {
                        var index = i;
                        if (array[i] is JsonObject item)
                        {
                            Collect(item, $"{here}[{i}]", root => (JsonObject)((JsonArray)find(root)[name]!)[index]!, paths);
                        }
                    }

                    break;
            }
        }
    }

    private static IEnumerable<(string, Action<JsonObject>)> ResourceAdditions()
    {
        yield return ("+meta", r => r["meta"] = new JsonObject { ["versionId"] = "2", ["lastUpdated"] = "2026-03-10T06:00:00Z" });
        yield return ("+text", r => r["text"] = new JsonObject { ["status"] = "generated", ["div"] = "<div xmlns=\"http://www.w3.org/1999/xhtml\">x</div>" });
        yield return ("+extension", r => r["extension"] = new JsonArray(new JsonObject { ["url"] = "http://example.org/x", ["valueString"] = "y" }));
        yield return ("+modifierExtension", r => r["modifierExtension"] = new JsonArray(new JsonObject { ["url"] = "http://example.org/x", ["valueBoolean"] = true }));
        yield return ("+_id", r => r["_id"] = new JsonObject { ["extension"] = new JsonArray(new JsonObject { ["url"] = "http://example.org/x", ["valueString"] = "y" }) });
        yield return ("+contained", r => r["contained"] = new JsonArray(new JsonObject { ["resourceType"] = "Medication", ["id"] = "c1", ["code"] = Concept("http://www.nlm.nih.gov/research/umls/rxnorm", "5487", "hydrochlorothiazide") }));
        yield return ("+unknown", r => r["unknownElement"] = 1);
        yield return ("+fhir_comments", r => r["fhir_comments"] = new JsonArray("c"));
        yield return ("+language", r => r["language"] = "en");
        yield return ("resourceType misspelt", r => r["resourceType"] = Text(r["resourceType"]) + "s");
        yield return ("resourceType lower case", r => r["resourceType"] = Text(r["resourceType"]).ToLowerInvariant());
        yield return ("resourceType number", r => r["resourceType"] = 3);
        yield return ("resourceType removed", r => r.Remove("resourceType"));
        yield return ("resourceType twice", r => r[Duplicate + "resourceType"] = "Patient");
        yield return ("resourceType last", r =>
        {
            var type = r["resourceType"]!.DeepClone();
            r.Remove("resourceType");
            r["resourceType"] = type;
        });
        yield return ("id twice", r => r[Duplicate + "id"] = "other-id");
        yield return ("id long", r => r["id"] = new string('a', 300));
        yield return ("id with spaces", r => r["id"] = "a b");
        yield return ("id path", r => r["id"] = "../Patient/x");
        yield return ("id unicode", r => r["id"] = "na-\u00e9\u4e2d");
        yield return ("subject another patient", r => { if (r.ContainsKey("subject")) { r["subject"] = new JsonObject { ["reference"] = "Patient/someone-else" }; } });
        yield return ("subject absolute", r => { if (r.ContainsKey("subject")) { r["subject"] = new JsonObject { ["reference"] = "https://ehr.example.org/fhir/Patient/" + PatientId }; } });
        yield return ("subject contained", r => { if (r.ContainsKey("subject")) { r["subject"] = new JsonObject { ["reference"] = "#p" }; } });
        yield return ("subject identifier only", r => { if (r.ContainsKey("subject")) { r["subject"] = new JsonObject { ["identifier"] = new JsonObject { ["value"] = "x" } }; } });
        yield return ("second effective choice", r => { if (r.ContainsKey("effectiveDateTime")) { r["effectivePeriod"] = new JsonObject { ["start"] = "2026-03-09T08:00:00Z" }; } else { r["effectiveDateTime"] = "2026-03-09T08:00:00Z"; } });
        yield return ("second value choice", r => r["valueString"] = "124");
        yield return ("valueCodeableConcept", r => { if (r.ContainsKey("valueQuantity")) { r.Remove("valueQuantity"); r["valueCodeableConcept"] = Concept("http://snomed.info/sct", "1", "x"); } });
        yield return ("valueInteger", r => { if (r.ContainsKey("valueQuantity")) { r.Remove("valueQuantity"); r["valueInteger"] = 124; } });
        yield return ("effectiveInstant", r => { if (r.ContainsKey("effectiveDateTime")) { r["effectiveInstant"] = r["effectiveDateTime"]!.DeepClone(); r.Remove("effectiveDateTime"); } });
        yield return ("onsetString", r => { if (r.ContainsKey("onsetDateTime")) { r.Remove("onsetDateTime"); r["onsetString"] = "childhood"; } });
        yield return ("onsetPeriod", r => { if (r.ContainsKey("onsetDateTime")) { r.Remove("onsetDateTime"); r["onsetPeriod"] = new JsonObject { ["start"] = "2025-10-01" }; } });
        yield return ("effectiveDateTime on statement", r => { if (r.ContainsKey("effectivePeriod") && Text(r["resourceType"]) == "MedicationStatement") { r.Remove("effectivePeriod"); r["effectiveDateTime"] = "2026-02-10T08:00:00Z"; } });
        yield return ("status stopped", r => { if (r.ContainsKey("status")) { r["status"] = "stopped"; } });
        yield return ("status completed", r => { if (r.ContainsKey("status")) { r["status"] = "completed"; } });
        yield return ("status preliminary", r => { if (r.ContainsKey("status")) { r["status"] = "preliminary"; } });
        yield return ("status entered-in-error", r => { if (r.ContainsKey("status")) { r["status"] = "entered-in-error"; } });
        yield return ("status draft", r => { if (r.ContainsKey("status")) { r["status"] = "draft"; } });
        yield return ("status on-hold", r => { if (r.ContainsKey("status")) { r["status"] = "on-hold"; } });
        yield return ("status intended", r => { if (r.ContainsKey("status")) { r["status"] = "intended"; } });
        yield return ("status Final", r => { if (r.ContainsKey("status")) { r["status"] = "Final"; } });
        yield return ("deep nesting", r => r["code"] = Nest(100));
    }

    private static JsonNode Nest(int depth)
    {
        JsonNode node = new JsonObject { ["text"] = "deep" };
        for (var i = 0; i < depth; i++)
        {
            node = new JsonObject { ["coding"] = new JsonArray(node) };
        }

        return node;
    }

    private static IEnumerable<(string, Func<JsonObject, string, bool>)> ElementMutations()
    {
        yield return ("removed", (o, n) => o.Remove(n));
        yield return ("null", (o, n) => Set(o, n, null));
        yield return ("empty string", (o, n) => Set(o, n, ""));
        yield return ("blank string", (o, n) => Set(o, n, "   "));
        yield return ("number", (o, n) => Set(o, n, 12.5m));
        yield return ("true", (o, n) => Set(o, n, true));
        yield return ("empty array", (o, n) => Set(o, n, new JsonArray()));
        yield return ("empty object", (o, n) => Set(o, n, new JsonObject()));
        yield return ("array of null", (o, n) => Set(o, n, new JsonArray((JsonNode?)null)));
        yield return ("wrapped in an array", (o, n) => o[n] is not JsonArray && Set(o, n, new JsonArray(o[n]!.DeepClone())));
        yield return ("array unwrapped", (o, n) => o[n] is JsonArray { Count: > 0 } a && Set(o, n, a[0]!.DeepClone()));
        yield return ("array doubled", (o, n) => o[n] is JsonArray { Count: > 0 } a && Set(o, n, new JsonArray(a[0]!.DeepClone(), a[0]!.DeepClone())));
        yield return ("array with a null", (o, n) => o[n] is JsonArray { Count: > 0 } a && Set(o, n, new JsonArray(a[0]!.DeepClone(), null)));
        yield return ("written twice", (o, n) => Set(o, Duplicate + n, o[n]?.DeepClone()));
        yield return ("+unknown sibling", (o, n) => Set(o, "zzUnknown", 1));
        yield return ("+extension sibling", (o, n) => Set(o, "extension", new JsonArray(new JsonObject { ["url"] = "http://example.org/x", ["valueString"] = "y" })));
        yield return ("+primitive extension", (o, n) => o[n] is JsonValue && Set(o, "_" + n, new JsonObject { ["extension"] = new JsonArray(new JsonObject { ["url"] = "http://example.org/x", ["valueString"] = "y" }) }));
        yield return ("primitive extension only", (o, n) =>
        {
            if (o[n] is not JsonValue)
            {
                return false;
            }

            o.Remove(n);
            o["_" + n] = new JsonObject { ["extension"] = new JsonArray(new JsonObject { ["url"] = "http://hl7.org/fhir/StructureDefinition/data-absent-reason", ["valueCode"] = "unknown" }) };
            return true;
        });
        yield return ("name with its first letter escaped", (o, n) =>
        {
            var value = o[n]?.DeepClone();
            o.Remove(n);
            o[Escaped + n] = value;
            return true;
        });
        yield return ("name with an accent", (o, n) =>
        {
            var value = o[n]?.DeepClone();
            o.Remove(n);
            o[n + "\u00e9"] = value;
            return true;
        });
        yield return ("name upper case", (o, n) =>
        {
            var value = o[n]?.DeepClone();
            o.Remove(n);
            o[n.ToUpperInvariant()] = value;
            return true;
        });

        // Strings.
        foreach (var (what, value) in new (string, string)[]
        {
            ("padded", " x "), ("unknown code", "zzz-unknown"), ("control character", "a\u0000b"), ("tab", "\t"), ("newline inside", "a\nb"),
            ("unicode", "na\u00efve \u4e2d\u6587 \U0001F600"), ("long", new string('x', 5000)), ("escaped quote", "a\"b\\c"),
            ("date month 13", "2024-13-01"), ("date 30 Feb", "2024-02-30T10:00:00Z"), ("year only", "2024"), ("year-month", "2024-03"),
            ("time without seconds", "2026-03-09T08:00Z"), ("time without zone", "2026-03-09T08:00:00"), ("nanoseconds with offset", "2026-03-09T08:00:00.123456789+05:30"),
            ("hour 25", "2026-03-09T25:00:00Z"), ("offset -00:00", "2026-03-09T08:00:00-00:00"), ("offset +14:00", "2026-03-09T08:00:00+14:00"),
            ("lower-case t and z", "2026-03-09t08:00:00z"), ("far future", "9999-12-31T23:59:59Z"), ("year 0001", "0001-01-01"),
            ("leap second", "2026-06-30T23:59:60Z"), ("space inside date", "2026-03-09 08:00:00Z"), ("number text", "124"), ("relative reference", "Patient/" + PatientId),
            ("comparator <=", "<="), ("comparator ad", "ad"), ("UCUM mg/dL", "mg/dL"),
        })
        {
            yield return ("string " + what, (o, n) => o[n] is JsonValue v && v.GetValueKind() == JsonValueKind.String && Set(o, n, value));
        }

        // Numbers.
        foreach (var (what, value) in new (string, JsonNode)[]
        {
            ("exponent", JsonNode.Parse("1.24e2")!), ("exponent upper", JsonNode.Parse("1.24E+2")!), ("huge", JsonNode.Parse("1e400")!),
            ("tiny", JsonNode.Parse("0.0000000000000000000000000000001")!), ("many digits", JsonNode.Parse("124.00000000000000000000000000001")!),
            ("29 digits", JsonNode.Parse("12345678901234567890123456789")!), ("31 digits", JsonNode.Parse("1234567890123456789012345678901")!),
            ("negative zero", JsonNode.Parse("-0")!), ("negative", JsonNode.Parse("-124")!), ("zero", JsonNode.Parse("0")!), ("trailing zeros", JsonNode.Parse("124.000")!),
            ("quoted", JsonValue.Create("124")!), ("integer", JsonNode.Parse("2")!), ("fraction for integer", JsonNode.Parse("2.0")!), ("int overflow", JsonNode.Parse("3000000000")!),
        })
        {
            yield return ("number " + what, (o, n) => o[n] is JsonValue v && v.GetValueKind() == JsonValueKind.Number && Set(o, n, value.DeepClone()));
        }

        yield return ("boolean as string", (o, n) => o[n] is JsonValue v && v.GetValueKind() is JsonValueKind.True or JsonValueKind.False && Set(o, n, "true"));
    }

    private static bool Set(JsonObject o, string name, JsonNode? value)
    {
        o[name] = value;
        return true;
    }
}
