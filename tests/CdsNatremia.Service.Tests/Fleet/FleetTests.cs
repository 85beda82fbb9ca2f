using System.Globalization;
using System.Net;
using System.Net.Http.Headers;
using System.Security.Cryptography;
using System.Text;
using System.Text.Json;
using CdsNatremia.Scenarios;
using CdsNatremia.Service.Tests.Support;
using Npgsql;
using Xunit.Abstractions;

namespace CdsNatremia.Service.Tests.Fleet;

/// <summary>
/// Three real service processes sharing one PostgreSQL audit store behind HAProxy, all on loopback. Load goes through
/// HAProxy; one instance is killed mid-run. Checked: every answered call has exactly its audit records, HAProxy's
/// health checks take the dead instance out, feedback sent to one instance lands on cards another issued, and the
/// override report of any instance covers the cards of all three. The figures are printed (and written to
/// $NATREMIA_FLEET_REPORT when set; <c>bash .ci/fleet.sh</c> runs this test alone and prints them).
/// Needs PostgreSQL (NATREMIA_TEST_POSTGRES, set by .ci/postgres.sh) and HAProxy; skipped with the reason without them.
/// </summary>
[Collection(FleetCollection.Name)]
public sealed class FleetTests(ITestOutputHelper output)
{
    private const string ServicePath = "/cds-services/natremia-chart-review";

