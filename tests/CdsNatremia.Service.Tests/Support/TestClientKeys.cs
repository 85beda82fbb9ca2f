using System.Security.Cryptography;
using System.Text;
using System.Text.Json.Nodes;
using Microsoft.IdentityModel.JsonWebTokens;
using Microsoft.IdentityModel.Tokens;

namespace CdsNatremia.Service.Tests.Support;

/// <summary>
/// A CDS client (EHR) for tests: an ES384 and an RS384 key pair made fresh for each instance, its public JWK Set, and
/// tokens signed with the library (real signatures; only the deliberately broken cases are assembled by hand).
/// </summary>
public sealed class TestClientKeys : IDisposable
{
    public const string Issuer = "https://ehr.test.example";
    public const string PublicBaseUrl = "http://localhost";
    public const string EcKid = "test-ec-1";
    public const string RsaKid = "test-rsa-1";

    private readonly ECDsa _ec = ECDsa.Create(ECCurve.NamedCurves.nistP384);
    private readonly RSA _rsa = RSA.Create(2048);

    public ECDsaSecurityKey EcKey => new(_ec) { KeyId = EcKid };

    public RsaSecurityKey RsaKey => new(_rsa) { KeyId = RsaKid };

    /// <summary>The public JWK Set (no private members), as a client would publish it.</summary>
    public string PublicJwks(params string[] kids)
    {
        var keys = new JsonArray();
        foreach (var key in PublicKeys())
        {
            if (kids.Length == 0 || kids.Contains(key.Kid))
            {
                keys.Add(ToJson(key));
            }
        }

        return new JsonObject { ["keys"] = keys }.ToJsonString();
    }

    /// <summary>The public keys as JWKs, with kid, alg and use.</summary>
    public IEnumerable<JsonWebKey> PublicKeys()
    {
        var ec = JsonWebKeyConverter.ConvertFromECDsaSecurityKey(new ECDsaSecurityKey(ECDsa.Create(_ec.ExportParameters(false))) { KeyId = EcKid });
        ec.Alg = "ES384";
        ec.Use = "sig";
        var rsa = JsonWebKeyConverter.ConvertFromRSASecurityKey(new RsaSecurityKey(_rsa.ExportParameters(false)) { KeyId = RsaKid });
        rsa.Alg = "RS384";
        rsa.Use = "sig";
        return [ec, rsa];
    }

    /// <summary>Settings for a service that trusts this client with its keys inline.</summary>
    public Dictionary<string, string?> InlineSettings() => new()
    {
        ["Natremia:Authentication:PublicBaseUrl"] = PublicBaseUrl,
        ["Natremia:Authentication:TrustedClients:0:Issuer"] = Issuer,
        ["Natremia:Authentication:TrustedClients:0:Jwks"] = PublicJwks(),
    };

    /// <summary>Settings for a service that trusts this client with keys fetched from the given URLs.</summary>
    public static Dictionary<string, string?> UrlSettings(params string[] jwksUrls)
    {
        var settings = new Dictionary<string, string?>
        {
            ["Natremia:Authentication:PublicBaseUrl"] = PublicBaseUrl,
            ["Natremia:Authentication:TrustedClients:0:Issuer"] = Issuer,

            // Generous: a loaded test machine must not turn a slow first fetch into a refusal.
            ["Natremia:Authentication:JwksFetchTimeoutSeconds"] = "30",
        };
        for (var i = 0; i < jwksUrls.Length; i++)
        {
            settings[$"Natremia:Authentication:TrustedClients:0:JwksUrls:{i}"] = jwksUrls[i];
        }

        return settings;
    }

    /// <summary>A signed token; <paramref name="change"/> edits the claims and header before signing.</summary>
    public string Token(string path, DateTimeOffset now, Action<TokenSpec>? change = null)
    {
        var spec = new TokenSpec
        {
            Audience = PublicBaseUrl + path,
            IssuedAt = now,
            Expires = now.AddMinutes(5),
        };
        change?.Invoke(spec);
        SecurityKey key = spec.Algorithm.StartsWith("ES", StringComparison.Ordinal) ? new ECDsaSecurityKey(_ec) : new RsaSecurityKey(_rsa);
        key.KeyId = spec.Kid ?? (spec.Algorithm.StartsWith("ES", StringComparison.Ordinal) ? EcKid : RsaKid);
        var headers = new Dictionary<string, object> { ["typ"] = spec.Type };
        if (spec.Jku is not null)
        {
            headers["jku"] = spec.Jku;
        }

        return new JsonWebTokenHandler().CreateToken(spec.Payload(), new SigningCredentials(key, spec.Algorithm), headers);
    }

    /// <summary>A token with header alg "none" and no signature, assembled by hand (no library makes one).</summary>
    public static string UnsignedToken(string path, DateTimeOffset now)
    {
        var spec = new TokenSpec { Audience = PublicBaseUrl + path, IssuedAt = now, Expires = now.AddMinutes(5) };
        return Base64UrlEncoder.Encode($"{{\"alg\":\"none\",\"typ\":\"JWT\",\"kid\":\"{EcKid}\"}}") + "." + Base64UrlEncoder.Encode(spec.Payload()) + ".";
    }

    /// <summary>The classic key-confusion attack: HS256 with the client's published public key (JWK Set text) as the secret.</summary>
    public string HmacWithPublicKeyToken(string path, DateTimeOffset now)
    {
        var spec = new TokenSpec { Audience = PublicBaseUrl + path, IssuedAt = now, Expires = now.AddMinutes(5) };
        var secret = new SymmetricSecurityKey(Encoding.UTF8.GetBytes(PublicJwks())) { KeyId = EcKid };
        return new JsonWebTokenHandler().CreateToken(spec.Payload(), new SigningCredentials(secret, SecurityAlgorithms.HmacSha256));
    }

    /// <summary>A valid token whose payload is then edited (the signature left as it was).</summary>
    public string TamperedToken(string path, DateTimeOffset now)
    {
        var parts = Token(path, now).Split('.');
        var payload = JsonNode.Parse(Base64UrlEncoder.Decode(parts[1]))!.AsObject();
        payload["exp"] = now.AddHours(10).ToUnixTimeSeconds();
        return parts[0] + "." + Base64UrlEncoder.Encode(payload.ToJsonString()) + "." + parts[2];
    }

    private static JsonObject ToJson(JsonWebKey key)
    {
        var json = new JsonObject { ["kty"] = key.Kty, ["kid"] = key.Kid, ["use"] = key.Use, ["alg"] = key.Alg };
        if (key.Kty == JsonWebAlgorithmsKeyTypes.EllipticCurve)
        {
            json["crv"] = key.Crv;
            json["x"] = key.X;
            json["y"] = key.Y;
        }
        else
        {
            json["n"] = key.N;
            json["e"] = key.E;
        }

        return json;
    }

    public void Dispose()
    {
        _ec.Dispose();
        _rsa.Dispose();
    }
}
