using System.Globalization;
using System.Text.Json;
using Hl7.Fhir.Model;
using Hl7.Fhir.Utility;

namespace CdsNatremia.Fhir.Reading;

/// <summary>
/// The fast path of prefetch reading: builds the Firely model objects the readers use straight from a request element
/// with <see cref="System.Text.Json"/>, without the SDK's reflective deserializer, for the resource shapes the service
/// meets in prefetch. It never refuses anything: whatever it is not sure of returns null, and <see cref="BundleReader"/>
/// then parses that entry with the SDK (<see cref="ResourceParser"/>), which decides as before. So a resource is either
/// read here into the same objects the SDK would make, or read by the SDK itself; every refusal, problem text and set-aside
/// reason still comes from the SDK path. Held equal to the SDK by <c>FastResourceReaderDifferentialTests</c> (every
/// scenario, the synthetic population, a corpus of malformed and hostile inputs: identical facts and set-aside reasons).
/// <para>
/// <b>Scope</b> (anything else sends the entry to the SDK):
/// <list type="bullet">
/// <item>resource types Observation, Patient, Condition, MedicationStatement, MedicationRequest and Medication;</item>
/// <item>per type, only the elements listed in its reader below; no <c>meta</c>, <c>text</c>, <c>contained</c>,
/// <c>extension</c>, <c>modifierExtension</c>, no primitive extensions (<c>_name</c>), no element the list lacks;</item>
/// <item>every element of the JSON type FHIR gives it (object, array, string, number), no JSON null, no empty string,
/// array or object, no property twice, no two choices of one element (<c>effectiveDateTime</c> and
/// <c>effectivePeriod</c>);</item>
/// <item>codes bound to a required value set only with a literal the SDK's enumeration knows; dates and times only when
/// the SDK's own validity check accepts them; decimals only as plain JSON numbers (no exponent) that fit a decimal;
/// positive integers only as JSON integers above zero.</item>
/// </list>
/// </para>
/// Every element it accepts is stored on the model object, as the SDK stores it, so a reader that starts using an element
/// gets the same value on both paths. Stateless and thread-safe.
/// </summary>
public sealed class FastResourceReader
{
    /// <summary>Reads a resource, or returns null when it is outside this reader's scope (the SDK then reads it).</summary>
    public Resource? TryRead(JsonElement resource)
    {
        if (resource.ValueKind != JsonValueKind.Object)
        {
            return null;
        }

        try
        {
            var type = ResourceType(resource);
            return type switch
            {
                "Observation" => ReadObservation(resource),
                "Patient" => ReadPatient(resource),
                "Condition" => ReadCondition(resource),
                "MedicationStatement" => ReadMedicationStatement(resource),
                "MedicationRequest" => ReadMedicationRequest(resource),
                "Medication" => ReadMedication(resource),
                _ => null,
            };
        }
        catch (OutOfScopeException)
        {
            return null;
        }
    }

    private static string? ResourceType(JsonElement resource)
    {
        string? type = null;
        foreach (var property in resource.EnumerateObject())
        {
            if (property.NameEquals("resourceType"))
            {
                if (type is not null || property.Value.ValueKind != JsonValueKind.String)
                {
                    return null;
                }

                type = property.Value.GetString();
            }
        }

        return type;
    }

    // ---- resources ----

