using System.Globalization;
using Microsoft.Extensions.Options;

namespace CdsNatremia.Service.Fetching;

/// <summary>
/// Decides whether the request's fhirServer may be sent the access token. The token is the EHR's secret for its own
/// server: a request naming any other server (a typo, or an attempt to harvest tokens) gets no request and no token.
/// Outside Development only https base URLs on the configured list qualify; in Development http is allowed too, and
/// an empty list allows loopback servers only.
/// </summary>
internal sealed class FhirServerAllowlist
{
    private readonly HashSet<string> _allowed;
    private readonly bool _development;

    public FhirServerAllowlist(IOptions<FhirFetchOptions> options, IHostEnvironment environment)
        : this(options.Value.AllowedServers, environment.IsDevelopment())
    {
    }

    internal FhirServerAllowlist(IEnumerable<string> allowed, bool development)
    {
        _development = development;
        _allowed = new HashSet<string>(StringComparer.Ordinal);
        foreach (var entry in allowed)
        {
            if (Uri.TryCreate(entry, UriKind.Absolute, out var uri))
            {
                _allowed.Add(BaseOf(uri));
            }
        }
    }

    /// <summary>
    /// The base URL as compared and used as the circuit-breaker key: lower-case scheme and host, explicit port, the
    /// path without its trailing slash; no query, fragment or user information.
    /// </summary>
    public static string BaseOf(Uri server)
    {
        ArgumentNullException.ThrowIfNull(server);
        var path = server.AbsolutePath.TrimEnd('/');
        return string.Create(CultureInfo.InvariantCulture, $"{server.Scheme.ToLowerInvariant()}://{server.IdnHost.ToLowerInvariant()}:{server.Port}{path}");
    }

    /// <summary>The origin only (scheme, host, port): what logs name, never the path or query.</summary>
    public static string OriginOf(Uri server)
    {
        ArgumentNullException.ThrowIfNull(server);
        return string.Create(CultureInfo.InvariantCulture, $"{server.Scheme.ToLowerInvariant()}://{server.IdnHost.ToLowerInvariant()}:{server.Port}");
    }

    /// <summary>Whether two URLs share scheme, host and port (a next link must stay on the server that was allowed).</summary>
    public static bool SameOrigin(Uri a, Uri b)
        => string.Equals(OriginOf(a), OriginOf(b), StringComparison.Ordinal);

    /// <summary>Null when the server may be contacted; otherwise why not, in words safe for a 412 body (no token).</summary>
    public string? Refusal(Uri server)
    {
        ArgumentNullException.ThrowIfNull(server);
        if (!string.IsNullOrEmpty(server.UserInfo) || !string.IsNullOrEmpty(server.Query) || !string.IsNullOrEmpty(server.Fragment))
        {
            return "not fetched: the fhirServer URL carries user information, a query or a fragment; a FHIR base URL has none";
        }

        if (server.Scheme != Uri.UriSchemeHttps && !(_development && server.Scheme == Uri.UriSchemeHttp))
        {
            return "not fetched: the fhirServer URL is not https, and the access token is only sent over TLS";
        }

        if (_allowed.Count == 0)
        {
            return _development && server.IsLoopback
                ? null
                : "not fetched: no FHIR server is on this service's allowlist (Natremia:Fetching:AllowedServers)";
        }

        return _allowed.Contains(BaseOf(server))
            ? null
            : $"not fetched: the FHIR server {OriginOf(server)} is not on this service's allowlist (Natremia:Fetching:AllowedServers)";
    }
}
