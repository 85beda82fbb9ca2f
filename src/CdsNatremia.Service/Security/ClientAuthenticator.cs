using System.Text.Json;
using Microsoft.Extensions.Options;
using Microsoft.IdentityModel.JsonWebTokens;
using Microsoft.IdentityModel.Tokens;

namespace CdsNatremia.Service.Security;

/// <summary>
/// Checks a CDS client's bearer token as CDS Hooks 2.0 asks: an asymmetric alg from the allowlist, kid and typ "JWT" in
/// the header; iss a trusted client; aud the exact URL called; exp and iat within the clock skew; a jti never seen
/// before. Header and issuer are checked before any key is looked up, the jku allowlist before any request is made,
/// and the replay cache is touched only after the signature holds, so nobody can fill it with forged ids. Signature,
/// issuer, audience and lifetime checks are Microsoft.IdentityModel's; no cryptography is written here.
/// </summary>
internal sealed class ClientAuthenticator
{
    private const int MaxJtiLength = 256;

    private readonly ClientAuthenticationOptions _options;
    private readonly JwksSource _jwks;
    private readonly ITokenReplayStore _replay;
    private readonly TimeProvider _time;
    private readonly JsonWebTokenHandler _handler = new();
    private readonly Dictionary<string, (TrustedClientOptions Client, IReadOnlyList<JsonWebKey>? InlineKeys)> _clients;
    private readonly IReadOnlyList<string> _algorithms;

    public ClientAuthenticator(IOptions<ClientAuthenticationOptions> options, JwksSource jwks, TimeProvider time, ITokenReplayStore replay)
    {
        _options = options.Value;
        _jwks = jwks;
        _time = time;
        _replay = replay;
        _algorithms = _options.EffectiveAlgorithms;
        _clients = _options.TrustedClients.ToDictionary(
            c => c.Issuer,
            c => (c, string.IsNullOrWhiteSpace(c.Jwks) ? null : (IReadOnlyList<JsonWebKey>?)new JsonWebKeySet(c.Jwks).Keys.ToList()),
            StringComparer.Ordinal);
    }

    /// <summary>True when at least one trusted client is configured, so every call must be authenticated.</summary>
    public bool Enforced => _clients.Count > 0;

