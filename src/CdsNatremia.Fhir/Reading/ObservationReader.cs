using System.Globalization;
using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Sodium;
using Hl7.Fhir.Model;

namespace CdsNatremia.Fhir.Reading;

/// <summary>
/// Turns an Observation into a <see cref="LabResult"/>, or sets it aside with the reason. Rules, in order:
/// a LOINC code the service reads (others are ignored, not listed); the subject is this patient; status
/// final/amended/corrected (preliminary counted and labelled; cancelled, entered-in-error, registered and unknown never);
/// a numeric valueQuantity (with a comparator it becomes a bounded result, <see cref="LabResult.Comparator"/>); a time (effective[x], else issued) not in the future;
/// a unit the analyte accepts, converted to the canonical unit; a plausible value.
/// </summary>
public sealed class ObservationReader
{
    private readonly SodiumReadingOptions _options;

    /// <summary>Creates a reader.</summary>
    public ObservationReader(SodiumReadingOptions options) => _options = options ?? throw new ArgumentNullException(nameof(options));

    /// <summary>Reads one Observation. Returns false when it is not a code the service reads.</summary>
    public bool TryRead(Observation observation, string patientId, DateTimeOffset now, DataOrigin origin, out LabResult? result, out SetAsideItem? setAside)
    {
        ArgumentNullException.ThrowIfNull(observation);
        result = null;
        setAside = null;
        var coding = observation.Code?.Coding?.FirstOrDefault(c => c is not null && c.System == CodeSystems.Loinc && c.Code is not null
            && (LoincCatalog.TryGet(c.Code, out _) || LoincCatalog.IsRefused(c.Code, out _, out _)));
        if (coding?.Code is not { } code)
        {
            return false;
        }

        // Whole seconds: finer precision means nothing clinically, and a fraction below .NET's 100 ns tick would be
        // rounded differently by different code paths.
        var time = WholeSeconds(FhirTime.From(observation.Effective) ?? FhirTime.From(observation.IssuedElement));

        // The reference and the described value are only needed when a result is set aside: built then, not for every result.
        if (LoincCatalog.IsRefused(code, out var refusedAnalyte, out var refusedReason))
        {
            setAside = new SetAsideItem(ReferenceOf(observation), $"LOINC {code} {Describe(observation)}", refusedReason, refusedAnalyte, time);
            return true;
        }

        LoincCatalog.TryGet(code, out var entry);
        SetAsideItem Aside(string reason)
            => new(ReferenceOf(observation), $"{AnalyteUnits.DisplayName(entry.Analyte)} {Describe(observation)}", reason, entry.Analyte, time);

        if (string.IsNullOrEmpty(observation.Id))
        {
            setAside = Aside("the Observation has no id, so a card could not cite it");
            return true;
        }

        if (observation.Subject?.Reference is null)
        {
            setAside = Aside("no subject: it cannot be confirmed to belong to this patient");
            return true;
        }

        if (!References.IsPatient(observation.Subject.Reference, patientId))
        {
            // Another patient's data: counted only. Its id, value and time never reach the facts (privacy).
            setAside = SetAsideItem.AboutAnotherPatient("Observation", entry.Analyte);
            return true;
        }

        var preliminary = false;
        switch (observation.Status)
        {
            case ObservationStatus.Final or ObservationStatus.Amended or ObservationStatus.Corrected:
                break;
            case ObservationStatus.Preliminary:
                preliminary = true;
                break;
            case ObservationStatus.Cancelled:
                setAside = Aside("status cancelled: a cancelled result never counts") with { State = FactState.Absent };
                return true;
            case ObservationStatus.EnteredInError:
                setAside = Aside("status entered-in-error: a result entered in error never counts") with { State = FactState.Absent };
                return true;
            case ObservationStatus.Registered:
                setAside = Aside("status registered: no result yet") with { State = FactState.Absent };
                return true;
            default:
                setAside = Aside($"status {StatusText(observation)}: only final, amended, corrected or preliminary results are used");
                return true;
        }

        if (observation.DataAbsentReason is not null)
        {
            setAside = Aside("the result is marked as absent (dataAbsentReason" + (Codings.TextOf(observation.DataAbsentReason) is { } why ? ": " + why : string.Empty) + ")");
            return true;
        }

        if (observation.Value is not Quantity quantity || quantity.Value is not { } rawValue)
        {
            setAside = Aside("no numeric quantity value");
            return true;
        }

        if (time is null)
        {
            setAside = Aside("no time (neither effective[x] nor issued)");
            return true;
        }

        if (time > now.AddMinutes(_options.FutureToleranceMinutes))
        {
            setAside = Aside("its time is in the future");
            return true;
        }

        var unit = UnitOf(quantity);
        var value = (double)rawValue;
        if (!UnitConversions.TryConvert(entry.Analyte, code, value, unit, out var canonical, out var reason))
        {
            setAside = Aside(reason);
            return true;
        }

        var range = observation.ReferenceRange?.FirstOrDefault();
        var comparator = quantity.Comparator switch
        {
            Quantity.QuantityComparator.LessThan => ValueComparator.LessThan,
            Quantity.QuantityComparator.LessOrEqual => ValueComparator.LessOrEqual,
            Quantity.QuantityComparator.GreaterThan => ValueComparator.GreaterThan,
            Quantity.QuantityComparator.GreaterOrEqual => ValueComparator.GreaterOrEqual,
            _ => (ValueComparator?)null,
        };
        if (quantity.Comparator is not null && comparator is null)
        {
            setAside = Aside("the comparator is not one FHIR R4 defines for a quantity");
            return true;
        }

        result = new LabResult(
            observation.Id,
            entry.Analyte,
            canonical,
            time.Value,
            preliminary,
            entry.Specimen,
            code,
            UnitConversions.ConvertBound(entry.Analyte, code, (double?)range?.Low?.Value, range?.Low is null ? null : UnitOf(range.Low)),
            UnitConversions.ConvertBound(entry.Analyte, code, (double?)range?.High?.Value, range?.High is null ? null : UnitOf(range.High)),
            value,
            unit,
            origin)
        {
            Comparator = comparator,
            Identifiers = observation.Identifier?.Where(i => !string.IsNullOrEmpty(i?.Value)).Select(i => (i.System ?? string.Empty) + "|" + i.Value).ToList() ?? [],
        };
        return true;
    }

