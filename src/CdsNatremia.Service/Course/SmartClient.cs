using System.Net.Http.Headers;
using System.Text;
using System.Text.Json;
using CdsNatremia.Service.Fetching;

namespace CdsNatremia.Service.Course;

/// <summary>The parts of an EHR's SMART configuration the launch uses (SMART App Launch 2.0, "SMART configuration").</summary>
/// <param name="AuthorizationEndpoint">Where the browser is sent to authorize.</param>
/// <param name="TokenEndpoint">Where the code is exchanged.</param>
public sealed record SmartConfiguration(Uri AuthorizationEndpoint, Uri TokenEndpoint);

/// <summary>A token response: the access token and the launch context.</summary>
/// <param name="AccessToken">The bearer token for the EHR's FHIR server.</param>
/// <param name="ExpiresIn">Lifetime in seconds, when given.</param>
/// <param name="Scope">The granted scope.</param>
/// <param name="PatientId">The patient in context.</param>
public sealed record SmartToken(string AccessToken, long? ExpiresIn, string Scope, string PatientId)
{
    /// <inheritdoc />
    public override string ToString() => "SmartToken { (hidden) }";
}

/// <summary>Why a SMART step failed, in words safe to show (no token, no code, no patient).</summary>
public sealed class SmartLaunchException(string message) : Exception(message);

/// <summary>
/// The two server-side calls of the EHR launch: reading {iss}/.well-known/smart-configuration and exchanging the code
/// at the token endpoint (confidential symmetric client: HTTP Basic). Only called for a configured issuer. The HttpClient
/// follows no redirect, keeps no cookie and logs nothing (a URL or body could carry the code or the patient).
/// </summary>
public sealed class SmartClient
{
    /// <summary>The named HttpClient.</summary>
    public const string HttpClientName = "CdsNatremia.Smart";

    /// <summary>Largest answer read, bytes.</summary>
    public const int MaxResponseBytes = 256 * 1024;

    private readonly IHttpClientFactory _clients;
    private readonly bool _development;

    /// <summary>Creates the client.</summary>
    public SmartClient(IHttpClientFactory clients, IHostEnvironment environment)
    {
        _clients = clients;
        _development = environment.IsDevelopment();
    }

    /// <summary>Reads and checks the EHR's SMART configuration.</summary>
    public async Task<SmartConfiguration> DiscoverAsync(string issuer, CancellationToken cancellationToken)
    {
        var url = new Uri(issuer.TrimEnd('/') + "/.well-known/smart-configuration");
        using var request = new HttpRequestMessage(HttpMethod.Get, url);
        request.Headers.Accept.Add(new MediaTypeWithQualityHeaderValue("application/json"));
        using var document = await SendAsync(request, "the EHR's SMART configuration", cancellationToken).ConfigureAwait(false);
        var root = document.RootElement;
        var authorize = Endpoint(root, "authorization_endpoint");
        var token = Endpoint(root, "token_endpoint");
        if (!root.TryGetProperty("code_challenge_methods_supported", out var methods) || methods.ValueKind != JsonValueKind.Array
            || !methods.EnumerateArray().Any(m => m.ValueKind == JsonValueKind.String && m.GetString() == "S256"))
        {
            throw new SmartLaunchException("The EHR's SMART configuration does not list S256 in code_challenge_methods_supported; SMART App Launch 2.0 requires PKCE with S256.");
        }

        if (root.TryGetProperty("capabilities", out var capabilities) && capabilities.ValueKind == JsonValueKind.Array
            && !capabilities.EnumerateArray().Any(c => c.ValueKind == JsonValueKind.String && c.GetString() == "launch-ehr"))
        {
            throw new SmartLaunchException("The EHR's SMART configuration does not offer the EHR launch (capability launch-ehr).");
        }

        return new SmartConfiguration(authorize, token);
    }