    private static Observation ReadObservation(JsonElement json)
    {
        var o = new Observation();
        var seen = 0L;
        Span<char> nameBuffer = stackalloc char[NameBuffer];
        foreach (var p in json.EnumerateObject())
        {
            switch (NameOf(p, nameBuffer))
            {
                case "resourceType": Once(ref seen, 0); break;
                case "id": Once(ref seen, 1); o.Id = Str(p.Value); break;
                case "status": Once(ref seen, 2); o.Status = Literal<ObservationStatus>(p.Value); break;
                case "category": Once(ref seen, 3); o.Category = ListOf(p.Value, ReadConcept); break;
                case "code": Once(ref seen, 4); o.Code = ReadConcept(p.Value); break;
                case "subject": Once(ref seen, 5); o.Subject = ReadReference(p.Value); break;
                case "effectiveDateTime": Once(ref seen, 6); o.Effective = ReadDateTime(p.Value); break;
                case "effectivePeriod": Once(ref seen, 6); o.Effective = ReadPeriod(p.Value); break;
                case "issued": Once(ref seen, 7); o.IssuedElement = ReadInstant(p.Value); break;
                case "valueQuantity": Once(ref seen, 8); o.Value = ReadQuantity(p.Value); break;
                case "valueString": Once(ref seen, 8); o.Value = new FhirString(Str(p.Value)); break;
                case "dataAbsentReason": Once(ref seen, 9); o.DataAbsentReason = ReadConcept(p.Value); break;
                case "referenceRange": Once(ref seen, 10); o.ReferenceRange = ListOf(p.Value, ReadReferenceRange); break;
                case "identifier": Once(ref seen, 11); o.Identifier = ListOf(p.Value, ReadIdentifier); break;
                case "derivedFrom": Once(ref seen, 12); o.DerivedFrom = ListOf(p.Value, ReadReference); break;
                case "specimen": Once(ref seen, 13); o.Specimen = ReadReference(p.Value); break;
                case "note": Once(ref seen, 14); o.Note = ListOf(p.Value, ReadAnnotation); break;
                case "interpretation": Once(ref seen, 15); o.Interpretation = ListOf(p.Value, ReadConcept); break;
                case "encounter": Once(ref seen, 16); o.Encounter = ReadReference(p.Value); break;
                case "basedOn": Once(ref seen, 17); o.BasedOn = ListOf(p.Value, ReadReference); break;
                default: throw OutOfScopeException.Instance;
            }
        }

        return o;
    }

    private static Patient ReadPatient(JsonElement json)
    {
        var r = new Patient();
        var seen = 0L;
        Span<char> nameBuffer = stackalloc char[NameBuffer];
        foreach (var p in json.EnumerateObject())
        {
            switch (NameOf(p, nameBuffer))
            {
                case "resourceType": Once(ref seen, 0); break;
                case "id": Once(ref seen, 1); r.Id = Str(p.Value); break;
                case "name": Once(ref seen, 2); r.Name = ListOf(p.Value, ReadHumanName); break;
                case "gender": Once(ref seen, 3); r.Gender = Literal<AdministrativeGender>(p.Value); break;
                case "birthDate": Once(ref seen, 4); r.BirthDateElement = ReadDate(p.Value); break;
                default: throw OutOfScopeException.Instance;
            }
        }

        return r;
    }

    private static Condition ReadCondition(JsonElement json)
    {
        var r = new Condition();
        var seen = 0L;
        Span<char> nameBuffer = stackalloc char[NameBuffer];
        foreach (var p in json.EnumerateObject())
        {
            switch (NameOf(p, nameBuffer))
            {
                case "resourceType": Once(ref seen, 0); break;
                case "id": Once(ref seen, 1); r.Id = Str(p.Value); break;
                case "clinicalStatus": Once(ref seen, 2); r.ClinicalStatus = ReadConcept(p.Value); break;
                case "verificationStatus": Once(ref seen, 3); r.VerificationStatus = ReadConcept(p.Value); break;
                case "category": Once(ref seen, 4); r.Category = ListOf(p.Value, ReadConcept); break;
                case "code": Once(ref seen, 5); r.Code = ReadConcept(p.Value); break;
                case "subject": Once(ref seen, 6); r.Subject = ReadReference(p.Value); break;
                case "onsetDateTime": Once(ref seen, 7); r.Onset = ReadDateTime(p.Value); break;
                case "onsetPeriod": Once(ref seen, 7); r.Onset = ReadPeriod(p.Value); break;
                case "recordedDate": Once(ref seen, 8); r.RecordedDateElement = ReadDateTime(p.Value); break;
                default: throw OutOfScopeException.Instance;
            }
        }

        return r;
    }

