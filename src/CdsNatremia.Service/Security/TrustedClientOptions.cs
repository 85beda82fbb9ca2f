namespace CdsNatremia.Service.Security;

/// <summary>One CDS client (an EHR) allowed to call the service: its issuer and where its public keys come from.</summary>
public sealed class TrustedClientOptions
{
    /// <summary>The <c>iss</c> the client puts in its tokens, compared exactly (e.g. "https://ehr.hospital.example").</summary>
    public string Issuer { get; set; } = string.Empty;

    /// <summary>
    /// The client's JWK Set (public keys only), given inline: either JSON text or a nested configuration object
    /// <c>{"keys":[...]}</c>. Used for tokens without a <c>jku</c> header.
    /// </summary>
    public string? Jwks { get; set; }

    /// <summary>
    /// JWK Set URLs this client's keys may be fetched from. A token's <c>jku</c> must be one of them exactly, or the
    /// token is refused without any request being made. A token without <c>jku</c> uses <see cref="Jwks"/>, or the first
    /// of these URLs when no inline set is given. Each must be https (http only on a loopback host, for tests).
    /// </summary>
    public IList<string> JwksUrls { get; } = [];
}
