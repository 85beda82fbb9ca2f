using System.ComponentModel.DataAnnotations;
using System.Globalization;
using Microsoft.Extensions.Options;
using Microsoft.IdentityModel.Tokens;

namespace CdsNatremia.Service.Security;

/// <summary>
/// Checks the authentication settings at start-up, so a service that would be open to anyone, or that could never
/// verify a token, does not start. Without trusted clients only the Development environment may run.
/// </summary>
internal sealed class ClientAuthenticationOptionsValidator(IHostEnvironment environment) : IValidateOptions<ClientAuthenticationOptions>
{
    /// <summary>JWK members that belong to private or symmetric keys; the service needs public keys only.</summary>
    private static readonly string[] SecretMembers = ["d", "p", "q", "dp", "dq", "qi", "k"];

    public ValidateOptionsResult Validate(string? name, ClientAuthenticationOptions options)
    {
        var failures = new List<string>();
        var results = new List<ValidationResult>();
        if (!Validator.TryValidateObject(options, new ValidationContext(options), results, validateAllProperties: true))
        {
            failures.AddRange(results.Select(r => $"{ClientAuthenticationOptions.Section}: {r.ErrorMessage}"));
        }

        foreach (var algorithm in options.Algorithms ?? [])
        {
            if (!ClientAuthenticationOptions.AsymmetricAlgorithms.Contains(algorithm))
            {
                failures.Add($"{ClientAuthenticationOptions.Section}:Algorithms: '{algorithm}' is not allowed. Only asymmetric algorithms "
                    + $"({string.Join(", ", ClientAuthenticationOptions.AsymmetricAlgorithms.Order(StringComparer.Ordinal))}) can be configured; "
                    + "'none' and HMAC (HS256, HS384, HS512) are always refused, as CDS Hooks 2.0 requires.");
            }
        }

        if (options.TrustedClients.Count == 0)
        {
            if (!environment.IsDevelopment())
            {
                failures.Add($"{ClientAuthenticationOptions.Section}:TrustedClients is empty, so any caller could use the service. "
                    + $"Without trusted clients the service runs only in the Development environment, not in '{environment.EnvironmentName}'. "
                    + "Configure at least one trusted client (issuer and JWK Set) and PublicBaseUrl; see docs/security.md.");
            }

            return failures.Count > 0 ? ValidateOptionsResult.Fail(failures) : ValidateOptionsResult.Success;
        }

        if (!IsAcceptableUrl(options.PublicBaseUrl, out var baseProblem))
        {
            failures.Add($"{ClientAuthenticationOptions.Section}:PublicBaseUrl {baseProblem} It is the URL the EHR calls, used to check each token's 'aud'.");
        }

        var issuers = new HashSet<string>(StringComparer.Ordinal);
        for (var i = 0; i < options.TrustedClients.Count; i++)
        {
            var client = options.TrustedClients[i];
            var where = string.Create(CultureInfo.InvariantCulture, $"{ClientAuthenticationOptions.Section}:TrustedClients:{i}");
            if (string.IsNullOrWhiteSpace(client.Issuer))
            {
                failures.Add($"{where}:Issuer is required (the 'iss' the client puts in its tokens).");
            }
            else if (!issuers.Add(client.Issuer))
            {
                failures.Add($"{where}:Issuer '{client.Issuer}' is listed twice.");
            }

            if (string.IsNullOrWhiteSpace(client.Jwks) && client.JwksUrls.Count == 0)
            {
                failures.Add($"{where}: give the client's public keys, inline (Jwks) or by URL (JwksUrls).");
            }

            if (!string.IsNullOrWhiteSpace(client.Jwks))
            {
                failures.AddRange(CheckJwks(client.Jwks).Select(p => $"{where}:Jwks {p}"));
            }

            foreach (var url in client.JwksUrls)
            {
                if (!IsAcceptableUrl(url, out var problem))
                {
                    failures.Add($"{where}:JwksUrls '{url}' {problem}");
                }
            }
        }

        return failures.Count > 0 ? ValidateOptionsResult.Fail(failures) : ValidateOptionsResult.Success;
    }

    /// <summary>Absolute, no query or fragment, https (http only on a loopback host: tests and local proxies).</summary>
    internal static bool IsAcceptableUrl(string? text, out string problem)
    {
        problem = string.Empty;
        if (string.IsNullOrWhiteSpace(text) || !Uri.TryCreate(text, UriKind.Absolute, out var uri))
        {
            problem = "must be an absolute URL.";
            return false;
        }

        if (!string.IsNullOrEmpty(uri.Query) || !string.IsNullOrEmpty(uri.Fragment))
        {
            problem = "must not carry a query or fragment.";
            return false;
        }

        if (uri.Scheme != Uri.UriSchemeHttps && !(uri.Scheme == Uri.UriSchemeHttp && uri.IsLoopback))
        {
            problem = "must use https (plain http is accepted only on a loopback host).";
            return false;
        }

        return true;
    }