    public async Task<ClientAuthenticationResult> AuthenticateAsync(HttpRequest request, CancellationToken cancellationToken)
    {
        var headers = request.Headers.Authorization;
        if (headers.Count == 0)
        {
            return new ClientAuthenticationResult { MissingToken = true, LogReason = "no Authorization header" };
        }

        var header = headers.Count == 1 ? headers[0] ?? string.Empty : string.Empty;
        if (!header.StartsWith("Bearer ", StringComparison.OrdinalIgnoreCase))
        {
            return ClientAuthenticationResult.Refused("Authorization is not a single Bearer credential");
        }

        var token = header["Bearer ".Length..].Trim();
        if (token.Length == 0 || token.Length > _options.MaxTokenLength)
        {
            return ClientAuthenticationResult.Refused($"bearer token empty or longer than {_options.MaxTokenLength} characters");
        }

        JsonWebToken jwt;
        try
        {
            jwt = new JsonWebToken(token);
        }
        catch (Exception ex) when (ex is ArgumentException or SecurityTokenException or JsonException or FormatException)
        {
            return ClientAuthenticationResult.Refused($"bearer token is not a well-formed JWS ({ex.GetType().Name})");
        }

        if (jwt.IsEncrypted)
        {
            return ClientAuthenticationResult.Refused("encrypted tokens (JWE) are not accepted");
        }

        if (!_algorithms.Contains(jwt.Alg, StringComparer.Ordinal))
        {
            return ClientAuthenticationResult.Refused($"header alg '{LogText.Clip(jwt.Alg, 16)}' is not on the allowlist ({string.Join(", ", _algorithms)})");
        }

        if (string.IsNullOrEmpty(jwt.Kid))
        {
            return ClientAuthenticationResult.Refused("header kid is missing");
        }

        if (!string.Equals(jwt.Typ, "JWT", StringComparison.OrdinalIgnoreCase))
        {
            return ClientAuthenticationResult.Refused($"header typ is '{LogText.Clip(jwt.Typ, 16)}', not JWT");
        }

        if (CriticalHeaderProblem(jwt) is { } critical)
        {
            return ClientAuthenticationResult.Refused(critical);
        }

        var issuer = SafeClaim(jwt, "iss");
        if (issuer is null || !_clients.TryGetValue(issuer, out var trusted))
        {
            return ClientAuthenticationResult.Refused($"iss '{LogText.Clip(issuer)}' is not a trusted client");
        }

        var key = await FindKeyAsync(jwt, trusted.Client, trusted.InlineKeys, cancellationToken).ConfigureAwait(false);
        if (key.Key is null)
        {
            return ClientAuthenticationResult.Refused($"iss '{LogText.Clip(issuer)}': {key.Problem}");
        }

        var skew = TimeSpan.FromSeconds(_options.ClockSkewSeconds);
        var audience = _options.PublicBaseUrl!.TrimEnd('/') + request.Path.Value;
        var parameters = new TokenValidationParameters
        {
            ValidIssuer = issuer,
            ValidAudience = audience,
            IgnoreTrailingSlashWhenValidatingAudience = false,
            IssuerSigningKey = key.Key,
            TryAllIssuerSigningKeys = false,
            ValidAlgorithms = _algorithms,
            RequireSignedTokens = true,
            RequireAudience = true,

            // Lifetime is checked below against the injected clock (the library reads the wall clock).
            ValidateLifetime = false,
            ValidateIssuerSigningKey = false,
            LogValidationExceptions = false,
        };
        var validation = await _handler.ValidateTokenAsync(jwt, parameters).ConfigureAwait(false);
        if (!validation.IsValid)
        {
            return ClientAuthenticationResult.Refused($"iss '{LogText.Clip(issuer)}' kid '{LogText.Clip(jwt.Kid, 64)}': {Describe(validation.Exception, audience)}");
        }

        // The library accepts an aud array that merely contains the URL; CDS Hooks tokens are for this service alone.
        if (jwt.Audiences.Count() != 1)
        {
            return ClientAuthenticationResult.Refused($"iss '{LogText.Clip(issuer)}': aud is an array of {jwt.Audiences.Count()} values; only the URL called ({audience}) is accepted, alone");
        }

        var now = _time.GetUtcNow();
        if (!jwt.TryGetPayloadValue<long>("exp", out var expSeconds) || !jwt.TryGetPayloadValue<long>("iat", out var iatSeconds))
        {
            return ClientAuthenticationResult.Refused($"iss '{LogText.Clip(issuer)}': exp or iat is missing");
        }

        var issuedAt = DateTimeOffset.FromUnixTimeSeconds(Math.Clamp(iatSeconds, 0, 253_402_300_799));
        var expires = DateTimeOffset.FromUnixTimeSeconds(Math.Clamp(expSeconds, 0, 253_402_300_799));
        if (now > expires + skew)
        {
            return ClientAuthenticationResult.Refused($"iss '{LogText.Clip(issuer)}': token expired");
        }

        if (jwt.TryGetPayloadValue<long>("nbf", out var nbfSeconds) && now + skew < DateTimeOffset.FromUnixTimeSeconds(Math.Clamp(nbfSeconds, 0, 253_402_300_799)))
        {
            return ClientAuthenticationResult.Refused($"iss '{LogText.Clip(issuer)}': token not yet valid (nbf in the future)");
        }

        if (issuedAt > now + skew)
        {
            return ClientAuthenticationResult.Refused($"iss '{LogText.Clip(issuer)}': iat is in the future");
        }

        if (expires - issuedAt > TimeSpan.FromSeconds(_options.MaxTokenLifetimeSeconds))
        {
            return ClientAuthenticationResult.Refused($"iss '{LogText.Clip(issuer)}': lifetime exp − iat exceeds {_options.MaxTokenLifetimeSeconds} s");
        }

        var jti = SafeClaim(jwt, "jti");
        if (string.IsNullOrEmpty(jti) || jti.Length > MaxJtiLength)
        {
            return ClientAuthenticationResult.Refused($"iss '{LogText.Clip(issuer)}': jti is missing or longer than {MaxJtiLength} characters");
        }

        ReplayCheck replay;
        try
        {
            replay = await _replay.TryUseAsync(issuer, jti, expires + skew, now, cancellationToken).ConfigureAwait(false);
        }
        catch (ReplayStoreUnavailableException ex)
        {
            return new ClientAuthenticationResult { Status = StatusCodes.Status503ServiceUnavailable, LogReason = $"iss '{LogText.Clip(issuer)}': {ex.Message}" };
        }

        switch (replay)
        {
            case ReplayCheck.Replayed:
                return ClientAuthenticationResult.Refused($"iss '{LogText.Clip(issuer)}': jti '{LogText.Clip(jti, 64)}' was already used (replay)");
            case ReplayCheck.Full:
                return new ClientAuthenticationResult
                {
                    Status = StatusCodes.Status503ServiceUnavailable,
                    LogReason = $"iss '{LogText.Clip(issuer)}': this client's replay cache is full ({_options.ReplayCacheCapacity} unexpired token ids); "
                        + "other clients are not affected; lower its request rate (Natremia:RateLimiting) or raise ReplayCacheCapacity",
                };
            default:
                return ClientAuthenticationResult.Accepted(issuer);
        }
    }

