using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Sodium;
using Hl7.Fhir.Model;

namespace CdsNatremia.Fhir.Reading;

/// <summary>
/// Builds <see cref="PatientFacts"/> from everything a request carried: prefetch values (and fetched ones), the new
/// results of the result hook, and the draft orders of the order hooks. A resource that arrives twice (same type and
/// id) is read once, context first. Every item gets a fact state: usable; bounded (kept apart); superseded by a
/// correction of the same result (<see cref="ResultSupersession"/>); unreadable (set aside with the reason); another
/// patient's (counted only, nothing identifying kept); or absent. Stateless apart from options; thread-safe.
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
    /// <param name="contextResources">Resources from the hook context, each with its <see cref="ParsedResource.Role"/> (new results, draft orders).</param>
    /// <param name="contextUnreadable">Observation entries of the hook context that did not parse.</param>
    public AssembledFacts Assemble(
        string patientId,
        DateTimeOffset now,
        IEnumerable<PrefetchValue> values,
        IEnumerable<ParsedResource> contextResources,
        IEnumerable<UnreadableObservation>? contextUnreadable = null)
    {
        ArgumentNullException.ThrowIfNull(values);
        ArgumentNullException.ThrowIfNull(contextResources);
        var valueList = values.ToList();
        var notes = new List<string>();
        var unavailable = new Dictionary<string, string>(StringComparer.Ordinal);
        foreach (var value in valueList)
        {
            if (value.Kind is PrefetchValueKind.Failed or PrefetchValueKind.Unusable)
            {
                // Said once: the first problem is why the data could not be used; only further problems are notes.
                unavailable[value.Key] = value.Problems.FirstOrDefault() ?? "could not be read";
                notes.AddRange(value.Problems.Skip(1));
            }
            else
            {
                notes.AddRange(value.Problems);
            }
        }

        var all = contextResources.Concat(valueList.SelectMany(v => v.Resources))
            .DistinctBy(r => (r.Resource.TypeName, r.Resource.Id ?? r.FullUrl ?? Guid.NewGuid().ToString()))
            .ToList();
        var medications = IndexMedications(all);
        var medicationReader = new MedicationReader(reference => medications.GetValueOrDefault(reference)
            ?? (References.IdOf(reference, "Medication") is { } id ? medications.GetValueOrDefault("Medication/" + id) : null));

        var labs = new List<(Observation Observation, LabResult Result)>();
        var setAside = new List<SetAsideItem>();
        var conditions = new List<ConditionFact>();
        var meds = new List<MedicationFact>();
        var stopped = new List<MedicationFact>();
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
                setAside.Add(Uninterpretable(item.Resource, patientId));
            }
        }

        void ReadOne(ParsedResource item)
        {
            var isDraftOrder = item.Role == ContextRole.DraftOrder;
            switch (item.Resource)
            {
                case Observation observation when _observations.TryRead(observation, patientId, now, item.Origin, out var result, out var aside):
                    if (result is not null)
                    {
                        // ResultSupersession reads these links later, outside this guard: one of the wrong JSON shape
                        // (read lazily by the model) must set this result aside here, not fail the whole answer there.
                        ReadSupersessionLinks(observation);
                        labs.Add((observation, result));
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
                        setAside.Add(SetAsideItem.AboutAnotherPatient("Patient"));
                    }

                    break;
                case Condition condition when IsAnotherPatients(condition.Subject, patientId):
                    setAside.Add(SetAsideItem.AboutAnotherPatient("Condition"));
                    break;
                case MedicationStatement statement when IsAnotherPatients(statement.Subject, patientId):
                    setAside.Add(SetAsideItem.AboutAnotherPatient("MedicationStatement"));
                    break;
                case MedicationRequest request when IsAnotherPatients(request.Subject, patientId):
                    setAside.Add(SetAsideItem.AboutAnotherPatient("MedicationRequest"));
                    break;
                case Condition condition when ConditionReader.Read(condition, patientId) is { } fact:
                    conditions.Add(fact);
                    break;
                case MedicationStatement statement when medicationReader.Read(statement, patientId, item.Origin, setAside) is { } fact:
                    (fact.Use == MedicationUse.Stopped ? stopped : meds).Add(fact);
                    break;
                case MedicationRequest request when medicationReader.Read(request, patientId, item.Origin, isDraftOrder, setAside) is { } fact:
                    (isDraftOrder ? drafts : fact.Use == MedicationUse.Stopped ? stopped : meds).Add(fact);
                    break;
            }
        }

        foreach (var entry in (contextUnreadable ?? []).Concat(valueList.SelectMany(v => v.UnreadableObservations)))
        {
            setAside.Add(SetAsideOf(entry, patientId));
        }

        var (current, superseded) = ResultSupersession.Apply(labs);
        setAside.AddRange(superseded);

        if (all.Any(r => r.Origin == DataOrigin.FhirServer))
        {
            notes.Add("Some data was fetched from the EHR's FHIR server because prefetch did not include it.");
        }

        var facts = new PatientFacts
        {
            PatientId = patientId,
            Sex = sex,
            BirthDate = birthDate,
            Labs = current.Where(l => !l.IsBounded).ToList(),
            BoundedLabs = current.Where(l => l.IsBounded).ToList(),
            SetAside = setAside,
            Conditions = conditions,
            Medications = meds,
            StoppedMedications = stopped,
            DataNotes = notes,
            Unavailable = unavailable,
        };
        return new AssembledFacts(facts, drafts);
    }

    /// <summary>
    /// A resource the model could not interpret. For an Observation, its code, time and subject are still read where they
    /// can be, so an uninterpretable newest sodium is known as such (and another patient's is only counted).
    /// </summary>
    private static SetAsideItem Uninterpretable(Resource resource, string patientId)
    {
        const string reason = "a value in it could not be interpreted";
        var reference = $"{resource.TypeName}/{resource.Id}";
        if (resource is not Observation observation)
        {
            return new SetAsideItem(reference, resource.TypeName, reason);
        }

        Analyte? analyte = null;
        DateTimeOffset? at = null;
        string? subject = null;
        try
        {
            analyte = observation.Code?.Coding?.Where(c => c?.System == CodeSystems.Loinc && c.Code is not null)
                .Select(c => LoincCatalog.TryGet(c.Code!, out var entry) ? entry.Analyte : (Analyte?)null)
                .FirstOrDefault(a => a is not null);
            at = FhirTime.From(observation.Effective) ?? FhirTime.From(observation.IssuedElement);
            subject = observation.Subject?.Reference;
        }
        catch (Exception ex) when (ex is Hl7.Fhir.Utility.CodedException or FormatException or InvalidCastException or OverflowException
            or NullReferenceException or InvalidOperationException or ArgumentException)
        {
            // Nothing more can be told about it; it stays an unreadable Observation.
        }

        return subject is not null && !References.IsPatient(subject, patientId)
            ? SetAsideItem.AboutAnotherPatient("Observation", analyte)
            : new SetAsideItem(reference, analyte is { } a ? AnalyteUnits.DisplayName(a) + " (value not interpretable)" : "Observation", reason, analyte, at);
    }

    private static void ReadSupersessionLinks(Observation observation)
    {
        foreach (var link in observation.DerivedFrom ?? [])
        {
            _ = link?.Reference;
        }

        _ = observation.Specimen?.Reference;
    }

    /// <summary>True when the subject names a patient other than this one (a missing subject is left to each reader).</summary>
    private static bool IsAnotherPatients(ResourceReference? subject, string patientId)
        => subject?.Reference is { } reference && !References.IsPatient(reference, patientId);

    private static SetAsideItem SetAsideOf(UnreadableObservation entry, string patientId)
    {
        Analyte? analyte = entry.LoincCode is { } code && LoincCatalog.TryGet(code, out var known) ? known.Analyte : null;
        if (entry.SubjectReference is { } subject && !References.IsPatient(subject, patientId))
        {
            return SetAsideItem.AboutAnotherPatient("Observation", analyte);
        }

        var what = analyte is { } a ? AnalyteUnits.DisplayName(a) + " (unreadable entry)" : "Observation (unreadable entry)";
        return new SetAsideItem(entry.Reference, what, entry.Reason, analyte, entry.At);
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