    [SkippableFact]
    public async Task Fleet_ThreeInstancesBehindHaproxyOneKilled_AuditCompleteFeedbackCrossesReportCoversAll()
    {
        var connection = Environment.GetEnvironmentVariable("NATREMIA_TEST_POSTGRES");
        Skip.If(string.IsNullOrEmpty(connection), "NATREMIA_TEST_POSTGRES is not set (run .ci/postgres.sh): the fleet needs a shared PostgreSQL audit store.");
        Skip.If(HaproxyProcess.Executable() is null, "HAProxy is not installed (apt-get install haproxy; .ci/run installs it).");

        var figures = new List<string>();
        void Figure(string text)
        {
            figures.Add(text);
            output.WriteLine(text);
        }

        var schema = "fleet_" + Guid.NewGuid().ToString("N")[..12];
        await using var database = NpgsqlDataSource.Create(connection!);
        await Execute(database, $"CREATE SCHEMA {schema}");
        using var keys = new TestClientKeys();
        try
        {
            var shared = keys.InlineSettings();
            shared["Natremia:Audit:PostgresConnectionString"] = new NpgsqlConnectionStringBuilder(connection) { SearchPath = schema }.ConnectionString;
            shared["Natremia:Audit:PseudonymKey"] = Convert.ToBase64String(RandomNumberGenerator.GetBytes(36)); // made per run, never stored
            var adminKey = Convert.ToBase64String(RandomNumberGenerator.GetBytes(36));
            shared["Natremia:Audit:AdminApiKey"] = adminKey;
            shared["Natremia:Shutdown:ReadinessDelay"] = "00:00:01";

            var names = new[] { "s1", "s2", "s3" };
            var instances = new Dictionary<string, ServiceProcess>(StringComparer.Ordinal);
            try
            {
                foreach (var name in names)
                {
                    var settings = new Dictionary<string, string?>(shared) { ["Natremia:Audit:DataDirectory"] = Path.Combine(Path.GetTempPath(), "natremia-fleet", schema, name) };
                    instances[name] = ServiceProcess.Start(settings);
                }

                await Task.WhenAll(instances.Values.Select(i => i.WaitReadyAsync(TimeSpan.FromSeconds(120))));
                using var haproxy = HaproxyProcess.Start(names.Select(n => (n, instances[n].Port)).ToList());
                Assert.True(await haproxy.WaitForAsync(s => s.Count == 3 && s.Values.All(v => v == "UP"), TimeSpan.FromSeconds(30)), "HAProxy did not see the three instances up");

                // Load through HAProxy, bounded by calls and time; one instance killed once 60 calls were answered.
                var load = new HookLoad(path => keys.Token(path, DateTimeOffset.UtcNow));
                using var bound = new CancellationTokenSource(TimeSpan.FromSeconds(45));
                var running = load.RunAsync(haproxy.BaseAddress, workers: 4, maxCalls: 400, stopWhenRefused: false, bound.Token);
                while (load.Answered < 60 && !running.IsCompleted)
                {
                    await Task.Delay(20);
                }

                instances["s2"].KillNow();
                load.Mark();
                var takenOut = await haproxy.WaitForAsync(s => s.GetValueOrDefault("s2", "").StartsWith("DOWN", StringComparison.Ordinal), TimeSpan.FromSeconds(20));
                load.Mark();
                await running;
                var states = await haproxy.ServerStatesAsync();
                var results = load.Results;
                var answered = results.Where(r => r.Status == 200 && !r.Cut).ToList();
                var afterDown = results.Where(r => r.Phase >= 2).ToList();
                var inFlightAtKill = results.Where(r => r.Phase == 1).ToList();
                Figure($"load: {results.Count} calls through HAProxy, {answered.Count} answered, {results.Count(r => r.Status is not (0 or 200))} error answers, {results.Count(r => r.Status == 0)} without answer, {results.Count(r => r.Cut)} cut");
                Figure("answered per instance: " + string.Join(", ", answered.GroupBy(r => r.Instance ?? "?").OrderBy(g => g.Key, StringComparer.Ordinal).Select(g => $"{g.Key} {g.Count()}")));
                Figure($"HAProxy after the kill of s2: {string.Join(", ", states.OrderBy(s => s.Key, StringComparer.Ordinal).Select(s => $"{s.Key} {s.Value}"))}; {inFlightAtKill.Count(r => r.Status != 200 || r.Cut)} of {inFlightAtKill.Count} calls sent between the kill and that not answered; {afterDown.Count} calls after it was marked down, {afterDown.Count(r => r.Status != 200 || r.Cut)} of them not answered, {afterDown.Count(r => r.Instance == "s2")} sent to s2");

                Assert.True(takenOut, "HAProxy's health checks did not take the killed instance out");
                Assert.StartsWith("DOWN", states["s2"], StringComparison.Ordinal);
                Assert.Equal("UP", states["s1"]);
                Assert.Equal("UP", states["s3"]);
                Assert.NotEmpty(afterDown);
                Assert.All(afterDown, r => Assert.True(r.Status == 200 && !r.Cut && r.Instance != "s2", $"after s2 was marked down: HTTP {r.Status} from {r.Instance}"));
                Assert.Equal(names, answered.Select(r => r.Instance!).Distinct().Order(StringComparer.Ordinal)); // all three answered before the kill

                // Every answered call: exactly its cards in the shared audit trail, once each.
                var audited = await AuditedCards(database, schema);
                var missing = answered.Count(r => !audited.TryGetValue(r.HookInstance, out var cards) || !cards.Order().SequenceEqual(r.CardUuids.Order()));
                var totalRecords = audited.Values.Sum(c => c.Count);
                Figure($"audit: {totalRecords} issued-card records for {audited.Count} calls; answered calls without exactly their records: {missing}");
                Assert.Equal(0, missing);
                Assert.All(answered, r => Assert.NotEmpty(r.CardUuids));

                // Feedback sent straight to one instance about cards another instance issued (s2's cards too).
                var live = new[] { "s1", "s3" };
                var feedbackSent = 0;
                var used = new HashSet<Guid>();
                foreach (var (to, from) in new[] { ("s1", "s3"), ("s3", "s1"), ("s1", "s2"), ("s3", "s2") })
                {
                    var card = answered.Where(r => r.Instance == from).Select(r => r.CardUuids[0]).First(used.Add);
                    var body = FeedbackCalls.Body(FeedbackCalls.Overridden(card.ToString(), DateTimeOffset.UtcNow.AddSeconds(-1)));
                    var response = await SendAsync(instances[to], keys, ServicePath + "/feedback", body.ToJsonString());
                    Assert.True(response.StatusCode == HttpStatusCode.OK, $"feedback to {to} on a card of {from}: HTTP {(int)response.StatusCode} {await response.Content.ReadAsStringAsync()}");
                    Assert.Equal(1L, await Scalar(database, $"SELECT COUNT(*) FROM {schema}.feedback WHERE card_uuid = @c AND outcome = 'overridden'", card.ToString()));
                    feedbackSent++;
                }

                Figure($"feedback: {feedbackSent} overrides sent to one instance about cards another issued, all stored on those cards");

                // The override report, asked of each live instance, counts the cards of all three.
                var ruleCounts = await RuleCounts(database, schema);
                foreach (var name in live)
                {
                    var report = await ReportAsync(instances[name], adminKey);
                    var shown = report.RootElement.GetProperty("rules").EnumerateArray().ToDictionary(r => r.GetProperty("ruleId").GetString()!, r => r.GetProperty("shown").GetInt32(), StringComparer.Ordinal);
                    var overridden = report.RootElement.GetProperty("rules").EnumerateArray().Max(r => r.GetProperty("overridden").GetInt32());
                    Assert.Equal(ruleCounts.OrderBy(k => k.Key, StringComparer.Ordinal), shown.Where(k => k.Value > 0).OrderBy(k => k.Key, StringComparer.Ordinal));
                    Assert.Equal(feedbackSent, overridden);
                    Figure($"override report from {name}: {shown.Count} rules, {shown.Values.Max()} cards shown for the most frequent rule (the audit holds {audited.Count} calls of s1, s2 and s3), {overridden} overridden");
                }

                // A token used once on one instance, sent again to another.
                var token = keys.Token(ServicePath, DateTimeOffset.UtcNow);
                var first = await SendAsync(instances["s1"], keys, ServicePath, Request(), token);
                var again = await SendAsync(instances["s3"], keys, ServicePath, Request(), token);
                Figure($"replay: token used on s1 (HTTP {(int)first.StatusCode}), sent again to s3: HTTP {(int)again.StatusCode}");
                Assert.Equal(HttpStatusCode.OK, first.StatusCode);
                Assert.Equal(HttpStatusCode.Unauthorized, again.StatusCode); // the shared replay store in PostgreSQL (docs/security.md)
            }
            finally
            {
                foreach (var instance in instances.Values)
                {
                    instance.Dispose();
                }

                var report = Environment.GetEnvironmentVariable("NATREMIA_FLEET_REPORT");
                if (!string.IsNullOrEmpty(report))
                {
                    await File.WriteAllLinesAsync(report, figures);
                }
            }
        }
        finally
        {
            await Execute(database, $"DROP SCHEMA {schema} CASCADE");
        }
    }

