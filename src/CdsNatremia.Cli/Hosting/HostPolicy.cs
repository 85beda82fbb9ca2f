using System.Net;

namespace CdsNatremia.Cli.Hosting;

/// <summary>
/// Which hosts the tool may send traffic to: loopback (127.0.0.0/8, ::1, "localhost") always; any other host only
/// when the user names it with --allow-host. A load test against the wrong host is an attack, not a test.
/// </summary>
internal static class HostPolicy
{
    /// <summary>True when the URL's host is loopback or one of the allowed host names (case-insensitive).</summary>
    public static bool IsAllowed(Uri url, IEnumerable<string> allowedHosts)
    {
        ArgumentNullException.ThrowIfNull(url);
        ArgumentNullException.ThrowIfNull(allowedHosts);
        if (url.IsLoopback || string.Equals(url.Host, "localhost", StringComparison.OrdinalIgnoreCase)
            || (IPAddress.TryParse(url.Host.Trim('[', ']'), out var ip) && IPAddress.IsLoopback(ip)))
        {
            return true;
        }

        return allowedHosts.Any(h => string.Equals(h.Trim(), url.Host, StringComparison.OrdinalIgnoreCase));
    }

    /// <summary>Throws a <see cref="ToolException"/> (exit 3) when the URL is not allowed.</summary>
    public static void Require(Uri url, IEnumerable<string> allowedHosts)
    {
        if (!IsAllowed(url, allowedHosts))
        {
            throw new ToolException(ExitCodes.Unreachable,
                $"Refusing to send requests to {url.Host}: only loopback hosts are targeted unless --allow-host {url.Host} names it.");
        }
    }
}
