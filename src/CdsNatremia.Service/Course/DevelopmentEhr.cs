using System.Collections.Concurrent;
using System.Security.Cryptography;
using System.Text;
using System.Text.Json.Nodes;
using CdsNatremia.Scenarios;

namespace CdsNatremia.Service.Course;

/// <summary>
/// A loopback test EHR for Development and tests, so the view can be launched without a real EHR: SMART discovery, an
/// authorization server that approves at once (checking client, redirect URI, aud, PKCE S256 and the launch), a token
/// endpoint (HTTP Basic, one-use codes, the PKCE verifier checked against the challenge) and a read-only FHIR server
/// that answers the chart-review queries with one invented scenario, its dates moved to the clock's now. The launch id
/// names the scenario ("01", "39"…). Served at /dev-ehr only in Development (or when a test maps it).
/// </summary>
public sealed class DevelopmentEhr
{
    /// <summary>Path of the EHR below the host.</summary>
    public const string BasePath = "/dev-ehr";

    /// <summary>The client id the EHR knows this app by.</summary>
    public const string ClientId = "natremia-course-dev";

    private readonly ConcurrentDictionary<string, (string Challenge, string RedirectUri, string Scenario)> _codes = new(StringComparer.Ordinal);
    private readonly ConcurrentDictionary<string, string> _tokens = new(StringComparer.Ordinal);
    private readonly TimeProvider _time;

    /// <summary>Creates the EHR with a fresh random client secret (never stored).</summary>
    public DevelopmentEhr(TimeProvider time)
    {
        _time = time;
        ClientSecret = CourseSessions.NewId();
    }

    /// <summary>The client secret of this process's EHR registration.</summary>
    public string ClientSecret { get; }

    /// <summary>How many FHIR requests were answered (for tests).</summary>
    public int FhirRequests => _fhirRequests;

    private int _fhirRequests;

    /// <summary>The FHIR base URL (iss) of this EHR for a request's host.</summary>
    public static string IssuerFor(HttpRequest request)
    {
        ArgumentNullException.ThrowIfNull(request);
        return request.Scheme + "://" + request.Host + request.PathBase + BasePath + "/fhir";
    }

    /// <summary>The EHR registration the view uses for this EHR.</summary>
    public SmartEhrOptions Registration(string issuer) => new() { Issuer = issuer, ClientId = ClientId, ClientSecret = ClientSecret, Name = "Development test EHR" };

    /// <summary>Maps the EHR's endpoints.</summary>
    public void Map(IEndpointRouteBuilder endpoints)
    {
        ArgumentNullException.ThrowIfNull(endpoints);
        var group = endpoints.MapGroup(BasePath);
        group.MapGet("/fhir/.well-known/smart-configuration", (HttpRequest request) =>
        {
            var root = request.Scheme + "://" + request.Host + request.PathBase + BasePath;
            return Results.Json(new JsonObject
            {
                ["issuer"] = root,
                ["authorization_endpoint"] = root + "/authorize",
                ["token_endpoint"] = root + "/token",
                ["token_endpoint_auth_methods_supported"] = new JsonArray("client_secret_basic"),
                ["grant_types_supported"] = new JsonArray("authorization_code"),
                ["scopes_supported"] = new JsonArray([.. SmartScopes.Requested.Split(' ').Select(s => (JsonNode)s)]),
                ["response_types_supported"] = new JsonArray("code"),
                ["capabilities"] = new JsonArray("launch-ehr", "client-confidential-symmetric", "context-ehr-patient", "permission-v2", "permission-v1"),
                ["code_challenge_methods_supported"] = new JsonArray("S256"),
            });
        });
        group.MapGet("/authorize", Authorize);
        group.MapPost("/token", Token);
        group.MapGet("/fhir/{type}/{id}", (HttpRequest request, string type, string id) => Fhir(request, type, id));
        group.MapGet("/fhir/{type}", (HttpRequest request, string type) => Fhir(request, type, null));
    }

    private IResult Authorize(HttpRequest request)
    {
        string Q(string name) => request.Query[name].ToString();
        var issuer = IssuerFor(request);
        if (Q("response_type") != "code" || Q("client_id") != ClientId || Q("code_challenge_method") != "S256" || Q("code_challenge").Length < 43)
        {
            return Results.BadRequest("test EHR: response_type=code, the client id and a PKCE S256 challenge are required");
        }

        if (!string.Equals(Q("aud").TrimEnd('/'), issuer, StringComparison.Ordinal))
        {
            return Results.BadRequest("test EHR: aud must be this EHR's FHIR base URL");
        }

        if (ScenarioLibrary.Find(Q("launch")) is null || string.IsNullOrEmpty(Q("state")))
        {
            return Results.BadRequest("test EHR: unknown launch, or no state");
        }

        var redirect = Q("redirect_uri");
        if (!Uri.TryCreate(redirect, UriKind.Absolute, out var target) || !target.IsLoopback)
        {
            return Results.BadRequest("test EHR: the redirect_uri must be a loopback address");
        }

        var code = CourseSessions.NewId();
        _codes[code] = (Q("code_challenge"), redirect, Q("launch"));
        return Results.Redirect(redirect + "?code=" + Uri.EscapeDataString(code) + "&state=" + Uri.EscapeDataString(Q("state")));
    }

