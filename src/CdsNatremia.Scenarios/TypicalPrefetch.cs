using System.Globalization;
using System.Text.Json.Nodes;

namespace CdsNatremia.Scenarios;

/// <summary>
/// The "typical prefetch" that performance is measured on (benchmarks and the load run): one invented patient with
/// <see cref="SodiumResults"/> serum sodium results over two weeks (falling from 139 to 124 mmol/L), <see cref="OtherLabResults"/>
/// other laboratory results, one body weight, <see cref="Conditions"/> conditions and <see cref="Medications"/> medicines
/// (statements and orders; two with RxNorm and ATC codes, the others by generic name only), split into the service's
/// prefetch keys as a <c>patient-view</c> request. Every LOINC, ICD-10, RxNorm and ATC code comes from the project's
/// clinical reference sheet or the scenario library. Deterministic: the same <c>now</c> gives the same JSON.
/// </summary>
public static class TypicalPrefetch
{
    /// <summary>Serum sodium results in the sodium prefetch.</summary>
    public const int SodiumResults = 30;

    /// <summary>Other laboratory results in the labs prefetch (osmolality, urine studies, glucose, urea, potassium...).</summary>
    public const int OtherLabResults = 15;

    /// <summary>Medicines: statements plus orders.</summary>
    public const int Medications = 8;

    /// <summary>Active conditions.</summary>
    public const int Conditions = 6;

    /// <summary>The invented patient's id.</summary>
    public const string PatientId = "perf-pt";

    private const string Loinc = "http://loinc.org";
    private const string Ucum = "http://unitsofmeasure.org";
    private const string Icd10 = "http://hl7.org/fhir/sid/icd-10";
    private const string RxNorm = "http://www.nlm.nih.gov/research/umls/rxnorm";
    private const string Atc = "http://www.whocc.no/atc";

    // (LOINC code, display, value, UCUM unit, hours before now). Units are those the service accepts for each analyte.
    private static readonly (string Code, string Display, double Value, string Unit, int HoursAgo)[] OtherLabs =
    [
        ("2692-2", "Osmolality of Serum or Plasma", 262, "mosm/kg", 3),
        ("2695-5", "Osmolality of Urine", 410, "mosm/kg", 3),
        ("2955-3", "Sodium [Moles/volume] in Urine", 48, "mmol/L", 3),
        ("2345-7", "Glucose [Mass/volume] in Serum or Plasma", 112, "mg/dL", 2),
        ("2345-7", "Glucose [Mass/volume] in Serum or Plasma", 98, "mg/dL", 74),
        ("2345-7", "Glucose [Mass/volume] in Serum or Plasma", 131, "mg/dL", 170),
        ("3094-0", "Urea nitrogen [Mass/volume] in Serum or Plasma", 14, "mg/dL", 2),
        ("3094-0", "Urea nitrogen [Mass/volume] in Serum or Plasma", 17, "mg/dL", 170),
        ("2823-3", "Potassium [Moles/volume] in Serum or Plasma", 3.9, "mmol/L", 2),
        ("2823-3", "Potassium [Moles/volume] in Serum or Plasma", 4.1, "mmol/L", 74),
        ("2823-3", "Potassium [Moles/volume] in Serum or Plasma", 4.3, "mmol/L", 170),
        ("2160-0", "Creatinine [Mass/volume] in Serum or Plasma", 0.9, "mg/dL", 2),
        ("2160-0", "Creatinine [Mass/volume] in Serum or Plasma", 0.8, "mg/dL", 170),
        ("3016-3", "Thyrotropin [Units/volume] in Serum or Plasma", 2.1, "m[IU]/L", 26),
        ("2143-6", "Cortisol [Mass/volume] in Serum or Plasma", 14, "ug/dL", 26),
    ];

    private static readonly (string Code, string Display)[] ConditionCodes =
    [
        ("I10", "Essential (primary) hypertension"),
        ("E11.9", "Type 2 diabetes mellitus without complications"),
        ("F32.9", "Depressive episode, unspecified"),
        ("I50.9", "Heart failure, unspecified"),
        ("E78.1", "Pure hyperglyceridaemia"),
        ("G40.9", "Epilepsy, unspecified"),
    ];

    // (resource type, text, codes as (system, code, display)).
    private static readonly (string Type, string Text, (string System, string Code, string Display)[] Codes)[] Medicines =
    [
        ("MedicationStatement", "hydrochlorothiazide 25 mg tablet", [(RxNorm, "5487", "hydrochlorothiazide"), (Atc, "C03AA03", "hydrochlorothiazide")]),
        ("MedicationStatement", "sertraline 50 mg tablet", [(RxNorm, "36437", "sertraline"), (Atc, "N06AB06", "sertraline")]),
        ("MedicationStatement", "metformin 500 mg tablet", []),
        ("MedicationStatement", "atorvastatin 20 mg tablet", []),
        ("MedicationStatement", "paracetamol 1 g tablet", []),
        ("MedicationRequest", "furosemide 40 mg tablet", []),
        ("MedicationRequest", "amlodipine 5 mg tablet", []),
        ("MedicationRequest", "omeprazole 20 mg capsule", []),
    ];

    /// <summary>The patient-view request body (hook, hookInstance, context, prefetch) for an assessment at <paramref name="now"/>.</summary>
    public static JsonObject Request(DateTimeOffset now, Guid hookInstance)
        => new()
        {
            ["hookInstance"] = hookInstance.ToString(),
            ["hook"] = "patient-view",
            ["context"] = new JsonObject { ["userId"] = "Practitioner/perf-clinician", ["patientId"] = PatientId },
            ["prefetch"] = HookRequestBuilder.Prefetch(Resources(now)),
        };