    private static string Request()
        => HookRequestBuilder.Build(ScenarioLibrary.Find("01")!, "patient-view", TimeSpan.Zero, Guid.NewGuid()).ToJsonString();

    private static async Task<HttpResponseMessage> SendAsync(ServiceProcess instance, TestClientKeys keys, string path, string body, string? token = null)
    {
        using var client = new HttpClient { BaseAddress = instance.BaseAddress, Timeout = TimeSpan.FromSeconds(30) };
        using var request = new HttpRequestMessage(HttpMethod.Post, path) { Content = new StringContent(body, Encoding.UTF8, "application/json") };
        request.Headers.Authorization = new AuthenticationHeaderValue("Bearer", token ?? keys.Token(path, DateTimeOffset.UtcNow));
        var response = await client.SendAsync(request);
        await response.Content.LoadIntoBufferAsync();
        return response;
    }

    private static async Task<JsonDocument> ReportAsync(ServiceProcess instance, string adminKey)
    {
        using var client = new HttpClient { BaseAddress = instance.BaseAddress, Timeout = TimeSpan.FromSeconds(30) };
        var today = DateTime.UtcNow.Date;
        using var request = new HttpRequestMessage(HttpMethod.Get, string.Create(CultureInfo.InvariantCulture, $"/admin/reports/overrides?from={today.AddDays(-1):yyyy-MM-dd}&to={today.AddDays(1):yyyy-MM-dd}"));
        request.Headers.Add("X-Natremia-Admin-Key", adminKey);
        using var response = await client.SendAsync(request);
        var text = await response.Content.ReadAsStringAsync();
        Assert.True(response.StatusCode == HttpStatusCode.OK, text);
        return JsonDocument.Parse(text);
    }

    private static async Task Execute(NpgsqlDataSource database, string sql)
    {
        await using var command = database.CreateCommand(sql);
        await command.ExecuteNonQueryAsync();
    }

    private static async Task<long> Scalar(NpgsqlDataSource database, string sql, string parameter)
    {
        await using var command = database.CreateCommand(sql);
        command.Parameters.AddWithValue("c", parameter);
        return Convert.ToInt64(await command.ExecuteScalarAsync(), CultureInfo.InvariantCulture);
    }

    private static async Task<Dictionary<Guid, List<Guid>>> AuditedCards(NpgsqlDataSource database, string schema)
    {
        var cards = new Dictionary<Guid, List<Guid>>();
        await using var command = database.CreateCommand($"SELECT hook_instance, card_uuid FROM {schema}.issued_card");
        await using var reader = await command.ExecuteReaderAsync();
        while (await reader.ReadAsync())
        {
            var hook = Guid.Parse(reader.GetString(0));
            if (!cards.TryGetValue(hook, out var list))
            {
                cards[hook] = list = [];
            }

            list.Add(Guid.Parse(reader.GetString(1)));
        }

        return cards;
    }

    private static async Task<Dictionary<string, int>> RuleCounts(NpgsqlDataSource database, string schema)
    {
        var counts = new Dictionary<string, int>(StringComparer.Ordinal);
        await using var command = database.CreateCommand($"SELECT rule_id, COUNT(*) FROM {schema}.card_rule GROUP BY rule_id");
        await using var reader = await command.ExecuteReaderAsync();
        while (await reader.ReadAsync())
        {
            counts[reader.GetString(0)] = Convert.ToInt32(reader.GetInt64(1));
        }

        return counts;
    }
}

/// <summary>The fleet test runs alone: three service processes and HAProxy are enough load for two cores.</summary>
[CollectionDefinition(Name, DisableParallelization = true)]
public sealed class FleetCollection
{
    public const string Name = "Fleet (alone)";
}