    private static MedicationStatement ReadMedicationStatement(JsonElement json)
    {
        var r = new MedicationStatement();
        var seen = 0L;
        Span<char> nameBuffer = stackalloc char[NameBuffer];
        foreach (var p in json.EnumerateObject())
        {
            switch (NameOf(p, nameBuffer))
            {
                case "resourceType": Once(ref seen, 0); break;
                case "id": Once(ref seen, 1); r.Id = Str(p.Value); break;
                case "status": Once(ref seen, 2); r.Status = Literal<MedicationStatement.MedicationStatusCodes>(p.Value); break;
                case "medicationCodeableConcept": Once(ref seen, 3); r.Medication = ReadConcept(p.Value); break;
                case "medicationReference": Once(ref seen, 3); r.Medication = ReadReference(p.Value); break;
                case "subject": Once(ref seen, 4); r.Subject = ReadReference(p.Value); break;
                case "effectiveDateTime": Once(ref seen, 5); r.Effective = ReadDateTime(p.Value); break;
                case "effectivePeriod": Once(ref seen, 5); r.Effective = ReadPeriod(p.Value); break;
                case "dateAsserted": Once(ref seen, 6); r.DateAssertedElement = ReadDateTime(p.Value); break;
                case "dosage": Once(ref seen, 7); r.Dosage = ListOf(p.Value, ReadDosage); break;
                default: throw OutOfScopeException.Instance;
            }
        }

        return r;
    }

    private static MedicationRequest ReadMedicationRequest(JsonElement json)
    {
        var r = new MedicationRequest();
        var seen = 0L;
        Span<char> nameBuffer = stackalloc char[NameBuffer];
        foreach (var p in json.EnumerateObject())
        {
            switch (NameOf(p, nameBuffer))
            {
                case "resourceType": Once(ref seen, 0); break;
                case "id": Once(ref seen, 1); r.Id = Str(p.Value); break;
                case "status": Once(ref seen, 2); r.Status = Literal<MedicationRequest.MedicationrequestStatus>(p.Value); break;
                case "intent": Once(ref seen, 3); r.Intent = Literal<MedicationRequest.MedicationRequestIntent>(p.Value); break;
                case "medicationCodeableConcept": Once(ref seen, 4); r.Medication = ReadConcept(p.Value); break;
                case "medicationReference": Once(ref seen, 4); r.Medication = ReadReference(p.Value); break;
                case "subject": Once(ref seen, 5); r.Subject = ReadReference(p.Value); break;
                case "authoredOn": Once(ref seen, 6); r.AuthoredOnElement = ReadDateTime(p.Value); break;
                case "dosageInstruction": Once(ref seen, 7); r.DosageInstruction = ListOf(p.Value, ReadDosage); break;
                case "dispenseRequest": Once(ref seen, 8); r.DispenseRequest = ReadDispenseRequest(p.Value); break;
                default: throw OutOfScopeException.Instance;
            }
        }

        return r;
    }

    private static Medication ReadMedication(JsonElement json)
    {
        var r = new Medication();
        var seen = 0L;
        Span<char> nameBuffer = stackalloc char[NameBuffer];
        foreach (var p in json.EnumerateObject())
        {
            switch (NameOf(p, nameBuffer))
            {
                case "resourceType": Once(ref seen, 0); break;
                case "id": Once(ref seen, 1); r.Id = Str(p.Value); break;
                case "code": Once(ref seen, 2); r.Code = ReadConcept(p.Value); break;
                case "ingredient": Once(ref seen, 3); r.Ingredient = ListOf(p.Value, ReadIngredient); break;
                default: throw OutOfScopeException.Instance;
            }
        }

        return r;
    }

    // ---- backbone elements ----

    private static Observation.ReferenceRangeComponent ReadReferenceRange(JsonElement json)
    {
        var r = new Observation.ReferenceRangeComponent();
        var seen = 0L;
        Span<char> nameBuffer = stackalloc char[NameBuffer];
        foreach (var p in Properties(json))
        {
            switch (NameOf(p, nameBuffer))
            {
                case "low": Once(ref seen, 0); r.Low = ReadQuantity(p.Value); break;
                case "high": Once(ref seen, 1); r.High = ReadQuantity(p.Value); break;
                case "text": Once(ref seen, 2); r.Text = Str(p.Value); break;
                default: throw OutOfScopeException.Instance;
            }
        }

        return r;
    }

