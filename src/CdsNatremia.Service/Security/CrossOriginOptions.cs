namespace CdsNatremia.Service.Security;

/// <summary>
/// CORS for browser-based CDS clients, bound from "Natremia:Cors". No origin is allowed by default: only origins listed
/// here get CORS headers, for GET and POST with the Authorization and Content-Type headers.
/// </summary>
public sealed class CrossOriginOptions
{
    /// <summary>The configuration section.</summary>
    public const string Section = "Natremia:Cors";

    /// <summary>Origins allowed to call from a browser, e.g. "https://ehr.hospital.example". "*" is refused.</summary>
    public IList<string> AllowedOrigins { get; } = [];

    /// <summary>How long a browser may cache a preflight answer, in seconds. Default 600.</summary>
    public int PreflightMaxAgeSeconds { get; set; } = 600;
}
