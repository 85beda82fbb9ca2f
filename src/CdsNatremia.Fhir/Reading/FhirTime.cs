using Hl7.Fhir.Model;

namespace CdsNatremia.Fhir.Reading;

/// <summary>Reads FHIR date and time values; a value that does not parse is treated as absent.</summary>
public static class FhirTime
{
    /// <summary>A dateTime, instant, date or the start of a Period, as a UTC offset time.</summary>
    public static DateTimeOffset? From(DataType? value) => value switch
    {
        FhirDateTime dt when dt.TryToDateTimeOffset(TimeSpan.Zero, out var v) => v,
        Instant instant when instant.Value is { } v => v,
        Date date when date.TryToDateTimeOffset(out var v) => v,
        Period period => From(period.StartElement),
        _ => null,
    };

    /// <summary>A dateTime string as used by primitive elements such as authoredOn.</summary>
    public static DateTimeOffset? From(string? value)
        => value is not null && FhirDateTime.IsValidValue(value) ? From(new FhirDateTime(value)) : null;
}
