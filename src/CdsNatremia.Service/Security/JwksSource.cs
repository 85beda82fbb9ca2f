using System.Collections.Concurrent;
using Microsoft.Extensions.Options;
using Microsoft.IdentityModel.Tokens;

namespace CdsNatremia.Service.Security;

/// <summary>
/// Fetches trusted clients' JWK Sets from their allowlisted URLs and caches them. Only URLs already checked against a
/// client's allowlist reach this type, so the cache holds at most one entry per configured URL. A set is fetched again
/// after <see cref="ClientAuthenticationOptions.JwksCacheSeconds"/>, or early when a token names a kid the set lacks,
/// but never more often than once per <see cref="ClientAuthenticationOptions.JwksMinRefreshSeconds"/> per URL. When a
/// fetch fails the keys fetched before stay in use (the client's key server being down should not lock out keys it
/// published); with none, tokens cannot be verified and are refused.
/// </summary>
internal sealed partial class JwksSource(
    IHttpClientFactory httpClients,
    IOptions<ClientAuthenticationOptions> options,
    TimeProvider time,
    ILogger<JwksSource> logger)
{
    /// <summary>The named HttpClient (timeout, size limit, no redirects) set up in <see cref="SecurityRegistration"/>.</summary>
    public const string HttpClientName = "natremia-jwks";

    private readonly ConcurrentDictionary<string, JwksCacheEntry> _entries = new(StringComparer.Ordinal);

    /// <summary>The keys published at <paramref name="url"/>, or null when none could ever be fetched.</summary>
    public async Task<IReadOnlyList<JsonWebKey>?> GetKeysAsync(string url, bool unknownKid, CancellationToken cancellationToken)
    {
        var entry = _entries.GetOrAdd(url, _ => new JwksCacheEntry());
        var settings = options.Value;
        await entry.Gate.WaitAsync(cancellationToken).ConfigureAwait(false);
        try
        {
            var now = time.GetUtcNow();
            var fresh = entry.Keys is not null && now - entry.FetchedAt < TimeSpan.FromSeconds(settings.JwksCacheSeconds);
            if (fresh && !unknownKid)
            {
                return entry.Keys;
            }

            if (entry.LastAttempt is { } last && now - last < TimeSpan.FromSeconds(settings.JwksMinRefreshSeconds))
            {
                return entry.Keys;
            }

            entry.LastAttempt = now;
            var fetched = await FetchAsync(url, cancellationToken).ConfigureAwait(false);
            if (fetched is not null)
            {
                entry.Keys = fetched;
                entry.FetchedAt = now;
            }

            return entry.Keys;
        }
        finally
        {
            entry.Gate.Release();
        }
    }

    private async Task<IReadOnlyList<JsonWebKey>?> FetchAsync(string url, CancellationToken cancellationToken)
    {
        var client = httpClients.CreateClient(HttpClientName);
        try
        {
            using var response = await client.GetAsync(new Uri(url), HttpCompletionOption.ResponseContentRead, cancellationToken).ConfigureAwait(false);
            if (!response.IsSuccessStatusCode)
            {
                LogFetchFailed(logger, url, $"HTTP {(int)response.StatusCode}");
                return null;
            }

            var json = await response.Content.ReadAsStringAsync(cancellationToken).ConfigureAwait(false);
            var set = new JsonWebKeySet(json);
            var keys = set.Keys
                .Where(k => !string.IsNullOrEmpty(k.Kid) && k.Kty is JsonWebAlgorithmsKeyTypes.EllipticCurve or JsonWebAlgorithmsKeyTypes.RSA)
                .ToList();
            LogFetched(logger, url, keys.Count);
            return keys;
        }
        catch (Exception ex) when (ex is HttpRequestException or TaskCanceledException or ArgumentException or InvalidOperationException)
        {
            // TaskCanceledException without the caller's cancellation is the HttpClient timeout.
            cancellationToken.ThrowIfCancellationRequested();
            LogFetchFailed(logger, url, ex.GetType().Name);
            return null;
        }
    }

    [LoggerMessage(Level = LogLevel.Information, Message = "Fetched the JWK Set at {JwksUrl}: {KeyCount} usable keys")]
    private static partial void LogFetched(ILogger logger, string jwksUrl, int keyCount);

    [LoggerMessage(Level = LogLevel.Warning, Message = "Could not fetch the JWK Set at {JwksUrl} ({Failure}); keys fetched before, if any, stay in use")]
    private static partial void LogFetchFailed(ILogger logger, string jwksUrl, string failure);
}
