namespace CdsNatremia.Service.Configuration;

/// <summary>How cards show times to clinicians, bound from the "Natremia:Display" configuration section.</summary>
public sealed class DisplayOptions
{
    /// <summary>The configuration section.</summary>
    public const string Section = NatremiaServiceOptions.Section + ":Display";

    /// <summary>
    /// The IANA time-zone id every time on a card is shown in (e.g. "Europe/Berlin"), with the result's age. Default "UTC".
    /// An unknown id stops start-up with a message naming this setting. FHIR resources in actions keep ISO 8601 with offset.
    /// </summary>
    public string TimeZone { get; set; } = "UTC";

    /// <summary>Resolves <see cref="TimeZone"/>; throws an <see cref="InvalidOperationException"/> naming the setting when it is unknown.</summary>
    public TimeZoneInfo ResolveTimeZone()
    {
        if (string.IsNullOrWhiteSpace(TimeZone))
        {
            throw new InvalidOperationException($"{Section}:{nameof(TimeZone)} is empty: set an IANA time-zone id such as \"UTC\" or \"Europe/Berlin\".");
        }

        try
        {
            return TimeZoneInfo.FindSystemTimeZoneById(TimeZone);
        }
        catch (Exception ex) when (ex is TimeZoneNotFoundException or InvalidTimeZoneException)
        {
            throw new InvalidOperationException($"{Section}:{nameof(TimeZone)} \"{TimeZone}\" is not a known IANA time-zone id (e.g. \"UTC\", \"Europe/Berlin\").", ex);
        }
    }
}