    /// <summary>Every resource of the typical patient, dated relative to <paramref name="now"/>.</summary>
    public static IReadOnlyList<JsonObject> Resources(DateTimeOffset now)
    {
        var resources = new List<JsonObject>
        {
            new()
            {
                ["resourceType"] = "Patient",
                ["id"] = PatientId,
                ["name"] = new JsonArray(new JsonObject { ["use"] = "official", ["family"] = "Quillfeather", ["given"] = new JsonArray("Odile") }),
                ["gender"] = "female",
                ["birthDate"] = "1951-08-14",
            },
        };

        // Sodium: one result about every 11.5 hours from two weeks ago to two hours ago, falling 139 → 124 mmol/L.
        var first = now.AddDays(-14);
        var step = (now.AddHours(-2) - first) / (SodiumResults - 1);
        for (var i = 0; i < SodiumResults; i++)
        {
            var value = Math.Round(139 - (15.0 * i / (SodiumResults - 1)));
            resources.Add(Observation($"perf-na-{i + 1:00}", "2951-2", "Sodium [Moles/volume] in Serum or Plasma", value, "mmol/L", first + (step * i), "laboratory", range: (135, 145)));
        }

        for (var i = 0; i < OtherLabs.Length; i++)
        {
            var (code, display, value, unit, hoursAgo) = OtherLabs[i];
            resources.Add(Observation($"perf-lab-{i + 1:00}", code, display, value, unit, now.AddHours(-hoursAgo), "laboratory", range: null));
        }

        resources.Add(Observation("perf-weight", "29463-7", "Body weight", 61.5, "kg", now.AddDays(-1), "vital-signs", range: null));

        for (var i = 0; i < ConditionCodes.Length; i++)
        {
            var (code, display) = ConditionCodes[i];
            resources.Add(new JsonObject
            {
                ["resourceType"] = "Condition",
                ["id"] = $"perf-cond-{i + 1}",
                ["clinicalStatus"] = Concept("http://terminology.hl7.org/CodeSystem/condition-clinical", "active", "Active"),
                ["verificationStatus"] = Concept("http://terminology.hl7.org/CodeSystem/condition-ver-status", "confirmed", "Confirmed"),
                ["code"] = Concept(Icd10, code, display),
                ["subject"] = new JsonObject { ["reference"] = "Patient/" + PatientId },
                ["onsetDateTime"] = Time(now.AddDays(-400 + (i * 30))),
            });
        }

        for (var i = 0; i < Medicines.Length; i++)
        {
            var (type, text, codes) = Medicines[i];
            var concept = new JsonObject { ["text"] = text };
            if (codes.Length > 0)
            {
                concept["coding"] = new JsonArray(codes.Select(c => (JsonNode)new JsonObject { ["system"] = c.System, ["code"] = c.Code, ["display"] = c.Display }).ToArray());
            }

            var medicine = new JsonObject
            {
                ["resourceType"] = type,
                ["id"] = $"perf-med-{i + 1}",
                ["status"] = "active",
            };
            if (type == "MedicationRequest")
            {
                medicine["intent"] = "order";
                medicine["medicationCodeableConcept"] = concept;
                medicine["subject"] = new JsonObject { ["reference"] = "Patient/" + PatientId };
                medicine["authoredOn"] = Time(now.AddDays(-30 - i));
                medicine["dosageInstruction"] = new JsonArray(new JsonObject { ["text"] = "one by mouth once daily" });
            }
            else
            {
                medicine["medicationCodeableConcept"] = concept;
                medicine["subject"] = new JsonObject { ["reference"] = "Patient/" + PatientId };
                medicine["effectivePeriod"] = new JsonObject { ["start"] = Time(now.AddDays(-21 - (i * 40))) };
                medicine["dateAsserted"] = Time(now.AddDays(-1));
                medicine["dosage"] = new JsonArray(new JsonObject { ["text"] = "one by mouth once daily" });
            }

            resources.Add(medicine);
        }

        return resources;
    }

    private static JsonObject Observation(string id, string code, string display, double value, string unit, DateTimeOffset at, string category, (double Low, double High)? range)
    {
        var observation = new JsonObject
        {
            ["resourceType"] = "Observation",
            ["id"] = id,
            ["status"] = "final",
            ["category"] = new JsonArray(Concept("http://terminology.hl7.org/CodeSystem/observation-category", category, category == "laboratory" ? "Laboratory" : "Vital Signs")),
            ["code"] = Concept(Loinc, code, display),
            ["subject"] = new JsonObject { ["reference"] = "Patient/" + PatientId },
            ["effectiveDateTime"] = Time(at),
            ["issued"] = Time(at.AddMinutes(45)),
            ["valueQuantity"] = Quantity(value, unit),
        };
        if (range is { } r)
        {
            observation["referenceRange"] = new JsonArray(new JsonObject { ["low"] = Quantity(r.Low, unit), ["high"] = Quantity(r.High, unit) });
        }

        return observation;
    }

    private static JsonObject Quantity(double value, string unit)
        => new() { ["value"] = value, ["unit"] = unit, ["system"] = Ucum, ["code"] = unit };

    private static JsonObject Concept(string system, string code, string display)
        => new() { ["coding"] = new JsonArray(new JsonObject { ["system"] = system, ["code"] = code, ["display"] = display }) };

    private static string Time(DateTimeOffset at)
        => at.ToUniversalTime().ToString("yyyy-MM-dd'T'HH:mm:ss'Z'", CultureInfo.InvariantCulture);
}
