using System.ComponentModel.DataAnnotations;

namespace CdsNatremia.Service.Telemetry;

/// <summary>Traces and metrics (OpenTelemetry), bound from the "Natremia:Telemetry" configuration section (docs/deployment.md).</summary>
public sealed class TelemetryOptions
{
    /// <summary>The configuration section.</summary>
    public const string Section = "Natremia:Telemetry";

    /// <summary>Collects traces and metrics. Default true; false turns off the scrape endpoint and OTLP export too.</summary>
    public bool Enabled { get; set; } = true;

    /// <summary>The service name every span and metric carries (OpenTelemetry resource <c>service.name</c>). Default "cdsnatremia".</summary>
    [Required]
    [RegularExpression("^[A-Za-z0-9._-]{1,64}$")]
    public string ServiceName { get; set; } = "cdsnatremia";

    /// <summary>
    /// Path of the Prometheus scrape endpoint. Default "/metrics". It is protected like the admin report: the configured
    /// <c>Natremia:Audit:AdminApiKey</c> must be sent in the <c>X-Natremia-Admin-Key</c> header or as
    /// <c>Authorization: Bearer</c>; with no admin key configured it refuses everyone (403).
    /// </summary>
    [Required]
    [RegularExpression("^/[A-Za-z0-9/_-]{1,63}$")]
    public string MetricsPath { get; set; } = "/metrics";

    /// <summary>
    /// When set, the scrape endpoint answers only on connections to this local port, so it can be kept off the port
    /// the load balancer exposes. The port must also be among the addresses the server listens on (<c>Urls</c>, e.g.
    /// "http://+:8080;http://+:9464"). Default: not set (the endpoint answers on every port).
    /// </summary>
    [Range(1, 65535)]
    public int? MetricsPort { get; set; }

    /// <summary>
    /// OTLP collector endpoint (e.g. "http://otel-collector:4317"). Traces and metrics are pushed there only when it is
    /// set (here or in the standard <c>OTEL_EXPORTER_OTLP_ENDPOINT</c> variable). Default: not set.
    /// </summary>
    public Uri? OtlpEndpoint { get; set; }

    /// <summary>OTLP transport: "grpc" (default, port 4317) or "http/protobuf" (port 4318).</summary>
    [RegularExpression("^(grpc|http/protobuf)$")]
    public string OtlpProtocol { get; set; } = "grpc";
}
