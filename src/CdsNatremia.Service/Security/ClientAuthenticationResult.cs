namespace CdsNatremia.Service.Security;

/// <summary>
/// The outcome of checking one request's bearer token. <see cref="LogReason"/> says exactly why a token was refused and
/// goes only to the log; the caller is told no more than <see cref="Status"/> and a generic sentence.
/// </summary>
internal sealed record ClientAuthenticationResult
{
    /// <summary>The trusted issuer, when the token was accepted.</summary>
    public string? Issuer { get; init; }

    /// <summary>HTTP status for a refusal: 401, or 503 when the replay cache is full.</summary>
    public int Status { get; init; } = StatusCodes.Status401Unauthorized;

    /// <summary>True when no Authorization header was sent (RFC 6750: the challenge then carries no error code).</summary>
    public bool MissingToken { get; init; }

    /// <summary>Why the token was refused, for the log (never the token itself).</summary>
    public string LogReason { get; init; } = string.Empty;

    /// <summary>True when the token was accepted.</summary>
    public bool Succeeded => Issuer is not null;

    public static ClientAuthenticationResult Accepted(string issuer) => new() { Issuer = issuer };

    public static ClientAuthenticationResult Refused(string logReason) => new() { LogReason = logReason };
}
