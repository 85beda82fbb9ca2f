using System.Data.Common;
using System.Net;
using System.Text;
using System.Text.Json.Nodes;
using CdsNatremia.Audit.Pseudonyms;
using CdsNatremia.Audit.Records;
using CdsNatremia.Audit.Reports;
using CdsNatremia.Audit.Storage;
using CdsNatremia.Fhir.Knowledge;
using CdsNatremia.Scenarios;
using CdsNatremia.Service.Tests.Support;
using Microsoft.AspNetCore.Hosting;
using Microsoft.AspNetCore.TestHost;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.DependencyInjection.Extensions;

namespace CdsNatremia.Service.Tests.Audit;

/// <summary>The audit trail through the real service: what a hook answer records, and that nothing is lost or leaked.</summary>
public sealed class AuditTrailTests
{
    private static CancellationToken None => CancellationToken.None;

    [Fact]
    public async Task HookCall_EachCard_RecordedWithEveryField()
    {
        await using var factory = new NatremiaFactory();
        var client = factory.CreateClient();
        var request = FeedbackCalls.StaleRequest("01");
        var cards = await HookCalls.CardsAsync(await HookCalls.PostAsync(client, FeedbackCalls.ChartReview, request));
        var card = cards[0]!;

        var record = await FeedbackCalls.Store(factory).FindCardAsync(Guid.Parse((string)card["uuid"]!), None);

        Assert.NotNull(record);
        Assert.Equal(FeedbackCalls.ChartReview, record.ServiceId);
        Assert.Equal("patient-view", record.Hook);
        Assert.Equal(Guid.Parse((string)request["hookInstance"]!), record.HookInstance);
        Assert.Contains("sodium.severity", record.RuleIds);
        Assert.Equal(factory.Services.GetRequiredService<LoadedKnowledge>().Base.Version, record.KnowledgeVersion);
        Assert.StartsWith("0.1.0", record.SoftwareVersion, StringComparison.Ordinal);
        Assert.Equal((string)card["indicator"]!, record.Indicator);
        Assert.Equal((string)card["summary"]!, record.Summary);
        Assert.Equal((string)card["source"]!["topic"]!["code"]!, record.Topic);
        Assert.Contains("Observation/s01-na-2", record.ResourcesUsed);
        Assert.DoesNotContain(record.ResourcesUsed, r => r.StartsWith("Patient/", StringComparison.Ordinal));
        Assert.NotEmpty(record.SuggestionUuids);
        Assert.Equal(
            card["suggestions"]!.AsArray().Select(s => Guid.Parse((string)s!["uuid"]!)).Order(),
            record.SuggestionUuids.Values.Order());
        Assert.Equal(factory.Clock.GetUtcNow(), record.IssuedAt);
        Assert.Equal(factory.Services.GetRequiredService<PatientPseudonymizer>().Pseudonym("s01-pt"), record.PatientPseudonym);
        Assert.Equal((long)cards.Count, (await FeedbackCalls.Store(factory).CountAsync(None)).Cards);
    }

    [Fact]
    public async Task HookCalls_ClearPatientId_NowhereInTheDatabaseFilesOrTables()
    {
        await using var factory = new NatremiaFactory();
        var client = factory.CreateClient();
        var scenarios = new[] { "01", "02", "04", "12" };
        foreach (var id in scenarios)
        {
            var cards = await FeedbackCalls.IssueAsync(client, id);
            var entry = FeedbackCalls.Overridden((string)cards[0]!["uuid"]!, factory.Clock.GetUtcNow());
            entry["overrideReason"]!["userComment"] = "Reviewed with the team.";
            Assert.Equal(HttpStatusCode.OK, (await FeedbackCalls.PostAsync(client, FeedbackCalls.Body(entry))).StatusCode);
        }

        var patientIds = scenarios.Select(id => ScenarioLibrary.Find(id)!.PatientId).ToList();
        var store = (SqliteAuditStore)FeedbackCalls.Store(factory);
        Assert.StartsWith(factory.AuditDataDirectory, store.Path, StringComparison.Ordinal);
        var bytes = Directory.GetFiles(factory.AuditDataDirectory).SelectMany(File.ReadAllBytes).ToArray();
        var values = await store.DumpAllTextAsync(None);

        Assert.Equal(scenarios.Length, values.Count(v => v == "Reviewed with the team."));
        foreach (var patientId in patientIds)
        {
            Assert.True(bytes.AsSpan().IndexOf(Encoding.UTF8.GetBytes(patientId)) < 0, $"{patientId} found in the audit files");
            Assert.DoesNotContain(values, v => v.Contains(patientId, StringComparison.Ordinal));
        }
    }