    /// <summary>
    /// Null when the public key can be used to verify signatures: an EC key on a named curve (P-256, P-384, P-521)
    /// whose point (x, y) lies on that curve, or an RSA key with a modulus of at least 2048 bits and an exponent.
    /// The key is imported by the platform's cryptography, which rejects a point that is not on the curve.
    /// </summary>
    internal static string? PublicKeyProblem(JsonWebKey key)
    {
        try
        {
            if (key.Kty == JsonWebAlgorithmsKeyTypes.EllipticCurve)
            {
                var (curve, size) = key.Crv switch
                {
                    "P-256" => (System.Security.Cryptography.ECCurve.NamedCurves.nistP256, 32),
                    "P-384" => (System.Security.Cryptography.ECCurve.NamedCurves.nistP384, 48),
                    "P-521" => (System.Security.Cryptography.ECCurve.NamedCurves.nistP521, 66),
                    _ => (default(System.Security.Cryptography.ECCurve), 0),
                };
                if (size == 0)
                {
                    return $"has curve '{key.Crv}'; only P-256, P-384 and P-521 are accepted.";
                }

                var x = string.IsNullOrEmpty(key.X) ? [] : Base64UrlEncoder.DecodeBytes(key.X);
                var y = string.IsNullOrEmpty(key.Y) ? [] : Base64UrlEncoder.DecodeBytes(key.Y);
                if (x.Length != size || y.Length != size)
                {
                    return $"has coordinates x and y that are not {size} bytes each, as {key.Crv} requires.";
                }

                using var ec = System.Security.Cryptography.ECDsa.Create(new System.Security.Cryptography.ECParameters { Curve = curve, Q = new() { X = x, Y = y } });
                return null;
            }

            if (key.Kty == JsonWebAlgorithmsKeyTypes.RSA)
            {
                var n = string.IsNullOrEmpty(key.N) ? [] : Base64UrlEncoder.DecodeBytes(key.N);
                var e = string.IsNullOrEmpty(key.E) ? [] : Base64UrlEncoder.DecodeBytes(key.E);
                if (e.Length == 0 || n.Length * 8 < 2048)
                {
                    return "is not an RSA public key of at least 2048 bits with an exponent.";
                }

                using var rsa = System.Security.Cryptography.RSA.Create(new System.Security.Cryptography.RSAParameters { Modulus = n, Exponent = e });
                return null;
            }

            return null;
        }
        catch (Exception ex) when (ex is System.Security.Cryptography.CryptographicException or FormatException or ArgumentException)
        {
            return $"is not a valid public key ({(key.Kty == JsonWebAlgorithmsKeyTypes.EllipticCurve ? "the point (x, y) is not on the curve " + key.Crv : ex.GetType().Name)}).";
        }
    }

    private static List<string> CheckJwks(string json)
    {
        var problems = new List<string>();
        JsonWebKeySet set;
        try
        {
            set = new JsonWebKeySet(json) { SkipUnresolvedJsonWebKeys = false };
        }
        catch (ArgumentException)
        {
            problems.Add("is not a JWK Set ({\"keys\":[...]}).");
            return problems;
        }

        if (set.Keys.Count == 0)
        {
            problems.Add("holds no keys.");
        }

        foreach (var key in set.Keys)
        {
            if (string.IsNullOrEmpty(key.Kid))
            {
                problems.Add("has a key without 'kid' (CDS Hooks 2.0 tokens always name their key).");
            }

            if (key.Kty is not (JsonWebAlgorithmsKeyTypes.EllipticCurve or JsonWebAlgorithmsKeyTypes.RSA))
            {
                problems.Add($"key '{key.Kid}' has type '{key.Kty}'; only EC and RSA public keys are accepted.");
            }

            if (SecretMembers.Any(m => key.AdditionalData.ContainsKey(m)) || key.HasPrivateKey || !string.IsNullOrEmpty(key.K))
            {
                problems.Add($"key '{key.Kid}' holds private key material. Give the public key only, and treat the private key as exposed.");
                continue;
            }

            if (PublicKeyProblem(key) is { } unusable)
            {
                problems.Add($"key '{key.Kid}' {unusable} Copy the client's public JWK again exactly as it publishes it.");
            }
        }

        return problems;
    }
}
