using System.Security.Cryptography;
using System.Text;
using CdsNatremia.Audit;
using CdsNatremia.Service.Hooks;
using Microsoft.Extensions.Options;
using OpenTelemetry.Exporter;
using OpenTelemetry.Metrics;
using OpenTelemetry.Resources;
using OpenTelemetry.Trace;

namespace CdsNatremia.Service.Telemetry;

/// <summary>
/// Wires OpenTelemetry: traces and metrics of the ASP.NET Core server, of outgoing HTTP (FHIR fetches, JWK Set
/// downloads) and of PostgreSQL (Npgsql's own source and meter), plus the service's own (<see cref="NatremiaTelemetry"/>);
/// the Prometheus scrape endpoint, guarded by the admin key; OTLP export when an endpoint is configured.
/// </summary>
public static class TelemetrySetup
{
    /// <summary>Npgsql's activity source and meter name.</summary>
    public const string NpgsqlSource = "Npgsql";

    /// <summary>Header that carries the admin key (the same as the admin report's).</summary>
    public const string AdminKeyHeader = "X-Natremia-Admin-Key";

    /// <summary>Registers the telemetry options, the tracer and meter providers and the exporters.</summary>
    public static WebApplicationBuilder AddNatremiaTelemetry(this WebApplicationBuilder builder)
    {
        ArgumentNullException.ThrowIfNull(builder);
        var section = builder.Configuration.GetSection(TelemetryOptions.Section);
        builder.Services.AddOptions<TelemetryOptions>().Bind(section).ValidateDataAnnotations()
            .Validate(o => o.OtlpEndpoint is null || (o.OtlpEndpoint.IsAbsoluteUri && o.OtlpEndpoint.Scheme is "http" or "https"),
                $"{TelemetryOptions.Section}:OtlpEndpoint must be an absolute http(s) URL such as http://otel-collector:4317.")
            .Validate(o => !o.MetricsPath.StartsWith("/cds-services", StringComparison.OrdinalIgnoreCase),
                $"{TelemetryOptions.Section}:MetricsPath must not be under /cds-services (the CDS Hooks paths).")
            .ValidateOnStart();
        var options = section.Get<TelemetryOptions>() ?? new TelemetryOptions();
        if (!options.Enabled)
        {
            return builder;
        }

        var otlp = options.OtlpEndpoint ?? (Uri.TryCreate(Environment.GetEnvironmentVariable("OTEL_EXPORTER_OTLP_ENDPOINT"), UriKind.Absolute, out var fromEnvironment) ? fromEnvironment : null);
        var protocol = options.OtlpProtocol == "http/protobuf" ? OtlpExportProtocol.HttpProtobuf : OtlpExportProtocol.Grpc;
        void Otlp(OtlpExporterOptions o)
        {
            o.Endpoint = otlp!;
            o.Protocol = protocol;
        }

        builder.Services.AddOpenTelemetry()
            .ConfigureResource(r => r.AddService(options.ServiceName, serviceVersion: typeof(TelemetrySetup).Assembly.GetName().Version?.ToString()))
            .WithTracing(tracing =>
            {
                tracing
                    .AddProcessor(new TelemetryScrubber())
                    .AddSource(NatremiaTelemetry.Name, NpgsqlSource)
                    .AddAspNetCoreInstrumentation(o =>
                    {
                        // Health probes and scrapes every few seconds would drown the traces that matter.
                        o.Filter = context => !IsProbeOrScrape(context.Request.Path, options.MetricsPath);
                        o.RecordException = false;
                    })
                    .AddHttpClientInstrumentation(o => o.RecordException = false);
                if (otlp is not null)
                {
                    tracing.AddOtlpExporter(Otlp);
                }
            })
            .WithMetrics(metrics =>
            {
                metrics
                    .AddMeter(NatremiaTelemetry.Name, NpgsqlSource)
                    .AddAspNetCoreInstrumentation()
                    .AddHttpClientInstrumentation()
                    .AddPrometheusExporter(o => o.ScrapeResponseCacheDurationMilliseconds = 0);
                if (otlp is not null)
                {
                    metrics.AddOtlpExporter(Otlp);
                }
            });
        return builder;
    }