    private static Medication.IngredientComponent ReadIngredient(JsonElement json)
    {
        var r = new Medication.IngredientComponent();
        var seen = 0L;
        Span<char> nameBuffer = stackalloc char[NameBuffer];
        foreach (var p in Properties(json))
        {
            switch (NameOf(p, nameBuffer))
            {
                case "itemCodeableConcept": Once(ref seen, 0); r.Item = ReadConcept(p.Value); break;
                case "itemReference": Once(ref seen, 0); r.Item = ReadReference(p.Value); break;
                case "strength": Once(ref seen, 1); r.Strength = ReadRatio(p.Value); break;
                case "isActive": Once(ref seen, 2); r.IsActive = Bool(p.Value); break;
                default: throw OutOfScopeException.Instance;
            }
        }

        return r;
    }

    private static MedicationRequest.DispenseRequestComponent ReadDispenseRequest(JsonElement json)
    {
        var r = new MedicationRequest.DispenseRequestComponent();
        var seen = 0L;
        Span<char> nameBuffer = stackalloc char[NameBuffer];
        foreach (var p in Properties(json))
        {
            switch (NameOf(p, nameBuffer))
            {
                case "quantity": Once(ref seen, 0); r.Quantity = ReadQuantity(p.Value); break;
                case "validityPeriod": Once(ref seen, 1); r.ValidityPeriod = ReadPeriod(p.Value); break;
                default: throw OutOfScopeException.Instance;
            }
        }

        return r;
    }

    // ---- data types ----

    private static Dosage ReadDosage(JsonElement json)
    {
        var r = new Dosage();
        var seen = 0L;
        Span<char> nameBuffer = stackalloc char[NameBuffer];
        foreach (var p in Properties(json))
        {
            switch (NameOf(p, nameBuffer))
            {
                case "text": Once(ref seen, 0); r.Text = Str(p.Value); break;
                case "route": Once(ref seen, 1); r.Route = ReadConcept(p.Value); break;
                case "timing": Once(ref seen, 2); r.Timing = ReadTiming(p.Value); break;
                case "doseAndRate": Once(ref seen, 3); r.DoseAndRate = ListOf(p.Value, ReadDoseAndRate); break;
                default: throw OutOfScopeException.Instance;
            }
        }

        return r;
    }

    private static Dosage.DoseAndRateComponent ReadDoseAndRate(JsonElement json)
    {
        var r = new Dosage.DoseAndRateComponent();
        var seen = 0L;
        Span<char> nameBuffer = stackalloc char[NameBuffer];
        foreach (var p in Properties(json))
        {
            switch (NameOf(p, nameBuffer))
            {
                case "type": Once(ref seen, 0); r.Type = ReadConcept(p.Value); break;
                case "doseQuantity": Once(ref seen, 1); r.Dose = ReadQuantity(p.Value); break;
                case "rateQuantity": Once(ref seen, 2); r.Rate = ReadQuantity(p.Value); break;
                default: throw OutOfScopeException.Instance;
            }
        }

        return r;
    }

    private static Timing ReadTiming(JsonElement json)
    {
        var r = new Timing();
        var seen = 0L;
        Span<char> nameBuffer = stackalloc char[NameBuffer];
        foreach (var p in Properties(json))
        {
            switch (NameOf(p, nameBuffer))
            {
                case "repeat": Once(ref seen, 0); r.Repeat = ReadRepeat(p.Value); break;
                case "code": Once(ref seen, 1); r.Code = ReadConcept(p.Value); break;
                default: throw OutOfScopeException.Instance;
            }
        }

        return r;
    }

