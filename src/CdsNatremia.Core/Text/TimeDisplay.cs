using System.Globalization;

namespace CdsNatremia.Core.Text;

/// <summary>
/// How every time shown to a clinician is printed: in the site's display time zone (setting
/// <c>Natremia:Display:TimeZone</c>, an IANA id, default UTC), with a result's age counted from the request's Now.
/// A value: the zone is resolved by the host at start-up, the core reads no clock and no time-zone files.
/// FHIR resources in actions are not printed through this type; they keep ISO 8601 with an offset.
/// </summary>
public sealed class TimeDisplay
{
    /// <summary>Creates the display for one request.</summary>
    public TimeDisplay(TimeZoneInfo zone, DateTimeOffset now)
    {
        Zone = Guard.NotNull(zone, nameof(zone));
        Now = now;
    }

    /// <summary>UTC display (the default when no zone is configured).</summary>
    public static TimeDisplay Utc(DateTimeOffset now) => new(TimeZoneInfo.Utc, now);

    /// <summary>The display time zone.</summary>
    public TimeZoneInfo Zone { get; }

    /// <summary>The request's Now, from which ages are counted.</summary>
    public DateTimeOffset Now { get; }

    /// <summary>True when the display zone is UTC.</summary>
    public bool IsUtc => Zone.BaseUtcOffset == TimeSpan.Zero && !Zone.SupportsDaylightSavingTime;

    /// <summary>
    /// A time as card details print it. UTC: "2026-03-10 06:30 UTC"; another zone: local time with the offset in
    /// force at that instant, "2026-03-10 07:30 (UTC+01:00)", so a daylight-saving change never leaves a time ambiguous.
    /// </summary>
    public string Time(DateTimeOffset value)
    {
        var local = TimeZoneInfo.ConvertTime(value, Zone);
        return IsUtc
            ? local.ToString("yyyy-MM-dd HH:mm 'UTC'", CultureInfo.InvariantCulture)
            : local.ToString("yyyy-MM-dd HH:mm", CultureInfo.InvariantCulture) + " (" + Offset(local.Offset) + ")";
    }

    /// <summary>
    /// A short time for summaries, the wall-clock time of the display zone without a label: "10 Mar 07:30" (a summary
    /// has under 140 characters; the detail's times name the zone).
    /// </summary>
    public string ShortTime(DateTimeOffset value)
        => TimeZoneInfo.ConvertTime(value, Zone).ToString("dd MMM HH:mm", CultureInfo.InvariantCulture);

    /// <summary>A calendar day in the display zone: "2026-03-10".</summary>
    public string Day(DateTimeOffset value)
        => TimeZoneInfo.ConvertTime(value, Zone).ToString("yyyy-MM-dd", CultureInfo.InvariantCulture);

    /// <summary>
    /// A result's age counted from the request's Now: "just now" (under a minute, or a time slightly after Now),
    /// "N min ago" (under an hour), "N h ago" (under 48 h), "N days ago" (from 48 h). Whole units, rounded down:
    /// 59 min is "59 min ago", 60 min "1 h ago", 47 h 59 min "47 h ago", 48 h "2 days ago".
    /// </summary>
    public string Age(DateTimeOffset value)
    {
        var age = Now - value;
        if (age < TimeSpan.FromMinutes(1))
        {
            return "just now";
        }

        if (age < TimeSpan.FromHours(1))
        {
            return Invariant.Format($"{(int)age.TotalMinutes} min ago");
        }

        if (age < TimeSpan.FromHours(48))
        {
            return Invariant.Format($"{(int)age.TotalHours} h ago");
        }

        return Invariant.Format($"{(int)age.TotalDays} days ago");
    }

    /// <summary>A result's age and time, as summaries print it: "3 h ago, 02 Dec 09:40".</summary>
    public string AgeAndTime(DateTimeOffset value) => Age(value) + ", " + ShortTime(value);

    private static string Offset(TimeSpan offset)
        => "UTC" + (offset < TimeSpan.Zero ? "−" : "+") + offset.Duration().ToString(@"hh\:mm", CultureInfo.InvariantCulture);
}
