using System.Globalization;

namespace CdsNatremia.Cli.Prefetch;

/// <summary>
/// A FHIR date, dateTime or instant as the half-open range of instants it covers at its precision ("2026" covers the
/// whole year; "2026-03-10T07:40:00Z" one second), as FHIR search compares them.
/// </summary>
internal readonly record struct FhirDateRange(DateTimeOffset Start, DateTimeOffset End)
{
    /// <summary>Parses a FHIR date/dateTime/instant; dates without a zone are read as UTC.</summary>
    public static bool TryParse(string? text, out FhirDateRange range)
    {
        range = default;
        if (string.IsNullOrWhiteSpace(text))
        {
            return false;
        }

        var styles = DateTimeStyles.AssumeUniversal | DateTimeStyles.AdjustToUniversal;
        switch (text.Length)
        {
            case 4 when int.TryParse(text, NumberStyles.None, CultureInfo.InvariantCulture, out var year) && year is >= 1 and <= 9998:
                var y = new DateTimeOffset(year, 1, 1, 0, 0, 0, TimeSpan.Zero);
                range = new(y, y.AddYears(1));
                return true;
            case 7 when DateTimeOffset.TryParseExact(text, "yyyy-MM", CultureInfo.InvariantCulture, styles, out var month):
                range = new(month, month.AddMonths(1));
                return true;
            case 10 when DateTimeOffset.TryParseExact(text, "yyyy-MM-dd", CultureInfo.InvariantCulture, styles, out var day):
                range = new(day, day.AddDays(1));
                return true;
        }

        if (DateTimeOffset.TryParse(text, CultureInfo.InvariantCulture, styles, out var instant))
        {
            range = new(instant, instant.AddSeconds(1));
            return true;
        }

        return false;
    }

    /// <summary>
    /// FHIR search date comparison of a resource's range (this) against a search value with a prefix
    /// (eq, ne, lt, gt, le, ge; FHIR R4 search §3.1.1.4.4 "date" semantics, simplified to range overlap).
    /// </summary>
    public bool Satisfies(string prefix, FhirDateRange search) => prefix switch
    {
        "eq" => Start >= search.Start && End <= search.End,
        "ne" => !(Start >= search.Start && End <= search.End),
        "lt" => Start < search.Start,
        "gt" => End > search.End,
        "le" => Start < search.End,
        "ge" => End > search.Start,
        _ => throw new FormatException($"Unknown date prefix '{prefix}'."),
    };
}