    private static Timing.RepeatComponent ReadRepeat(JsonElement json)
    {
        var r = new Timing.RepeatComponent();
        var seen = 0L;
        Span<char> nameBuffer = stackalloc char[NameBuffer];
        foreach (var p in Properties(json))
        {
            switch (NameOf(p, nameBuffer))
            {
                case "count": Once(ref seen, 0); r.Count = PositiveInt(p.Value); break;
                case "duration": Once(ref seen, 1); r.Duration = ReadDecimal(p.Value); break;
                case "durationUnit": Once(ref seen, 2); r.DurationUnit = Literal<Timing.UnitsOfTime>(p.Value); break;
                case "frequency": Once(ref seen, 3); r.Frequency = PositiveInt(p.Value); break;
                case "period": Once(ref seen, 4); r.Period = ReadDecimal(p.Value); break;
                case "periodUnit": Once(ref seen, 5); r.PeriodUnit = Literal<Timing.UnitsOfTime>(p.Value); break;
                default: throw OutOfScopeException.Instance;
            }
        }

        return r;
    }

    private static CodeableConcept ReadConcept(JsonElement json)
    {
        var r = new CodeableConcept();
        var seen = 0L;
        Span<char> nameBuffer = stackalloc char[NameBuffer];
        foreach (var p in Properties(json))
        {
            switch (NameOf(p, nameBuffer))
            {
                case "coding": Once(ref seen, 0); r.Coding = ListOf(p.Value, ReadCoding); break;
                case "text": Once(ref seen, 1); r.Text = Str(p.Value); break;
                default: throw OutOfScopeException.Instance;
            }
        }

        return r;
    }

    private static Coding ReadCoding(JsonElement json)
    {
        var r = new Coding();
        var seen = 0L;
        Span<char> nameBuffer = stackalloc char[NameBuffer];
        foreach (var p in Properties(json))
        {
            switch (NameOf(p, nameBuffer))
            {
                case "system": Once(ref seen, 0); r.System = Str(p.Value); break;
                case "version": Once(ref seen, 1); r.Version = Str(p.Value); break;
                case "code": Once(ref seen, 2); r.Code = Str(p.Value); break;
                case "display": Once(ref seen, 3); r.Display = Str(p.Value); break;
                default: throw OutOfScopeException.Instance;
            }
        }

        return r;
    }

    private static ResourceReference ReadReference(JsonElement json)
    {
        var r = new ResourceReference();
        var seen = 0L;
        Span<char> nameBuffer = stackalloc char[NameBuffer];
        foreach (var p in Properties(json))
        {
            switch (NameOf(p, nameBuffer))
            {
                case "reference": Once(ref seen, 0); r.Reference = Str(p.Value); break;
                case "type": Once(ref seen, 1); r.Type = Str(p.Value); break;
                case "display": Once(ref seen, 2); r.Display = Str(p.Value); break;
                default: throw OutOfScopeException.Instance;
            }
        }

        return r;
    }

    private static Identifier ReadIdentifier(JsonElement json)
    {
        var r = new Identifier();
        var seen = 0L;
        Span<char> nameBuffer = stackalloc char[NameBuffer];
        foreach (var p in Properties(json))
        {
            switch (NameOf(p, nameBuffer))
            {
                case "use": Once(ref seen, 0); r.Use = Literal<Identifier.IdentifierUse>(p.Value); break;
                case "system": Once(ref seen, 1); r.System = Str(p.Value); break;
                case "value": Once(ref seen, 2); r.Value = Str(p.Value); break;
                default: throw OutOfScopeException.Instance;
            }
        }

        return r;
    }

    private static Quantity ReadQuantity(JsonElement json)
    {
        var r = new Quantity();
        var seen = 0L;
        Span<char> nameBuffer = stackalloc char[NameBuffer];
        foreach (var p in Properties(json))
        {
            switch (NameOf(p, nameBuffer))
            {
                case "value": Once(ref seen, 0); r.Value = ReadDecimal(p.Value); break;
                case "comparator": Once(ref seen, 1); r.Comparator = Literal<Quantity.QuantityComparator>(p.Value); break;
                case "unit": Once(ref seen, 2); r.Unit = Str(p.Value); break;
                case "system": Once(ref seen, 3); r.System = Str(p.Value); break;
                case "code": Once(ref seen, 4); r.Code = Str(p.Value); break;
                default: throw OutOfScopeException.Instance;
            }
        }

        return r;
    }

