using Hl7.Fhir.Model;

namespace CdsNatremia.Fhir.Reading;

/// <summary>
/// Reads FHIR date and time values; a value that does not parse is treated as absent. The common full form of a
/// dateTime or instant (<c>yyyy-MM-ddTHH:mm:ss</c>, optional milliseconds, <c>Z</c> or an offset) is read by
/// <see cref="TryParseCommon"/> without the SDK's regular expressions (the largest single source of allocation per
/// request); every other form goes to the SDK as before. <c>FhirTimeTests</c> holds the two equal, offset included.
/// </summary>
public static class FhirTime
{
    /// <summary>A dateTime, instant, date or the start of a Period, as a UTC offset time.</summary>
    public static DateTimeOffset? From(DataType? value) => value switch
    {
        FhirDateTime dt => FromDateTime(dt),
        Instant instant when instant.Value is { } v => v,
        Date date when date.TryToDateTimeOffset(out var v) => v,
        Period period => From(period.StartElement),
        _ => null,
    };

    /// <summary>A dateTime string as used by primitive elements such as authoredOn.</summary>
    public static DateTimeOffset? From(string? value)
        => value is null ? null
            : TryParseCommon(value, out var common) ? common
            : FhirDateTime.IsValidValue(value) ? BySdk(new FhirDateTime(value)) : null;

    private static DateTimeOffset? FromDateTime(FhirDateTime value)
        => value.Value is { } text && TryParseCommon(text, out var common) ? common : BySdk(value);

    private static DateTimeOffset? BySdk(FhirDateTime value)
        => value.TryToDateTimeOffset(TimeSpan.Zero, out var parsed) ? parsed : null;

    /// <summary>
    /// Parses the common full form <c>yyyy-MM-ddTHH:mm:ss[.fff](Z|±hh:mm)</c> (lengths 20, 24, 25 and 29) with a valid
    /// calendar date, seconds 00–59 and an offset the FHIR grammar allows (up to ±13:59, or ±14:00). Anything else,
    /// leap seconds, other precisions and partial dates among them, returns false and is left to the SDK.
    /// </summary>
    public static bool TryParseCommon(string value, out DateTimeOffset result)
    {
        result = default;
        if (value is null || value.Length is not (20 or 24 or 25 or 29))
        {
            return false;
        }

        var s = value.AsSpan();
        if (s[4] != '-' || s[7] != '-' || s[10] != 'T' || s[13] != ':' || s[16] != ':')
        {
            return false;
        }

        if (!Digits(s, 0, 4, out var year) || !Digits(s, 5, 2, out var month) || !Digits(s, 8, 2, out var day)
            || !Digits(s, 11, 2, out var hour) || !Digits(s, 14, 2, out var minute) || !Digits(s, 17, 2, out var second))
        {
            return false;
        }

        var next = 19;
        var millisecond = 0;
        if (s[next] == '.')
        {
            if (!Digits(s, next + 1, 3, out millisecond))
            {
                return false;
            }

            next += 4;
        }

        TimeSpan offset;
        var zone = s[next..];
        if (zone is "Z")
        {
            offset = TimeSpan.Zero;
        }
        else if (zone.Length == 6 && zone[0] is '+' or '-' && zone[3] == ':'
                 && Digits(zone, 1, 2, out var offsetHours) && Digits(zone, 4, 2, out var offsetMinutes)
                 && ((offsetHours <= 13 && offsetMinutes <= 59) || (offsetHours == 14 && offsetMinutes == 0)))
        {
            offset = new TimeSpan(offsetHours, offsetMinutes, 0);
            if (zone[0] == '-')
            {
                offset = -offset;
            }
        }
        else
        {
            return false;
        }

        if (year < 1 || month is < 1 or > 12 || day < 1 || day > DateTime.DaysInMonth(year, month) || hour > 23 || minute > 59 || second > 59)
        {
            return false;
        }

        var local = new DateTime(year, month, day, hour, minute, second, millisecond, DateTimeKind.Unspecified);
        var utcTicks = local.Ticks - offset.Ticks;
        if (utcTicks < DateTime.MinValue.Ticks || utcTicks > DateTime.MaxValue.Ticks)
        {
            return false; // outside what a DateTimeOffset holds: the SDK decides
        }

        result = new DateTimeOffset(local, offset);
        return true;
    }

    private static bool Digits(ReadOnlySpan<char> s, int start, int count, out int value)
    {
        value = 0;
        for (var i = start; i < start + count; i++)
        {
            var c = s[i];
            if (c is < '0' or > '9')
            {
                return false;
            }

            value = (value * 10) + (c - '0');
        }

        return true;
    }
}
