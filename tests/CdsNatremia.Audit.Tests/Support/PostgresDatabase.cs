using Npgsql;

namespace CdsNatremia.Audit.Tests.Support;

/// <summary>
/// The PostgreSQL half of the store suite runs when NATREMIA_TEST_POSTGRES holds a connection string (.ci/run sets
/// it after starting a local cluster) and is reported as skipped otherwise. Each store gets its own fresh schema,
/// dropped afterwards, so tests never see each other's rows.
/// </summary>
public static class PostgresDatabase
{
    public const string Variable = "NATREMIA_TEST_POSTGRES";

    public static string? ConnectionString => Environment.GetEnvironmentVariable(Variable) is { Length: > 0 } value ? value : null;

    /// <summary>Skips the calling test when no PostgreSQL is configured.</summary>
    public static string Require()
    {
        Skip.If(ConnectionString is null, $"PostgreSQL not configured: set {Variable} to a connection string (.ci/run does) to run the PostgreSQL half of the audit suite.");
        return ConnectionString!;
    }

    /// <summary>Creates a fresh schema and returns a connection string whose search path is it.</summary>
    public static async Task<(string ConnectionString, string Schema)> CreateSchemaAsync()
    {
        var baseString = Require();
        var schema = "audit_test_" + Guid.NewGuid().ToString("N")[..12];
        await using (var connection = new NpgsqlConnection(baseString))
        {
            await connection.OpenAsync();
            await using var command = new NpgsqlCommand($"CREATE SCHEMA {schema}", connection);
            await command.ExecuteNonQueryAsync();
        }

        var builder = new NpgsqlConnectionStringBuilder(baseString) { SearchPath = schema };
        return (builder.ToString(), schema);
    }

    public static async Task DropSchemaAsync(string schema)
    {
        await using var connection = new NpgsqlConnection(ConnectionString);
        await connection.OpenAsync();
        await using var command = new NpgsqlCommand($"DROP SCHEMA IF EXISTS {schema} CASCADE", connection);
        await command.ExecuteNonQueryAsync();
    }
}