    [Fact]
    public async Task Concurrent_200HookCallsAnd200FeedbackPosts_AllPresentExactlyOnce()
    {
        await using var factory = new NatremiaFactory();
        var client = factory.CreateClient();
        var scenario = ScenarioLibrary.Find("01")!;
        var first = await Task.WhenAll(Enumerable.Range(0, 200).Select(_ => HookCalls.RunAsync(client, scenario)));
        var now = factory.Clock.GetUtcNow();

        var hookCalls = Enumerable.Range(0, 200).Select(_ => HookCalls.RunAsync(client, scenario)).ToList();
        var bodies = first.Select(cards => FeedbackCalls.Body(FeedbackCalls.Overridden((string)cards[0]!["uuid"]!, now))).ToList();
        var feedback = bodies.Select(b => FeedbackCalls.PostAsync(client, b)).Concat(bodies.Select(b => FeedbackCalls.PostAsync(client, b))).ToList();
        var second = await Task.WhenAll(hookCalls);
        var answers = await Task.WhenAll(feedback);

        Assert.All(answers, a => Assert.Equal(HttpStatusCode.OK, a.StatusCode));
        var issued = first.Concat(second).SelectMany(c => c).Select(c => Guid.Parse((string)c!["uuid"]!)).ToList();
        Assert.Equal(issued.Count, issued.Distinct().Count());
        var store = FeedbackCalls.Store(factory);
        Assert.Equal((issued.Count, 200L), await store.CountAsync(None));
        foreach (var uuid in issued)
        {
            Assert.NotNull(await store.FindCardAsync(uuid, None));
        }
    }

    [Fact]
    public async Task AuditStoreDown_503AndNoCardsShown()
    {
        await using var factory = new NatremiaFactory();
        using var broken = factory.WithWebHostBuilder(b => b.ConfigureTestServices(s =>
        {
            s.RemoveAll<IAuditStore>();
            s.AddSingleton<IAuditStore, UnavailableStore>();
        }));

        var response = await HookCalls.PostAsync(broken.CreateClient(), FeedbackCalls.ChartReview, HookCalls.Request(ScenarioLibrary.Find("01")!));

        Assert.Equal(HttpStatusCode.ServiceUnavailable, response.StatusCode);
        Assert.DoesNotContain("\"cards\"", await response.Content.ReadAsStringAsync(), StringComparison.Ordinal);
    }

    [Fact]
    public async Task AuditStoreDown_Feedback503()
    {
        await using var factory = new NatremiaFactory();
        using var broken = factory.WithWebHostBuilder(b => b.ConfigureTestServices(s =>
        {
            s.RemoveAll<IAuditStore>();
            s.AddSingleton<IAuditStore, UnavailableStore>();
        }));

        var body = FeedbackCalls.Body(FeedbackCalls.Overridden(Guid.NewGuid().ToString(), factory.Clock.GetUtcNow()));
        Assert.Equal(HttpStatusCode.ServiceUnavailable, (await FeedbackCalls.PostAsync(broken.CreateClient(), body)).StatusCode);
    }

    private sealed class UnavailableException() : DbException("The audit database is unreachable.");

    private sealed class UnavailableStore : IAuditStore
    {
        public string Kind => "unavailable";

        public Task InitializeAsync(CancellationToken cancellationToken) => Task.CompletedTask;

        public Task RecordIssuedAsync(IReadOnlyList<IssuedCardRecord> cards, CancellationToken cancellationToken) => throw new UnavailableException();

        public Task<FeedbackResult> RecordFeedbackAsync(string serviceId, IReadOnlyList<FeedbackEntry> entries, DateTimeOffset receivedAt, CancellationToken cancellationToken) => throw new UnavailableException();

        public Task<DateTimeOffset?> LastReviewedAsync(string patientPseudonym, string fingerprint, DateTimeOffset since, CancellationToken cancellationToken) => throw new UnavailableException();

        public Task<IssuedCardRecord?> FindCardAsync(Guid cardUuid, CancellationToken cancellationToken) => throw new UnavailableException();

        public Task<IReadOnlyList<FeedbackEntry>> FindFeedbackAsync(Guid cardUuid, CancellationToken cancellationToken) => throw new UnavailableException();

        public Task<OverrideReport> ReportAsync(DateTimeOffset from, DateTimeOffset to, string? serviceId, bool includeTestTraffic, CancellationToken cancellationToken) => throw new UnavailableException();

        public Task<int> PurgeAsync(DateTimeOffset issuedBefore, CancellationToken cancellationToken) => Task.FromResult(0);

        public Task<(long Cards, long Feedback)> CountAsync(CancellationToken cancellationToken) => throw new UnavailableException();

        public ValueTask DisposeAsync() => ValueTask.CompletedTask;
    }
}