    private async Task<(JsonWebKey? Key, string Problem)> FindKeyAsync(
        JsonWebToken jwt, TrustedClientOptions client, IReadOnlyList<JsonWebKey>? inlineKeys, CancellationToken cancellationToken)
    {
        string? url;
        if (jwt.TryGetHeaderValue<string>("jku", out var jku))
        {
            if (!client.JwksUrls.Contains(jku, StringComparer.Ordinal))
            {
                return (null, $"jku '{LogText.Clip(jku)}' is not on this client's allowlist; nothing was fetched");
            }

            url = jku;
        }
        else
        {
            if (inlineKeys is not null)
            {
                return Pick(inlineKeys, jwt) is { } inline ? (inline, string.Empty) : (null, $"kid '{LogText.Clip(jwt.Kid, 64)}' is not among the configured keys (or does not fit alg {jwt.Alg})");
            }

            url = client.JwksUrls.FirstOrDefault();
            if (url is null)
            {
                return (null, "no key source");
            }
        }

        var keys = await _jwks.GetKeysAsync(url, unknownKid: false, cancellationToken).ConfigureAwait(false);
        if (keys is not null && Pick(keys, jwt) is { } cached)
        {
            return (cached, string.Empty);
        }

        keys = await _jwks.GetKeysAsync(url, unknownKid: true, cancellationToken).ConfigureAwait(false);
        if (keys is null)
        {
            return (null, $"the JWK Set at {url} could not be fetched");
        }

        return Pick(keys, jwt) is { } refreshed ? (refreshed, string.Empty) : (null, $"kid '{LogText.Clip(jwt.Kid, 64)}' is not in the JWK Set at {url} (or does not fit alg {jwt.Alg})");
    }

    /// <summary>The key with the token's kid, if its type fits the algorithm and it is meant for signatures.</summary>
    private static JsonWebKey? Pick(IReadOnlyList<JsonWebKey> keys, JsonWebToken jwt)
    {
        var kty = jwt.Alg.StartsWith("ES", StringComparison.Ordinal) ? JsonWebAlgorithmsKeyTypes.EllipticCurve : JsonWebAlgorithmsKeyTypes.RSA;
        return keys.FirstOrDefault(k => string.Equals(k.Kid, jwt.Kid, StringComparison.Ordinal)
            && string.Equals(k.Kty, kty, StringComparison.Ordinal)
            && (string.IsNullOrEmpty(k.Use) || k.Use == JsonWebKeyUseNames.Sig));
    }

    /// <summary>
    /// RFC 7515 §4.1.11: a "crit" header lists extensions the recipient must understand or refuse the token. This
    /// service understands no JWS extension, so any "crit" member (also an empty or malformed one) is refused.
    /// </summary>
    private static string? CriticalHeaderProblem(JsonWebToken jwt)
    {
        using var header = JsonDocument.Parse(Base64UrlEncoder.Decode(jwt.EncodedHeader));
        if (!header.RootElement.TryGetProperty("crit", out var crit))
        {
            return null;
        }

        var names = crit.ValueKind == JsonValueKind.Array
            ? string.Join(", ", crit.EnumerateArray().Take(5).Select(e => LogText.Clip(e.ValueKind == JsonValueKind.String ? e.GetString() : e.ToString(), 32)))
            : "not an array";
        return $"header crit ({names}) names extensions this service does not understand (RFC 7515 §4.1.11)";
    }

    private static string? SafeClaim(JsonWebToken jwt, string name)
        => jwt.TryGetPayloadValue<string>(name, out var value) ? value : null;

    private static string Describe(Exception? exception, string audience) => exception switch
    {
        SecurityTokenInvalidAudienceException => $"aud is not the URL called ({audience})",
        SecurityTokenInvalidIssuerException => "iss does not match",
        SecurityTokenInvalidSignatureException or SecurityTokenSignatureKeyNotFoundException => "signature does not verify",
        SecurityTokenInvalidAlgorithmException => "algorithm not accepted",
        SecurityTokenInvalidTypeException => "typ not accepted",
        null => "token not valid",
        _ => $"token not valid ({exception.GetType().Name})",
    };
}