    /// <summary>
    /// Adds the answer counter (outermost, so it sees every final status) and the guarded Prometheus scrape endpoint.
    /// Call before the service's own middleware.
    /// </summary>
    public static WebApplication UseNatremiaTelemetry(this WebApplication app)
    {
        ArgumentNullException.ThrowIfNull(app);
        var options = app.Services.GetRequiredService<IOptions<TelemetryOptions>>().Value;
        if (!options.Enabled)
        {
            return app;
        }

        var catalog = app.Services.GetRequiredService<ServiceCatalog>();
        app.Use(async (context, next) =>
        {
            var call = CdsCall(context.Request, catalog);
            await next(context).ConfigureAwait(false);
            if (call is { } c)
            {
                NatremiaTelemetry.RecordAnswer(c.Service, c.Kind, context.Response.StatusCode);
            }
        });

        app.UseOpenTelemetryPrometheusScrapingEndpoint(
            meterProvider: null,
            predicate: context => context.Request.Path.Equals(options.MetricsPath, StringComparison.Ordinal)
                                  && (options.MetricsPort is not { } port || context.Connection.LocalPort == port),
            path: null,
            configureBranchedPipeline: branch => branch.Use(async (context, next) =>
            {
                var audit = context.RequestServices.GetRequiredService<IOptions<AuditOptions>>().Value;
                var refusal = ScrapeRefusal(context.Request, audit.AdminApiKey);
                if (refusal is null)
                {
                    await next(context).ConfigureAwait(false);
                    return;
                }

                context.Response.StatusCode = refusal.Value;
                if (refusal == StatusCodes.Status401Unauthorized)
                {
                    context.Response.Headers.WWWAuthenticate = AdminKeyHeader;
                }

                await context.Response.WriteAsJsonAsync(
                    new
                    {
                        title = refusal == StatusCodes.Status403Forbidden ? "Metrics disabled" : "Admin key required",
                        status = refusal,
                        detail = refusal == StatusCodes.Status403Forbidden
                            ? "No admin key is configured (Natremia:Audit:AdminApiKey), so the metrics endpoint is refused to everyone."
                            : $"Send the configured admin key in the {AdminKeyHeader} header or as a Bearer token.",
                    },
                    options: null,
                    contentType: "application/problem+json").ConfigureAwait(false);
            }),
            optionsName: null);
        return app;
    }

    /// <summary>Null when the call may scrape; else 403 (no admin key configured) or 401 (missing or wrong key).</summary>
    internal static int? ScrapeRefusal(HttpRequest request, string? adminKey)
    {
        if (string.IsNullOrEmpty(adminKey))
        {
            return StatusCodes.Status403Forbidden;
        }

        var sent = request.Headers[AdminKeyHeader].ToString();
        var authorization = request.Headers.Authorization.ToString();
        if (sent.Length == 0 && authorization.StartsWith("Bearer ", StringComparison.OrdinalIgnoreCase))
        {
            sent = authorization["Bearer ".Length..].Trim();
        }

        return sent.Length > 0 && CryptographicOperations.FixedTimeEquals(
            SHA256.HashData(Encoding.UTF8.GetBytes(sent)), SHA256.HashData(Encoding.UTF8.GetBytes(adminKey)))
            ? null
            : StatusCodes.Status401Unauthorized;
    }

    private static bool IsProbeOrScrape(PathString path, string metricsPath)
        => path.Equals("/healthz", StringComparison.Ordinal) || path.Equals("/readyz", StringComparison.Ordinal) || path.Equals(metricsPath, StringComparison.Ordinal);

    /// <summary>The service id (a catalogue id or "other") and kind of a POST under /cds-services, else null.</summary>
    private static (string Service, string Kind)? CdsCall(HttpRequest request, ServiceCatalog catalog)
    {
        if (!HttpMethods.IsPost(request.Method) || !request.Path.StartsWithSegments("/cds-services", StringComparison.OrdinalIgnoreCase, out var rest))
        {
            return null;
        }

        var segments = (rest.Value ?? string.Empty).Split('/', StringSplitOptions.RemoveEmptyEntries);
        if (segments.Length is < 1 or > 2 || (segments.Length == 2 && segments[1] != "feedback"))
        {
            return (NatremiaTelemetry.Other, "other");
        }

        var service = catalog.Find(segments[0]) is not null ? segments[0] : NatremiaTelemetry.Other;
        return (service, segments.Length == 2 ? "feedback" : "hook");
    }
}
