using System.ComponentModel.DataAnnotations;

namespace CdsNatremia.Service.Fetching;

/// <summary>
/// How the service fetches prefetch data the EHR did not send, from the EHR's FHIR server. Bound from
/// "Natremia:Fetching". docs/fetching.md gives the reason for every default.
/// </summary>
public sealed class FhirFetchOptions
{
    /// <summary>The configuration section.</summary>
    public const string Section = "Natremia:Fetching";

    /// <summary>
    /// Whether the service fetches at all. Default true. When false every missing key is reported as not fetched
    /// (HTTP 412 if it is required), as before fetching existed.
    /// </summary>
    public bool Enabled { get; set; } = true;

    /// <summary>
    /// FHIR base URLs the service may contact with the EHR's access token, e.g. "https://ehr.example.org/fhir".
    /// Compared after trimming a trailing slash; scheme and host ignore case, the path does not. Default empty: no
    /// server is contacted, except that in the Development environment an empty list allows loopback servers
    /// (127.0.0.0/8, ::1, localhost) so a developer can run against a local test server.
    /// </summary>
    public IList<string> AllowedServers { get; } = [];

    /// <summary>
    /// Time for the whole fetch of one hook request (all keys, pages, retries and back-off). Default 400 ms: the
    /// CDS Hooks standard asks services to answer in about 500 ms, and 100 ms is kept for reading, assessing and
    /// writing the cards.
    /// </summary>
    [Range(typeof(TimeSpan), "00:00:00.050", "00:01:00")]
    public TimeSpan Budget { get; set; } = TimeSpan.FromMilliseconds(400);

    /// <summary>
    /// Time for one HTTP attempt (request and whole body). Default 250 ms: a FHIR search by patient and code
    /// normally answers well inside that, and it leaves room in the 400 ms budget for one retry after a fast failure.
    /// Polly requires more than 10 ms.
    /// </summary>
    [Range(typeof(TimeSpan), "00:00:00.011", "00:01:00")]
    public TimeSpan AttemptTimeout { get; set; } = TimeSpan.FromMilliseconds(250);

    /// <summary>
    /// Retries after the first attempt, on network errors, attempt time-outs, 408, 429 and 5xx. Default 2; the
    /// budget usually stops retrying first. 0 turns retrying off. 401 and 403 are never retried.
    /// </summary>
    [Range(0, 10)]
    public int MaxRetries { get; set; } = 2;

    /// <summary>
    /// Median delay before the first retry; later retries double it, with jitter (Polly's decorrelated
    /// exponential back-off). Default 40 ms, small enough for two retries inside the budget.
    /// </summary>
    [Range(typeof(TimeSpan), "00:00:00", "00:00:10")]
    public TimeSpan RetryBaseDelay { get; set; } = TimeSpan.FromMilliseconds(40);

    /// <summary>
    /// Share of failed attempts to one FHIR server, within <see cref="BreakerSamplingDuration"/>, that opens its
    /// circuit. Default 0.5 (Polly's default is 0.1, made for high-volume calls; an EHR's FHIR server sees a handful
    /// of calls per chart opening, so only a clear majority of failures should stop calls).
    /// </summary>
    [Range(0.01, 1.0)]
    public double BreakerFailureRatio { get; set; } = 0.5;

    /// <summary>
    /// Attempts needed within the sampling window before the ratio counts. Default 10 (Polly's default is 100, too
    /// many for this volume): about one and a half chart openings with every key failing. Polly requires at least 2.
    /// </summary>
    [Range(2, 1000)]
    public int BreakerMinimumThroughput { get; set; } = 10;

    /// <summary>Window over which failures are counted. Default 30 s (Polly's default). Polly requires more than 0.5 s.</summary>
    [Range(typeof(TimeSpan), "00:00:00.501", "00:10:00")]
    public TimeSpan BreakerSamplingDuration { get; set; } = TimeSpan.FromSeconds(30);

    /// <summary>
    /// How long an open circuit stops calls before one trial call (half-open). Default 15 s: long enough to spare a
    /// struggling server, short enough that a recovered server is used again within a few chart openings (Polly's
    /// default is 5 s). Polly requires more than 0.5 s.
    /// </summary>
    [Range(typeof(TimeSpan), "00:00:00.501", "00:10:00")]
    public TimeSpan BreakDuration { get; set; } = TimeSpan.FromSeconds(15);

    /// <summary>
    /// Pages read per key by following Bundle "next" links. Default 5: the templates ask for 100–200 results per page
    /// sorted newest first, so 5 pages hold far more history than the work-up reads.
    /// </summary>
    [Range(1, 100)]
    public int MaxPages { get; set; } = 5;

    /// <summary>Resources kept per key across pages. Default 1000; the rest is left with a note.</summary>
    [Range(1, 100_000)]
    public int MaxEntries { get; set; } = 1000;

    /// <summary>
    /// Largest response body read, in bytes. Default 4 MiB: a page of 200 Observations is about 400 KB; anything far
    /// larger is not an answer to our query and is refused rather than read into memory.
    /// </summary>
    [Range(1024, 256L * 1024 * 1024)]
    public long MaxResponseBytes { get; set; } = 4L * 1024 * 1024;
}
