using System.Text.Json;

namespace CdsNatremia.Service.Hooks;

/// <summary>A validated CDS Hooks request. JSON elements stay valid while the owning document lives (the request).</summary>
public sealed record HookRequest
{
    /// <summary>The hook name.</summary>
    public required string Hook { get; init; }

    /// <summary>The hook instance UUID.</summary>
    public required Guid HookInstance { get; init; }

    /// <summary>The patient id from the context.</summary>
    public required string PatientId { get; init; }

    /// <summary>The context object.</summary>
    public required JsonElement Context { get; init; }

    /// <summary>Prefetch values by key, as sent (null values kept: they mean "no data").</summary>
    public required IReadOnlyDictionary<string, JsonElement> Prefetch { get; init; }

    /// <summary>The EHR's FHIR base URL, when sent.</summary>
    public Uri? FhirServer { get; init; }

    /// <summary>The access token for <see cref="FhirServer"/>, when sent. Never logged.</summary>
    public FhirAuthorization? Authorization { get; init; }
}

/// <summary>The fhirAuthorization object. The token is a secret: it must never reach a log or an error message.</summary>
/// <param name="AccessToken">The OAuth 2.0 access token.</param>
/// <param name="TokenType">Always "Bearer".</param>
/// <param name="ExpiresIn">Lifetime in seconds.</param>
/// <param name="Scope">Granted scopes.</param>
/// <param name="Subject">The OAuth client id.</param>
public sealed record FhirAuthorization(string AccessToken, string TokenType, long ExpiresIn, string Scope, string Subject)
{
    /// <inheritdoc />
    public override string ToString() => $"FhirAuthorization {{ TokenType = {TokenType}, Scope = {Scope}, Subject = {Subject}, AccessToken = (hidden) }}";
}
