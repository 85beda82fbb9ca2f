using System.Net;
using System.Net.Http.Headers;
using CdsNatremia.Service.Tests.Support;
using Npgsql;

namespace CdsNatremia.Service.Tests.Security;

/// <summary>
/// Replay across instances: two real service processes behind one (imagined) load balancer share the audit's
/// PostgreSQL, which keeps the used token ids; a token accepted by one is refused by the other. Runs when
/// NATREMIA_TEST_POSTGRES holds a connection string (.ci/run sets it up); skipped with the reason otherwise.
/// </summary>
public sealed class SharedReplayProcessTests
{
    private const string Variable = "NATREMIA_TEST_POSTGRES";
    private static readonly TimeSpan Wait = TimeSpan.FromSeconds(120);

    [SkippableFact]
    public async Task SameToken_AcceptedByInstanceA_RefusedByInstanceB()
    {
        var baseString = Environment.GetEnvironmentVariable(Variable);
        Skip.If(string.IsNullOrEmpty(baseString), $"PostgreSQL not configured: set {Variable} to a connection string (.ci/run does, through .ci/postgres.sh) to run the two-instance replay test.");
        var schema = "replay_test_" + Guid.NewGuid().ToString("N")[..12];
        await ExecuteAsync(baseString!, $"CREATE SCHEMA {schema}");
        try
        {
            using var keys = new TestClientKeys();
            var settings = keys.InlineSettings();
            settings["Natremia:Audit:PostgresConnectionString"] = new NpgsqlConnectionStringBuilder(baseString) { SearchPath = schema }.ToString();
            await using var instanceA = ServiceProcess.Start("Development", settings);
            await using var instanceB = ServiceProcess.Start("Development", settings);
            Assert.True(await instanceA.WaitUntilReadyAsync(Wait), "instance A did not become ready: " + instanceA.StandardError + instanceA.StandardOutput);
            Assert.True(await instanceB.WaitUntilReadyAsync(Wait), "instance B did not become ready: " + instanceB.StandardError + instanceB.StandardOutput);
            var token = keys.Token("/cds-services", DateTimeOffset.UtcNow);
            var other = keys.Token("/cds-services", DateTimeOffset.UtcNow);

            var first = await DiscoveryAsync(instanceA, token);
            var replayedElsewhere = await DiscoveryAsync(instanceB, token);
            var freshOnB = await DiscoveryAsync(instanceB, other);

            Assert.Equal(HttpStatusCode.OK, first);
            Assert.Equal(HttpStatusCode.Unauthorized, replayedElsewhere);
            Assert.Equal(HttpStatusCode.OK, freshOnB);
            Assert.Contains("was already used (replay)", instanceB.StandardOutput, StringComparison.Ordinal);
        }
        finally
        {
            await ExecuteAsync(baseString!, $"DROP SCHEMA IF EXISTS {schema} CASCADE");
        }
    }

    private static async Task<HttpStatusCode> DiscoveryAsync(ServiceProcess instance, string token)
    {
        using var client = new HttpClient { BaseAddress = instance.BaseAddress, Timeout = TimeSpan.FromSeconds(30) };
        using var request = new HttpRequestMessage(HttpMethod.Get, "/cds-services");
        request.Headers.Authorization = new AuthenticationHeaderValue("Bearer", token);
        using var response = await client.SendAsync(request);
        return response.StatusCode;
    }

    private static async Task ExecuteAsync(string connectionString, string sql)
    {
        await using var connection = new NpgsqlConnection(connectionString);
        await connection.OpenAsync();
        await using var command = new NpgsqlCommand(sql, connection);
        await command.ExecuteNonQueryAsync();
    }
}
