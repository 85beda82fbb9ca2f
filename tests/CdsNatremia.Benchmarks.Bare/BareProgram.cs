using System.Text;
using System.Text.Json;

namespace CdsNatremia.Benchmarks.Bare;

/// <summary>
/// POST /cds-services/{id}: parses the whole body with System.Text.Json (as the real service does before any FHIR
/// work), reads the patient id, and answers a fixed one-card response. Everything the real service does beyond that
/// (FHIR parsing, rules, card writing) is what the load run's throughput ratio measures. Bind it to loopback with
/// <c>--urls http://127.0.0.1:PORT</c>.
/// </summary>
internal static class BareProgram
{
    private static readonly byte[] FixedResponse = Encoding.UTF8.GetBytes(
        """{"cards":[{"uuid":"0d5f4c1e-7a0b-4d53-9a37-6f2b8e4c9a01","summary":"Fixed card from the bare endpoint (benchmark ceiling only).","indicator":"info","detail":"This endpoint parses the request and returns a constant card. It gives no advice.","source":{"label":"Benchmark ceiling"}}]}""");

    public static void Main(string[] args)
    {
        var builder = WebApplication.CreateSlimBuilder(args);
        builder.Logging.SetMinimumLevel(LogLevel.Warning);
        var app = builder.Build();
        app.MapGet("/healthz", () => Results.Text("alive"));
        app.MapPost("/cds-services/{id}", InvokeAsync);
        app.Run();
    }

    private static async Task<IResult> InvokeAsync(string id, HttpRequest request, CancellationToken cancellationToken)
    {
        JsonDocument document;
        try
        {
            document = await JsonDocument.ParseAsync(request.Body, default, cancellationToken).ConfigureAwait(false);
        }
        catch (JsonException)
        {
            return Results.BadRequest();
        }

        using (document)
        {
            var root = document.RootElement;
            var hasPatient = root.ValueKind == JsonValueKind.Object
                && root.TryGetProperty("context", out var context) && context.ValueKind == JsonValueKind.Object
                && context.TryGetProperty("patientId", out var patient) && patient.ValueKind == JsonValueKind.String;
            return hasPatient && id.Length > 0 ? Results.Bytes(FixedResponse, "application/json") : Results.BadRequest();
        }
    }
}
