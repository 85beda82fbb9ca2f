using System.Net;
using CdsNatremia.Audit.Storage;
using CdsNatremia.Audit.Tests.Support;
using CdsNatremia.Scenarios;
using CdsNatremia.Service.Tests.Support;
using Microsoft.AspNetCore.TestHost;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.DependencyInjection.Extensions;

namespace CdsNatremia.Service.Tests.Audit;

/// <summary>
/// Group commit through the real service: answers wait for their own record, a full write queue refuses with 503 and
/// Retry-After instead of dropping a record, and the per-answer mode (GroupCommit false) still records every answer.
/// The store's writes are held at a gate, so what is queued is known exactly (no timing decides the outcome).
/// </summary>
public sealed class GroupCommitTests : IDisposable
{
    private static CancellationToken None => CancellationToken.None;

    private readonly string _folder = Path.Combine(Path.GetTempPath(), "natremia-group-commit-tests", Guid.NewGuid().ToString("N"));

    [Fact]
    public async Task HookCall_WriteQueueFull_503WithRetryAfterAndEveryAcceptedAnswerRecorded()
    {
        await using var inner = new SqliteAuditStore(Path.Combine(_folder, "audit.db"));
        var gated = new GatedStore(inner);
        await using var factory = NatremiaFactory.With(new()
        {
            ["Natremia:Audit:WriteQueueCapacity"] = "1",
            ["Natremia:Audit:MaxAnswersPerCommit"] = "1",
            ["Natremia:Audit:QueueFullRetryAfterSeconds"] = "2",
        });
        using var host = factory.WithWebHostBuilder(b => b.ConfigureTestServices(s =>
        {
            s.RemoveAll<IAuditStore>();
            s.AddSingleton<IAuditStore>(gated);
        }));
        var client = host.CreateClient();
        var scenario = ScenarioLibrary.Find("01")!;

        gated.Hold();
        var first = HookCalls.PostAsync(client, FeedbackCalls.ChartReview, HookCalls.Request(scenario));
        await gated.Entered.WaitAsync(TimeSpan.FromMinutes(2)); // the writer holds the first answer's records
        var secondRequest = HookCalls.Request(scenario);
        var second = HookCalls.PostAsync(client, FeedbackCalls.ChartReview, secondRequest);
        await WaitUntilAsync(() => host.Services.GetRequiredService<AuditWriteQueue>().Waiting == 1); // queued: the queue is full
        var refusedRequest = HookCalls.Request(scenario);

        using var refused = await HookCalls.PostAsync(client, FeedbackCalls.ChartReview, refusedRequest);

        Assert.Equal(HttpStatusCode.ServiceUnavailable, refused.StatusCode);
        Assert.Equal(TimeSpan.FromSeconds(2), refused.Headers.RetryAfter?.Delta);
        var problem = await refused.Content.ReadAsStringAsync();
        Assert.Contains("Audit trail busy", problem, StringComparison.Ordinal);
        Assert.DoesNotContain("\"cards\"", problem, StringComparison.Ordinal);
        Assert.False(first.IsCompleted); // still waiting for its record: nothing is answered before it is durable
        Assert.False(second.IsCompleted);

        gated.Release();
        var firstCards = await HookCalls.CardsAsync(await first);
        var secondCards = await HookCalls.CardsAsync(await second);
        var answered = firstCards.Concat(secondCards).Select(c => Guid.Parse((string)c!["uuid"]!)).ToList();
        Assert.NotEmpty(answered);
        foreach (var uuid in answered)
        {
            Assert.NotNull(await inner.FindCardAsync(uuid, None));
        }

        Assert.Equal((long)answered.Count, (await inner.CountAsync(None)).Cards); // the refused answer left no record
        var refusedInstance = Guid.Parse((string)refusedRequest["hookInstance"]!);
        var secondInstance = Guid.Parse((string)secondRequest["hookInstance"]!);
        Assert.Equal(secondInstance, (await inner.FindCardAsync(Guid.Parse((string)secondCards[0]!["uuid"]!), None))!.HookInstance);
        Assert.NotEqual(refusedInstance, secondInstance);
    }

    [Fact]
    public async Task HookCalls_GroupCommitOff_EachAnswerRecordedInItsOwnTransaction()
    {
        await using var inner = new SqliteAuditStore(Path.Combine(_folder, "audit.db"));
        var gated = new GatedStore(inner);
        await using var factory = NatremiaFactory.With(new() { ["Natremia:Audit:GroupCommit"] = "false" });
        using var host = factory.WithWebHostBuilder(b => b.ConfigureTestServices(s =>
        {
            s.RemoveAll<IAuditStore>();
            s.AddSingleton<IAuditStore>(gated);
        }));
        var client = host.CreateClient();

        var answers = await Task.WhenAll(Enumerable.Range(0, 4).Select(async _ =>
            await HookCalls.CardsAsync(await HookCalls.PostAsync(client, FeedbackCalls.ChartReview, HookCalls.Request(ScenarioLibrary.Find("01")!)))));

        Assert.Null(host.Services.GetService<AuditWriteQueue>());
        Assert.Equal(answers.Select(a => a.Count).Order(), gated.Calls.Order()); // one write per answer, with its cards
        Assert.Equal((long)answers.Sum(a => a.Count), (await inner.CountAsync(None)).Cards);
    }

    private static async Task WaitUntilAsync(Func<bool> condition)
    {
        using var bound = new CancellationTokenSource(TimeSpan.FromMinutes(2)); // a bound for a stuck test, not a timing assertion
        while (!condition())
        {
            await Task.Delay(10, bound.Token);
        }
    }

    public void Dispose()
    {
        try
        {
            Directory.Delete(_folder, recursive: true);
        }
        catch (IOException)
        {
            // A temp folder left behind is harmless.
        }
    }
}