    /// <summary>Exchanges the authorization code for a token, server-side.</summary>
    public async Task<SmartToken> ExchangeAsync(PendingLaunch launch, string code, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(launch);
        using var request = new HttpRequestMessage(HttpMethod.Post, launch.TokenEndpoint)
        {
            Content = new FormUrlEncodedContent(new Dictionary<string, string>
            {
                ["grant_type"] = "authorization_code",
                ["code"] = code,
                ["redirect_uri"] = launch.RedirectUri,
                ["code_verifier"] = launch.CodeVerifier,
            }),
        };
        request.Headers.Accept.Add(new MediaTypeWithQualityHeaderValue("application/json"));
        if (!string.IsNullOrEmpty(launch.Ehr.ClientSecret))
        {
            // RFC 6749 section 2.3.1: client id and secret form-encoded, then Basic.
            var pair = Uri.EscapeDataString(launch.Ehr.ClientId) + ":" + Uri.EscapeDataString(launch.Ehr.ClientSecret);
            request.Headers.Authorization = new AuthenticationHeaderValue("Basic", Convert.ToBase64String(Encoding.UTF8.GetBytes(pair)));
        }

        using var document = await SendAsync(request, "the EHR's token endpoint", cancellationToken).ConfigureAwait(false);
        var root = document.RootElement;
        var accessToken = Text(root, "access_token");
        var tokenType = Text(root, "token_type");
        var patient = Text(root, "patient");
        if (string.IsNullOrEmpty(accessToken) || !string.Equals(tokenType, "Bearer", StringComparison.OrdinalIgnoreCase))
        {
            throw new SmartLaunchException("The EHR's token endpoint gave no bearer access token.");
        }

        if (!accessToken.All(c => c is > ' ' and <= '~'))
        {
            throw new SmartLaunchException("The EHR's access token holds characters an HTTP header cannot carry.");
        }

        if (string.IsNullOrEmpty(patient) || !FhirId(patient))
        {
            throw new SmartLaunchException("The EHR's token response names no patient (launch context \"patient\"): the view shows one patient's course and needs it.");
        }

        long? expiresIn = root.TryGetProperty("expires_in", out var e) && e.TryGetInt64(out var seconds) && seconds > 0 ? seconds : null;
        return new SmartToken(accessToken, expiresIn, Text(root, "scope") ?? string.Empty, patient);
    }

    /// <summary>A FHIR logical id: 1–64 of A–Z, a–z, 0–9, '-' and '.' (FHIR R4 datatype id).</summary>
    public static bool FhirId(string value)
        => value.Length is >= 1 and <= 64 && value.All(c => char.IsAsciiLetterOrDigit(c) || c is '-' or '.');

    private Uri Endpoint(JsonElement root, string name)
    {
        if (Text(root, name) is not { } text || !Uri.TryCreate(text, UriKind.Absolute, out var uri)
            || !string.IsNullOrEmpty(uri.UserInfo) || !string.IsNullOrEmpty(uri.Fragment))
        {
            throw new SmartLaunchException($"The EHR's SMART configuration has no usable {name}.");
        }

        if (uri.Scheme != Uri.UriSchemeHttps && !(_development && uri.Scheme == Uri.UriSchemeHttp && uri.IsLoopback))
        {
            throw new SmartLaunchException($"The EHR's {name} is not https (only a loopback address may use http, and only in Development).");
        }

        return uri;
    }

    private static string? Text(JsonElement root, string name)
        => root.ValueKind == JsonValueKind.Object && root.TryGetProperty(name, out var value) && value.ValueKind == JsonValueKind.String ? value.GetString() : null;

    private async Task<JsonDocument> SendAsync(HttpRequestMessage request, string what, CancellationToken cancellationToken)
    {
        var client = _clients.CreateClient(HttpClientName);
        HttpResponseMessage response;
        try
        {
            response = await client.SendAsync(request, HttpCompletionOption.ResponseHeadersRead, cancellationToken).ConfigureAwait(false);
        }
        catch (Exception ex) when (ex is HttpRequestException or TaskCanceledException or IOException)
        {
            throw new SmartLaunchException($"Could not reach {what} ({FhirServerAllowlist.OriginOf(request.RequestUri!)}).");
        }

        using (response)
        {
            var status = (int)response.StatusCode;
            if (status is < 200 or > 299)
            {
                throw new SmartLaunchException($"{Capital(what)} answered HTTP {status.ToString(System.Globalization.CultureInfo.InvariantCulture)}.");
            }

            var bytes = await ReadCappedAsync(response.Content, cancellationToken).ConfigureAwait(false)
                ?? throw new SmartLaunchException($"{Capital(what)} sent an answer larger than {MaxResponseBytes / 1024} KB.");
            try
            {
                return JsonDocument.Parse(bytes);
            }
            catch (JsonException)
            {
                throw new SmartLaunchException($"{Capital(what)} did not answer with JSON.");
            }
        }
    }

    private static string Capital(string text) => char.ToUpperInvariant(text[0]) + text[1..];

    private static async Task<byte[]?> ReadCappedAsync(HttpContent content, CancellationToken cancellationToken)
    {
        if (content.Headers.ContentLength > MaxResponseBytes)
        {
            return null;
        }

        var stream = await content.ReadAsStreamAsync(cancellationToken).ConfigureAwait(false);
        await using (stream.ConfigureAwait(false))
        {
            using var body = new MemoryStream();
            var buffer = new byte[16384];
            int read;
            while ((read = await stream.ReadAsync(buffer, cancellationToken).ConfigureAwait(false)) > 0)
            {
                if (body.Length + read > MaxResponseBytes)
                {
                    return null;
                }

                body.Write(buffer, 0, read);
            }

            return body.ToArray();
        }
    }
}