    private async Task<IResult> Token(HttpRequest request)
    {
        var expected = "Basic " + Convert.ToBase64String(Encoding.UTF8.GetBytes(Uri.EscapeDataString(ClientId) + ":" + Uri.EscapeDataString(ClientSecret)));
        if (!string.Equals(request.Headers.Authorization.ToString(), expected, StringComparison.Ordinal))
        {
            return Results.Json(new JsonObject { ["error"] = "invalid_client" }, statusCode: 401);
        }

        var form = await request.ReadFormAsync().ConfigureAwait(false);
        var code = form["code"].ToString();
        if (form["grant_type"] != "authorization_code" || !_codes.TryRemove(code, out var issued))
        {
            return Results.Json(new JsonObject { ["error"] = "invalid_grant" }, statusCode: 400);
        }

        var challenge = CourseSessions.Base64Url(SHA256.HashData(Encoding.ASCII.GetBytes(form["code_verifier"].ToString())));
        if (challenge != issued.Challenge || form["redirect_uri"] != issued.RedirectUri)
        {
            return Results.Json(new JsonObject { ["error"] = "invalid_grant", ["error_description"] = "PKCE verifier or redirect_uri does not match" }, statusCode: 400);
        }

        var scenario = ScenarioLibrary.Find(issued.Scenario)!;
        var token = CourseSessions.NewId();
        _tokens[token] = issued.Scenario;
        return Results.Json(new JsonObject
        {
            ["access_token"] = token,
            ["token_type"] = "Bearer",
            ["expires_in"] = 3600,
            ["scope"] = SmartScopes.Requested,
            ["patient"] = scenario.PatientId,
            ["need_patient_banner"] = true,
        });
    }

    private IResult Fhir(HttpRequest request, string type, string? id)
    {
        Interlocked.Increment(ref _fhirRequests);
        var header = request.Headers.Authorization.ToString();
        if (!header.StartsWith("Bearer ", StringComparison.Ordinal) || !_tokens.TryGetValue(header["Bearer ".Length..], out var scenarioId))
        {
            return Results.Json(Outcome("login", "a bearer token from this EHR is required"), statusCode: 401, contentType: "application/fhir+json");
        }

        var scenario = ScenarioLibrary.Find(scenarioId)!;
        var shift = _time.GetUtcNow() - ScenarioLibrary.Anchor;
        var bundle = JsonNode.Parse(DateShifter.Shift(scenario.BundleJson, shift))!.AsObject();
        var resources = bundle["entry"]?.AsArray().Select(e => e!["resource"]!.AsObject()).ToList() ?? [];
        var prefetch = HookRequestBuilder.Prefetch(resources);
        if (id is not null)
        {
            return type == "Patient" && id == scenario.PatientId && prefetch["patient"] is JsonObject patient
                ? Results.Json(patient, contentType: "application/fhir+json")
                : Results.Json(Outcome("not-found", "no such resource"), statusCode: 404, contentType: "application/fhir+json");
        }

        if (request.Query["patient"] != scenario.PatientId)
        {
            return Results.Json(Outcome("forbidden", "this token is for another patient"), statusCode: 403, contentType: "application/fhir+json");
        }

        var code = request.Query["code"].ToString();
        var key = type switch
        {
            "Observation" when code.Contains("2951-2", StringComparison.Ordinal) => "sodium",
            "Observation" when code.Contains("29463-7", StringComparison.Ordinal) => "weight",
            "Observation" => "labs",
            "Condition" => "conditions",
            "MedicationStatement" => "medicationStatements",
            "MedicationRequest" => "medicationRequests",
            _ => null,
        };
        return key is null
            ? Results.Json(Outcome("not-supported", "this test EHR answers the chart-review queries only"), statusCode: 400, contentType: "application/fhir+json")
            : Results.Json(prefetch[key]!.DeepClone(), contentType: "application/fhir+json");
    }

    private static JsonObject Outcome(string code, string text) => new()
    {
        ["resourceType"] = "OperationOutcome",
        ["issue"] = new JsonArray(new JsonObject { ["severity"] = "error", ["code"] = code, ["diagnostics"] = text }),
    };
}
