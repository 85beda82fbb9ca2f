using System.ComponentModel.DataAnnotations;

namespace CdsNatremia.Service.Course;

/// <summary>
/// The sodium-course view, a SMART App Launch 2.0 EHR-launched app (docs/sodium-course-view.md). Bound from
/// "Natremia:Course". Client secrets come from the environment or a secret store, never from a committed file.
/// </summary>
public sealed class CourseOptions
{
    /// <summary>The configuration section.</summary>
    public const string Section = "Natremia:Course";

    /// <summary>Whether the view's endpoints are served. Default true.</summary>
    public bool Enabled { get; set; } = true;

    /// <summary>
    /// The absolute launch URL the EHR opens (e.g. "https://cds.example.org/course/launch"), put on cards as a CDS Hooks
    /// link of type "smart". Empty (the default): cards carry no link, because the service cannot know the address the
    /// EHR reaches it by.
    /// </summary>
    public string? LaunchUrl { get; set; }

    /// <summary>
    /// The EHRs allowed to launch the view: a launch whose <c>iss</c> is not one of these issuers is refused before any
    /// request is made (an unknown <c>iss</c> would otherwise make the service fetch from an address of the caller's choice).
    /// </summary>
    public IList<SmartEhrOptions> Ehrs { get; } = [];

    /// <summary>How long a started launch may take to come back from the EHR's authorization server. Default 10 minutes.</summary>
    [Range(typeof(TimeSpan), "00:00:30", "01:00:00")]
    public TimeSpan LaunchLifetime { get; set; } = TimeSpan.FromMinutes(10);

    /// <summary>
    /// How long a completed launch shows the view before the user must launch again from the EHR. Default 30 minutes,
    /// and never longer than the access token's own lifetime.
    /// </summary>
    [Range(typeof(TimeSpan), "00:01:00", "12:00:00")]
    public TimeSpan SessionLifetime { get; set; } = TimeSpan.FromMinutes(30);

    /// <summary>
    /// Time for all the view's FHIR reads of one page (all queries, pages, retries). Default 3 s: a person opening a
    /// picture can wait longer than a hook's 500 ms, and the per-attempt time-out, retries, circuit breaker, paging caps
    /// and allowlist of Natremia:Fetching still apply.
    /// </summary>
    [Range(typeof(TimeSpan), "00:00:00.100", "00:01:00")]
    public TimeSpan FetchBudget { get; set; } = TimeSpan.FromSeconds(3);

    /// <summary>
    /// Development only: serve a loopback test EHR (SMART discovery, an authorization server that approves at once, a
    /// token endpoint and a read-only FHIR server of one invented scenario) at /dev-ehr, and a start page at
    /// /course/dev. Default true; ignored outside Development.
    /// </summary>
    public bool DevelopmentEhr { get; set; } = true;
}

/// <summary>One EHR allowed to launch the view, with this app's registration at that EHR.</summary>
public sealed class SmartEhrOptions
{
    /// <summary>The EHR's FHIR base URL, exactly as it sends it in <c>iss</c> (compared without a trailing slash).</summary>
    [Required]
    public string Issuer { get; set; } = string.Empty;

    /// <summary>The client id this app was registered with at the EHR.</summary>
    [Required]
    public string ClientId { get; set; } = string.Empty;

    /// <summary>
    /// The client secret (confidential symmetric client: HTTP Basic at the token endpoint). Set it from the environment
    /// (Natremia__Course__Ehrs__0__ClientSecret) or a secret store; never commit it.
    /// </summary>
    public string? ClientSecret { get; set; }

    /// <summary>A name for error pages and logs, e.g. "Ward EHR".</summary>
    public string? Name { get; set; }
}
