using System.Diagnostics;
using System.Globalization;
using CdsNatremia.Scenarios;
using CdsNatremia.Service.Telemetry;
using CdsNatremia.Service.Tests.Support;
using Microsoft.AspNetCore.Hosting;
using Microsoft.Extensions.DependencyInjection;
using Npgsql;
using OpenTelemetry.Metrics;
using OpenTelemetry.Trace;

namespace CdsNatremia.Service.Tests.Telemetry;

/// <summary>
/// With the PostgreSQL audit store, Npgsql's own spans and metrics are exported too, and carry the SQL text with
/// parameter placeholders only: never the patient's id or pseudonym. Needs PostgreSQL (NATREMIA_TEST_POSTGRES).
/// </summary>
[Collection(TelemetryCollection.Name)]
public sealed class DatabaseTelemetryTests
{
    [SkippableFact]
    public async Task PostgresAudit_NpgsqlSpansAndMetricsExported_NoPatientIdOrPseudonym()
    {
        var connection = Environment.GetEnvironmentVariable("NATREMIA_TEST_POSTGRES");
        Skip.If(string.IsNullOrEmpty(connection), "NATREMIA_TEST_POSTGRES is not set (run .ci/postgres.sh).");
        var schema = "telemetry_" + Guid.NewGuid().ToString("N")[..12];
        await using var database = NpgsqlDataSource.Create(connection!);
        await using (var create = database.CreateCommand($"CREATE SCHEMA {schema}"))
        {
            await create.ExecuteNonQueryAsync();
        }

        var spans = new List<Activity>();
        var metrics = new List<Metric>();
        try
        {
            await using var factory = NatremiaFactory.With(new() { ["Natremia:Audit:PostgresConnectionString"] = new NpgsqlConnectionStringBuilder(connection) { SearchPath = schema }.ConnectionString });
            await using var host = factory.WithWebHostBuilder(b => b.ConfigureServices(services =>
            {
                services.ConfigureOpenTelemetryTracerProvider(t => t.AddInMemoryExporter(spans));
                services.ConfigureOpenTelemetryMeterProvider(m => m.AddInMemoryExporter(metrics));
            }));
            var scenario = ScenarioLibrary.Find("01")!;
            Assert.NotEmpty(await HookCalls.RunAsync(host.CreateClient(), scenario));
            host.Services.GetRequiredService<TracerProvider>().ForceFlush(10_000);
            host.Services.GetRequiredService<MeterProvider>().ForceFlush(10_000);

            string pseudonym;
            await using (var read = database.CreateCommand($"SELECT patient_pseudonym FROM {schema}.issued_card LIMIT 1"))
            {
                pseudonym = (string)(await read.ExecuteScalarAsync())!;
            }

            var databaseSpans = spans.Where(s => s.Source.Name == TelemetrySetup.NpgsqlSource).ToList();
            Assert.NotEmpty(databaseSpans);
            Assert.Contains(spans, s => s.Source.Name == NatremiaTelemetry.Name && s.DisplayName == "audit write" && (string?)s.GetTagItem("natremia.audit.store") == "postgresql");
            Assert.Contains(metrics, m => m.MeterName == TelemetrySetup.NpgsqlSource);
            var texts = databaseSpans.SelectMany(s => s.TagObjects.Select(t => $"{t.Key}={Convert.ToString(t.Value, CultureInfo.InvariantCulture)}").Append(s.DisplayName)).ToList();
            Assert.Contains(texts, t => t.Contains("issued_card", StringComparison.Ordinal)); // the statement is there …
            foreach (var text in texts)
            {
                Assert.DoesNotContain(pseudonym, text, StringComparison.Ordinal); // … its values are not
                Assert.DoesNotContain(scenario.PatientId, text, StringComparison.Ordinal);
                Assert.DoesNotContain("Password", text, StringComparison.OrdinalIgnoreCase);
            }
        }
        finally
        {
            await using var drop = database.CreateCommand($"DROP SCHEMA {schema} CASCADE");
            await drop.ExecuteNonQueryAsync();
        }
    }
}
