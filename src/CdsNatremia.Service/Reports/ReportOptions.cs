using System.ComponentModel.DataAnnotations;

namespace CdsNatremia.Service.Reports;

/// <summary>
/// The full reports behind the cards' links (section "Natremia:Reports"). A report is kept in this instance's memory
/// only, under a random 128-bit id, for <see cref="KeepHours"/>; the link is a bearer capability, never logged.
/// </summary>
public sealed class ReportOptions
{
    /// <summary>The configuration section.</summary>
    public const string Section = "Natremia:Reports";

    /// <summary>How long a report stays reachable after its card was answered. Default 12 h (one shift), 1–72.</summary>
    [Range(1, 72)]
    public int KeepHours { get; set; } = 12;

    /// <summary>The most reports kept at once (the oldest go first). Default 20,000, 100–1,000,000.</summary>
    [Range(100, 1_000_000)]
    public int MaxReports { get; set; } = 20_000;

    /// <summary>
    /// The base URL the EHR's users reach this service at, for the report links (e.g. https://cds.example.org). Default:
    /// the client-authentication PublicBaseUrl, else the request's own scheme and host.
    /// </summary>
    [Url]
    public string? PublicBaseUrl { get; set; }
}
