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
            }
        }

        return problems;
    }
}
