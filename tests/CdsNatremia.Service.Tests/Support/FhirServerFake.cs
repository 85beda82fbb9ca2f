using System.Net;
using System.Net.Sockets;
using System.Text.Json.Nodes;
using CdsNatremia.Scenarios;
using WireMock.Logging;
using WireMock.Matchers;
using WireMock.RequestBuilders;
using WireMock.ResponseBuilders;
using WireMock.Server;
using WireMock.Settings;

namespace CdsNatremia.Service.Tests.Support;

/// <summary>
/// A FHIR server on loopback (WireMock.Net) at "{Origin}/fhir". Helpers map searches and reads to FHIR JSON answers;
/// <see cref="Requests"/> is the server's request log, to check what was (and was not) asked.
/// </summary>
public sealed class FhirServerFake : IDisposable
{
    public const string FhirJson = "application/fhir+json";

    private FhirServerFake(WireMockServer server, string origin)
    {
        Server = server;
        Origin = origin;
    }

    public WireMockServer Server { get; }

    /// <summary>"http://127.0.0.1:port".</summary>
    public string Origin { get; }

    /// <summary>The FHIR base URL, "http://127.0.0.1:port/fhir".</summary>
    public string BaseUrl => Origin + "/fhir";

    public static FhirServerFake Start()
    {
        var port = FreePort();
        var origin = $"http://127.0.0.1:{port}";
        var server = WireMockServer.Start(new WireMockServerSettings { Urls = [origin], StartAdminInterface = false });
        return new FhirServerFake(server, origin);
    }

    /// <summary>A loopback URL nothing listens on (connection refused): a server that is down.</summary>
    public static string DownBaseUrl() => $"http://127.0.0.1:{FreePort()}/fhir";

    public IReadOnlyList<ILogEntry> Requests => Server.LogEntries.ToList();

    /// <summary>Requests whose path ends with the resource type (e.g. "Observation").</summary>
    public int CountOf(string resourcePath) => Requests.Count(r => r.RequestMessage.Path.StartsWith("/fhir/" + resourcePath, StringComparison.Ordinal));

    public static IRequestBuilder Search(string type) => Request.Create().WithPath("/fhir/" + type).UsingGet();

    /// <summary>A search for Observations whose code parameter holds this code.</summary>
    public static IRequestBuilder ObservationsWithCode(string code)
        => Request.Create().WithPath("/fhir/Observation").WithUrl(new WildcardMatcher("*" + code + "*")).UsingGet();

    public static IResponseBuilder Fhir(JsonNode body, int status = 200)
        => Response.Create().WithStatusCode(status).WithHeader("Content-Type", FhirJson).WithBody(body.ToJsonString());

    public static IResponseBuilder Raw(string body, string contentType, int status = 200)
        => Response.Create().WithStatusCode(status).WithHeader("Content-Type", contentType).WithBody(body);

    public static IResponseBuilder Status(int status) => Response.Create().WithStatusCode(status);

    /// <summary>A searchset Bundle of the resources, with a "next" link when given.</summary>
    public static JsonObject Bundle(IEnumerable<JsonObject> resources, string? next = null)
    {
        var bundle = new JsonObject
        {
            ["resourceType"] = "Bundle",
            ["type"] = "searchset",
            ["entry"] = new JsonArray(resources.Select(r => (JsonNode)new JsonObject { ["resource"] = r.DeepClone(), ["search"] = new JsonObject { ["mode"] = "match" } }).ToArray()),
        };
        if (next is not null)
        {
            bundle["link"] = new JsonArray(new JsonObject { ["relation"] = "next", ["url"] = next });
        }

        return bundle;
    }

    /// <summary>A final serum sodium Observation for the patient (LOINC 2951-2, mmol/L).</summary>
    public static JsonObject Sodium(string id, string patientId, double value, DateTimeOffset at) => new()
    {
        ["resourceType"] = "Observation",
        ["id"] = id,
        ["status"] = "final",
        ["category"] = new JsonArray(new JsonObject { ["coding"] = new JsonArray(new JsonObject { ["system"] = "http://terminology.hl7.org/CodeSystem/observation-category", ["code"] = "laboratory" }) }),
        ["code"] = new JsonObject { ["coding"] = new JsonArray(new JsonObject { ["system"] = "http://loinc.org", ["code"] = "2951-2", ["display"] = "Sodium [Moles/volume] in Serum or Plasma" }) },
        ["subject"] = new JsonObject { ["reference"] = "Patient/" + patientId },
        ["effectiveDateTime"] = at.ToString("yyyy-MM-ddTHH:mm:ssZ", System.Globalization.CultureInfo.InvariantCulture),
        ["valueQuantity"] = new JsonObject { ["value"] = value, ["unit"] = "mmol/L", ["system"] = "http://unitsofmeasure.org", ["code"] = "mmol/L" },
    };

    /// <summary>
    /// Serves a scenario's data as the EHR's FHIR server would: the patient by id, and each search of the service's
    /// templates answered with that key's part of the scenario (split as prefetch would be), Medications marked "include".
    /// </summary>
    public void ServeScenario(Scenario scenario)
    {
        ArgumentNullException.ThrowIfNull(scenario);
        var entries = JsonNode.Parse(scenario.BundleJson)!["entry"]!.AsArray().Select(e => e!["resource"]!.AsObject()).ToList();
        var prefetch = HookRequestBuilder.Prefetch(entries);
        Server.Given(Search("Patient/" + scenario.PatientId)).RespondWith(Fhir(prefetch["patient"]!));
        Server.Given(ObservationsWithCode("2951-2")).RespondWith(Fhir(Searchset(prefetch["sodium"]!)));
        Server.Given(ObservationsWithCode("29463-7")).RespondWith(Fhir(Searchset(prefetch["weight"]!)));
        Server.Given(ObservationsWithCode("2692-2")).RespondWith(Fhir(Searchset(prefetch["labs"]!)));
        Server.Given(Search("Condition")).RespondWith(Fhir(Searchset(prefetch["conditions"]!)));
        Server.Given(Search("MedicationStatement")).RespondWith(Fhir(Searchset(prefetch["medicationStatements"]!)));
        Server.Given(Search("MedicationRequest")).RespondWith(Fhir(Searchset(prefetch["medicationRequests"]!)));
    }

    /// <summary>Requests for Observations whose code parameter holds this code.</summary>
    public int CountOfObservations(string code)
        => Requests.Count(r => r.RequestMessage.Path == "/fhir/Observation" && (r.RequestMessage.RawQuery ?? string.Empty).Contains(code, StringComparison.Ordinal));

    public void Dispose() => Server.Stop();

    private static JsonObject Searchset(JsonNode bundle)
    {
        var copy = bundle.DeepClone().AsObject();
        foreach (var entry in copy["entry"]?.AsArray() ?? [])
        {
            var type = (string?)entry!["resource"]!["resourceType"];
            entry["search"] = new JsonObject { ["mode"] = type == "Medication" ? "include" : "match" };
        }

        return copy;
    }

    private static int FreePort()
    {
        using var listener = new TcpListener(IPAddress.Loopback, 0);
        listener.Start();
        var port = ((IPEndPoint)listener.LocalEndpoint).Port;
        listener.Stop();
        return port;
    }
}
