using System.Text;
using BenchmarkDotNet.Attributes;
using CdsNatremia.Audit.Records;
using CdsNatremia.Audit.Reports;
using CdsNatremia.Audit.Storage;
using CdsNatremia.Scenarios;
using Microsoft.AspNetCore.Hosting;
using Microsoft.AspNetCore.Mvc.Testing;
using Microsoft.AspNetCore.TestHost;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.DependencyInjection.Extensions;

namespace CdsNatremia.Audit.Benchmarks;

/// <summary>
/// A whole patient-view call through the in-memory host (parse, read prefetch, decide, write cards), with the real
/// SQLite audit and with a store that writes nothing: the difference is what the audit adds to the answer time.
/// </summary>
[InProcess]
[MemoryDiagnoser]
[MinIterationCount(8)]
[MaxIterationCount(20)]
public class HookAnswerBenchmarks
{
    private WebApplicationFactory<Program> _factory = null!;
    private HttpClient _client = null!;
    private string _body = string.Empty;
    private string _folder = string.Empty;

    [Params(true, false)]
    public bool Audit { get; set; }

    [GlobalSetup]
    public void Setup()
    {
        _folder = Path.Combine(Path.GetTempPath(), "natremia-bench", Guid.NewGuid().ToString("N"));
        // The factory looks for the service's folder relative to the working directory; name it from the checkout.
        var root = new DirectoryInfo(AppContext.BaseDirectory);
        while (root is not null && !File.Exists(Path.Combine(root.FullName, "CdsNatremia.sln")))
        {
            root = root.Parent;
        }

        Environment.SetEnvironmentVariable(
            "ASPNETCORE_TEST_CONTENTROOT_CDSNATREMIA_SERVICE",
            Path.Combine(root?.FullName ?? ".", "src", "CdsNatremia.Service"));
        _factory = new WebApplicationFactory<Program>().WithWebHostBuilder(b =>
        {
            b.UseEnvironment("Development");
            b.UseSetting("Natremia:Audit:DataDirectory", _folder);
            if (!Audit)
            {
                b.ConfigureTestServices(s =>
                {
                    s.RemoveAll<IAuditStore>();
                    s.AddSingleton<IAuditStore, NoStore>();
                });
            }
        });
        _client = _factory.CreateClient();
        _body = HookRequestBuilder.Build(ScenarioLibrary.Find("01")!, "patient-view", DateTimeOffset.UtcNow - ScenarioLibrary.Anchor, Guid.NewGuid()).ToJsonString();
    }

    [GlobalCleanup]
    public void Cleanup()
    {
        _client.Dispose();
        _factory.Dispose();
        if (Directory.Exists(_folder))
        {
            Directory.Delete(_folder, recursive: true);
        }
    }

    [Benchmark(Description = "patient-view call, scenario 01")]
    public async Task<int> PatientView()
    {
        using var response = await _client.PostAsync("/cds-services/natremia-chart-review", new StringContent(_body, Encoding.UTF8, "application/json"));
        response.EnsureSuccessStatusCode();
        return (await response.Content.ReadAsByteArrayAsync()).Length;
    }

    /// <summary>A store that keeps nothing: the baseline without audit.</summary>
    private sealed class NoStore : IAuditStore
    {
        public string Kind => "none";

        public Task InitializeAsync(CancellationToken cancellationToken) => Task.CompletedTask;

        public Task RecordIssuedAsync(IReadOnlyList<IssuedCardRecord> cards, CancellationToken cancellationToken) => Task.CompletedTask;

        public Task<FeedbackResult> RecordFeedbackAsync(string serviceId, IReadOnlyList<FeedbackEntry> entries, DateTimeOffset receivedAt, CancellationToken cancellationToken)
            => Task.FromResult<FeedbackResult>(new FeedbackResult.Stored(entries.Count, 0));

        public Task<DateTimeOffset?> LastReviewedAsync(string patientPseudonym, string fingerprint, DateTimeOffset since, CancellationToken cancellationToken) => Task.FromResult<DateTimeOffset?>(null);

        public Task<IssuedCardRecord?> FindCardAsync(Guid cardUuid, CancellationToken cancellationToken) => Task.FromResult<IssuedCardRecord?>(null);

        public Task<IReadOnlyList<FeedbackEntry>> FindFeedbackAsync(Guid cardUuid, CancellationToken cancellationToken) => Task.FromResult<IReadOnlyList<FeedbackEntry>>([]);

        public Task<OverrideReport> ReportAsync(DateTimeOffset from, DateTimeOffset to, string? serviceId, bool includeTestTraffic, CancellationToken cancellationToken)
            => Task.FromResult(new OverrideReport(from, to, serviceId, 1, []));

        public Task<int> PurgeAsync(DateTimeOffset issuedBefore, CancellationToken cancellationToken) => Task.FromResult(0);

        public Task<(long Cards, long Feedback)> CountAsync(CancellationToken cancellationToken) => Task.FromResult((0L, 0L));

        public ValueTask DisposeAsync() => ValueTask.CompletedTask;
    }
}
