using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Sodium;
using Hl7.Fhir.Model;

namespace CdsNatremia.Fhir.Reading;

/// <summary>
/// Builds <see cref="PatientFacts"/> from everything a request carried: prefetch values (and fetched ones), the new
/// results of the result hook, and the draft orders of the order hooks. A resource that arrives twice (same type and
/// id) is read once, context first. Stateless apart from options; thread-safe.
/// </summary>
public sealed class FactsAssembler
{
    private readonly ObservationReader _observations;

    /// <summary>Creates an assembler.</summary>
    public FactsAssembler(SodiumReadingOptions options) => _observations = new ObservationReader(options);

    /// <summary>Assembles the facts.</summary>
    /// <param name="patientId">The patient in the hook context; data about anyone else is set aside.</param>
    /// <param name="now">Assessment time, for future-dated results.</param>
    /// <param name="values">Prefetch (or fetched) values, one per key.</param>
    /// <param name="contextResources">Resources from the hook context (new results, draft orders).</param>
    public AssembledFacts Assemble(string patientId, DateTimeOffset now, IEnumerable<PrefetchValue> values, IEnumerable<ParsedResource> contextResources)
    {
        ArgumentNullException.ThrowIfNull(values);
        ArgumentNullException.ThrowIfNull(contextResources);
        var valueList = values.ToList();
        var notes = new List<string>();
        var unavailable = new Dictionary<string, string>(StringComparer.Ordinal);
        foreach (var value in valueList)
        {
            notes.AddRange(value.Problems);
            if (value.Kind is PrefetchValueKind.Failed or PrefetchValueKind.Unusable)
            {
                unavailable[value.Key] = value.Problems.FirstOrDefault() ?? "could not be read";
            }
        }

        var all = contextResources.Concat(valueList.SelectMany(v => v.Resources))
            .DistinctBy(r => (r.Resource.TypeName, r.Resource.Id ?? r.FullUrl ?? Guid.NewGuid().ToString()))
            .ToList();
        var medications = IndexMedications(all);
        var medicationReader = new MedicationReader(reference => medications.GetValueOrDefault(reference)
            ?? (References.IdOf(reference, "Medication") is { } id ? medications.GetValueOrDefault("Medication/" + id) : null));

        var labs = new List<LabResult>();
        var setAside = new List<SetAsideItem>();
        var conditions = new List<ConditionFact>();
        var meds = new List<MedicationFact>();
        var drafts = new List<MedicationFact>();
        var sex = PatientSex.Unknown;
        DateOnly? birthDate = null;

        foreach (var item in all)
        {
            try
            {
                ReadOne(item);
            }
            catch (Exception ex) when (ex is Hl7.Fhir.Utility.CodedException or FormatException or InvalidCastException or OverflowException
                or NullReferenceException or InvalidOperationException or ArgumentException)
            {
                // Defence in depth: a value the parser let through but the model cannot interpret (a wrong JSON type read
                // lazily, a null inside a list) sets that one resource aside; it must never cost the patient the whole answer.
                setAside.Add(new SetAsideItem($"{item.Resource.TypeName}/{item.Resource.Id}", item.Resource.TypeName, "a value in it could not be interpreted"));
            }
        }

        void ReadOne(ParsedResource item)
        {
            var isDraftOrder = item.Origin == DataOrigin.Context && item.Source.Contains("draftOrders", StringComparison.Ordinal);
            switch (item.Resource)
            {
                case Observation observation when _observations.TryRead(observation, patientId, now, item.Origin, out var result, out var aside):
                    if (result is not null)
                    {
                        labs.Add(result);
                    }

                    if (aside is not null)
                    {
                        setAside.Add(aside);
                    }

                    break;
                case Patient patient:
                    if (patient.Id == patientId)
                    {
                        sex = patient.Gender switch
                        {
                            AdministrativeGender.Female => PatientSex.Female,
                            AdministrativeGender.Male => PatientSex.Male,
                            AdministrativeGender.Other => PatientSex.Other,
                            _ => PatientSex.Unknown,
                        };
                        birthDate = FhirTime.From(patient.BirthDateElement) is { } b ? DateOnly.FromDateTime(b.UtcDateTime) : null;
                    }
                    else
                    {
                        setAside.Add(new SetAsideItem($"Patient/{patient.Id}", "Patient resource", "it is not the patient in the hook context"));
                    }

                    break;
                case Condition condition when ConditionReader.Read(condition, patientId) is { } fact:
                    conditions.Add(fact);
                    break;
                case MedicationStatement statement when medicationReader.Read(statement, patientId, item.Origin, setAside) is { } fact:
                    meds.Add(fact);
                    break;
                case MedicationRequest request when medicationReader.Read(request, patientId, item.Origin, isDraftOrder, setAside) is { } fact:
                    (isDraftOrder ? drafts : meds).Add(fact);
                    break;
            }
        }

        if (all.Any(r => r.Origin == DataOrigin.FhirServer))
        {
            notes.Add("Some data was fetched from the EHR's FHIR server because prefetch did not include it.");
        }

        var facts = new PatientFacts
        {
            PatientId = patientId,
            Sex = sex,
            BirthDate = birthDate,
            Labs = labs,
            SetAside = setAside,
            Conditions = conditions,
            Medications = meds,
            DataNotes = notes,
            Unavailable = unavailable,
        };
        return new AssembledFacts(facts, drafts);
    }

    private static Dictionary<string, Medication> IndexMedications(IEnumerable<ParsedResource> resources)
    {
        var index = new Dictionary<string, Medication>(StringComparer.Ordinal);
        foreach (var item in resources)
        {
            if (item.Resource is not Medication medication)
            {
                continue;
            }

            if (!string.IsNullOrEmpty(medication.Id))
            {
                index.TryAdd("Medication/" + medication.Id, medication);
            }

            if (!string.IsNullOrEmpty(item.FullUrl))
            {
                index.TryAdd(item.FullUrl, medication);
            }
        }

        return index;
    }
}
