using System.Net.Http.Headers;
using System.Security.Cryptography;
using Microsoft.IdentityModel.JsonWebTokens;
using Microsoft.IdentityModel.Tokens;

namespace CdsNatremia.Cli.Hosting;

/// <summary>
/// Signs every request as a CDS client must (CDS Hooks 2.0, "Trusting CDS Clients"): a JWT with header alg ES384 or
/// RS384 (from the key), kid and typ "JWT", and claims iss, sub, aud (the exact URL called), iat, exp (five minutes)
/// and a fresh jti, sent as <c>Authorization: Bearer</c>.
/// </summary>
internal sealed class ClientAssertionHandler : DelegatingHandler
{
    private readonly SigningCredentials _credentials;
    private readonly string _issuer;
    private readonly TimeProvider _time;
    private readonly JsonWebTokenHandler _tokens = new();

    public ClientAssertionHandler(SigningCredentials credentials, string issuer, TimeProvider time)
    {
        _credentials = credentials;
        _issuer = issuer;
        _time = time;
    }

    /// <summary>Reads a PEM private key (EC P-384 → ES384, RSA → RS384) with its key id.</summary>
    public static SigningCredentials LoadKey(string pemFile, string kid)
    {
        var pem = File.ReadAllText(pemFile);
        if (pem.Contains("EC PRIVATE KEY", StringComparison.Ordinal) || TryEc(pem) is not null)
        {
            var ec = TryEc(pem) ?? throw new ToolException(ExitCodes.Usage, $"{pemFile}: not a readable EC private key.");
            return new SigningCredentials(new ECDsaSecurityKey(ec) { KeyId = kid }, SecurityAlgorithms.EcdsaSha384);
        }

        var rsa = RSA.Create();
        try
        {
            rsa.ImportFromPem(pem);
        }
        catch (ArgumentException ex)
        {
            rsa.Dispose();
            throw new ToolException(ExitCodes.Usage, $"{pemFile}: not a PEM EC or RSA private key ({ex.Message}).");
        }

        return new SigningCredentials(new RsaSecurityKey(rsa) { KeyId = kid }, SecurityAlgorithms.RsaSha384);
    }

    /// <summary>The token for one call to <paramref name="audience"/>.</summary>
    public string CreateToken(Uri audience)
    {
        ArgumentNullException.ThrowIfNull(audience);
        var now = _time.GetUtcNow().UtcDateTime;
        return _tokens.CreateToken(new SecurityTokenDescriptor
        {
            Issuer = _issuer,
            Audience = audience.GetLeftPart(UriPartial.Path),
            IssuedAt = now,
            NotBefore = now,
            Expires = now.AddMinutes(5),
            Claims = new Dictionary<string, object> { ["jti"] = Guid.NewGuid().ToString(), ["sub"] = _issuer },
            SigningCredentials = _credentials,
            TokenType = "JWT",
        });
    }

    protected override Task<HttpResponseMessage> SendAsync(HttpRequestMessage request, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(request);
        if (request.RequestUri is { } uri)
        {
            request.Headers.Authorization = new AuthenticationHeaderValue("Bearer", CreateToken(uri));
        }

        return base.SendAsync(request, cancellationToken);
    }

    private static ECDsa? TryEc(string pem)
    {
        var ec = ECDsa.Create();
        try
        {
            ec.ImportFromPem(pem);
            return ec;
        }
        catch (Exception ex) when (ex is ArgumentException or CryptographicException)
        {
            ec.Dispose();
            return null;
        }
    }
}
