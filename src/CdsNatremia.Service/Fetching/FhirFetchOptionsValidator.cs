using System.Globalization;
using Microsoft.Extensions.Options;

namespace CdsNatremia.Service.Fetching;

/// <summary>
/// Checks every <see cref="FhirFetchOptions.AllowedServers"/> entry at start-up: an absolute http(s) base URL without
/// user information, query or fragment, and https outside the Development environment. An entry that could never
/// match (a typo such as "::::") stops the start-up instead of silently allowing nothing. Without a host environment
/// (a bare service collection, as tools and tests build) only the form is checked, not the https rule.
/// </summary>
internal sealed class FhirFetchOptionsValidator(IHostEnvironment? environment = null) : IValidateOptions<FhirFetchOptions>
{
    public ValidateOptionsResult Validate(string? name, FhirFetchOptions options)
    {
        var failures = new List<string>();
        for (var i = 0; i < options.AllowedServers.Count; i++)
        {
            var entry = options.AllowedServers[i];
            var where = string.Create(CultureInfo.InvariantCulture, $"{FhirFetchOptions.Section}:AllowedServers:{i}");
            if (Problem(entry, environment?.IsDevelopment() ?? true) is { } problem)
            {
                failures.Add($"{where} '{entry}' {problem} Give the EHR's FHIR base URL, e.g. https://ehr.hospital.example/fhir.");
            }
        }

        return failures.Count > 0 ? ValidateOptionsResult.Fail(failures) : ValidateOptionsResult.Success;
    }

    private static string? Problem(string? entry, bool development)
    {
        if (string.IsNullOrWhiteSpace(entry) || !Uri.TryCreate(entry, UriKind.Absolute, out var uri)
            || (uri.Scheme != Uri.UriSchemeHttps && uri.Scheme != Uri.UriSchemeHttp) || string.IsNullOrEmpty(uri.Host))
        {
            return "is not an absolute http(s) URL.";
        }

        if (!string.IsNullOrEmpty(uri.UserInfo) || !string.IsNullOrEmpty(uri.Query) || !string.IsNullOrEmpty(uri.Fragment))
        {
            return "must not carry user information, a query or a fragment.";
        }

        return uri.Scheme != Uri.UriSchemeHttps && !development
            ? "must use https outside the Development environment (the EHR's access token is sent to it)."
            : null;
    }
}