    private static DateTimeOffset? WholeSeconds(DateTimeOffset? time)
        => time is { } t ? new DateTimeOffset(t.UtcTicks - (t.UtcTicks % TimeSpan.TicksPerSecond), TimeSpan.Zero) : null;

    /// <summary>The UCUM code when the system is UCUM (or absent), else the human unit string.</summary>
    private static string? UnitOf(Quantity quantity)
        => !string.IsNullOrWhiteSpace(quantity.Code) && (quantity.System is null || quantity.System == CodeSystems.Ucum)
            ? quantity.Code
            : quantity.Unit;

    /// <summary>The comparator as a reader writes it ("below "), never the enum's name.</summary>
    private static string ComparatorText(Quantity.QuantityComparator? comparator) => comparator switch
    {
        Quantity.QuantityComparator.LessThan => "below ",
        Quantity.QuantityComparator.LessOrEqual => "at or below ",
        Quantity.QuantityComparator.GreaterThan => "above ",
        Quantity.QuantityComparator.GreaterOrEqual => "at or above ",
        _ => string.Empty,
    };

    private static string ReferenceOf(Observation observation) => "Observation/" + (observation.Id ?? "(no id)");

    private static string StatusText(Observation observation) => observation.StatusElement?.JsonValue as string ?? "missing";

    private static string Describe(Observation observation) => observation.Value switch
    {
        Quantity q when q.Value is { } v => $"{ComparatorText(q.Comparator)}{v.ToString(CultureInfo.InvariantCulture)} {UnitOf(q) ?? "(no unit)"}".Trim(),
        FhirString s => $"'{s.Value}'",
        null => "(no value)",
        var other => $"({other.TypeName})",
    };
}