    private static Ratio ReadRatio(JsonElement json)
    {
        var r = new Ratio();
        var seen = 0L;
        Span<char> nameBuffer = stackalloc char[NameBuffer];
        foreach (var p in Properties(json))
        {
            switch (NameOf(p, nameBuffer))
            {
                case "numerator": Once(ref seen, 0); r.Numerator = ReadQuantity(p.Value); break;
                case "denominator": Once(ref seen, 1); r.Denominator = ReadQuantity(p.Value); break;
                default: throw OutOfScopeException.Instance;
            }
        }

        return r;
    }

    private static Period ReadPeriod(JsonElement json)
    {
        var r = new Period();
        var seen = 0L;
        Span<char> nameBuffer = stackalloc char[NameBuffer];
        foreach (var p in Properties(json))
        {
            switch (NameOf(p, nameBuffer))
            {
                case "start": Once(ref seen, 0); r.StartElement = ReadDateTime(p.Value); break;
                case "end": Once(ref seen, 1); r.EndElement = ReadDateTime(p.Value); break;
                default: throw OutOfScopeException.Instance;
            }
        }

        return r;
    }

    private static HumanName ReadHumanName(JsonElement json)
    {
        var r = new HumanName();
        var seen = 0L;
        Span<char> nameBuffer = stackalloc char[NameBuffer];
        foreach (var p in Properties(json))
        {
            switch (NameOf(p, nameBuffer))
            {
                case "use": Once(ref seen, 0); r.Use = Literal<HumanName.NameUse>(p.Value); break;
                case "text": Once(ref seen, 1); r.Text = Str(p.Value); break;
                case "family": Once(ref seen, 2); r.Family = Str(p.Value); break;
                case "given": Once(ref seen, 3); r.Given = ListOf(p.Value, Str); break;
                case "prefix": Once(ref seen, 4); r.Prefix = ListOf(p.Value, Str); break;
                case "suffix": Once(ref seen, 5); r.Suffix = ListOf(p.Value, Str); break;
                default: throw OutOfScopeException.Instance;
            }
        }

        return r;
    }

    private static Annotation ReadAnnotation(JsonElement json)
    {
        var r = new Annotation();
        var seen = 0L;
        Span<char> nameBuffer = stackalloc char[NameBuffer];
        foreach (var p in Properties(json))
        {
            switch (NameOf(p, nameBuffer))
            {
                case "text": Once(ref seen, 0); r.Text = new Markdown(Str(p.Value)); break;
                case "time": Once(ref seen, 1); r.TimeElement = ReadDateTime(p.Value); break;
                case "authorString": Once(ref seen, 2); r.Author = new FhirString(Str(p.Value)); break;
                default: throw OutOfScopeException.Instance;
            }
        }

        return r;
    }

    // ---- primitives and shapes ----

    /// <summary>The properties of a non-empty JSON object.</summary>
    private const int NameBuffer = 32;

    /// <summary>
    /// A property's name without a new string: its UTF-8 bytes copied into <paramref name="buffer"/> when they are plain
    /// ASCII (every name this reader knows is). A name with an escape, another character or more than the buffer holds
    /// is read the allocating way, so it compares exactly as before.
    /// </summary>
    private static ReadOnlySpan<char> NameOf(JsonProperty property, Span<char> buffer)
    {
        var raw = System.Runtime.InteropServices.JsonMarshal.GetRawUtf8PropertyName(property);
        if (raw.Length > buffer.Length)
        {
            return property.Name;
        }

        for (var i = 0; i < raw.Length; i++)
        {
            var b = raw[i];
            if (b is > 0x7F or (byte)'\\')
            {
                return property.Name;
            }

            buffer[i] = (char)b;
        }

        return buffer[..raw.Length];
    }

    private static JsonElement.ObjectEnumerator Properties(JsonElement json)
    {
        if (json.ValueKind != JsonValueKind.Object)
        {
            throw OutOfScopeException.Instance;
        }

        var properties = json.EnumerateObject();
        if (!properties.MoveNext())
        {
            throw OutOfScopeException.Instance; // {} is left to the SDK
        }

        properties.Reset();
        return properties;
    }

    /// <summary>A non-empty JSON array, each item read by <paramref name="read"/>.</summary>
    private static List<T> ListOf<T>(JsonElement json, Func<JsonElement, T> read)
    {
        if (json.ValueKind != JsonValueKind.Array)
        {
            throw OutOfScopeException.Instance;
        }

        var length = json.GetArrayLength();
        if (length == 0)
        {
            throw OutOfScopeException.Instance;
        }

        var list = new List<T>(length);
        foreach (var item in json.EnumerateArray())
        {
            list.Add(read(item));
        }

        return list;
    }

    private static void Once(ref long seen, int bit)
    {
        var mask = 1L << bit;
        if ((seen & mask) != 0)
        {
            throw OutOfScopeException.Instance; // a property twice, or two choices of one element
        }

        seen |= mask;
    }

    /// <summary>A JSON string with some non-blank content.</summary>
    private static string Str(JsonElement json)
    {
        if (json.ValueKind != JsonValueKind.String)
        {
            throw OutOfScopeException.Instance;
        }

        var value = json.GetString();
        return string.IsNullOrWhiteSpace(value) ? throw OutOfScopeException.Instance : value;
    }

    private static bool Bool(JsonElement json) => json.ValueKind switch
    {
        JsonValueKind.True => true,
        JsonValueKind.False => false,
        _ => throw OutOfScopeException.Instance,
    };

    private static T Literal<T>(JsonElement json)
        where T : struct, Enum
        => EnumUtility.ParseLiteral<T>(Str(json)) ?? throw OutOfScopeException.Instance;

    /// <summary>A plain JSON number (no exponent) that fits a decimal, with the scale it was written with.</summary>
    private static decimal ReadDecimal(JsonElement json)
    {
        if (json.ValueKind != JsonValueKind.Number)
        {
            throw OutOfScopeException.Instance;
        }

        var raw = json.GetRawText();
        if (raw.AsSpan().IndexOfAny('e', 'E') >= 0 || !decimal.TryParse(raw, NumberStyles.AllowLeadingSign | NumberStyles.AllowDecimalPoint, CultureInfo.InvariantCulture, out var value))
        {
            throw OutOfScopeException.Instance;
        }

        return value;
    }

    private static int PositiveInt(JsonElement json)
        => json.ValueKind == JsonValueKind.Number && json.TryGetInt32(out var value) && value > 0 && json.GetRawText().IndexOf('.', StringComparison.Ordinal) < 0
            ? value
            : throw OutOfScopeException.Instance;

    private static FhirDateTime ReadDateTime(JsonElement json)
    {
        var value = Str(json);
        return FhirTime.TryParseCommon(value, out _) || FhirDateTime.IsValidValue(value) ? new FhirDateTime(value) : throw OutOfScopeException.Instance;
    }

    private static Date ReadDate(JsonElement json)
    {
        var value = Str(json);
        return Hl7.Fhir.Model.Date.IsValidValue(value) ? new Date(value) : throw OutOfScopeException.Instance;
    }

    private static Instant ReadInstant(JsonElement json)
    {
        var value = Str(json);
        return FhirTime.TryParseCommon(value, out var instant)
            || (Hl7.Fhir.Model.Instant.IsValidValue(value) && DateTimeOffset.TryParse(value, CultureInfo.InvariantCulture, DateTimeStyles.None, out instant))
            ? new Instant(instant)
            : throw OutOfScopeException.Instance;
    }

    /// <summary>Thrown inside the reader when an element is outside its scope; never leaves it.</summary>
    private sealed class OutOfScopeException : Exception
    {
        public static readonly OutOfScopeException Instance = new();
    }
}
