using CdsNatremia.Audit.Pseudonyms;
using CdsNatremia.Audit.Records;
using CdsNatremia.Audit.Storage;
using CdsNatremia.Audit.Tests.Support;

namespace CdsNatremia.Audit.Tests.Storage;

/// <summary>
/// The one suite every store must pass. SQLite runs it always; PostgreSQL when NATREMIA_TEST_POSTGRES is set
/// (skipped with the reason otherwise).
/// </summary>
public abstract class AuditStoreContract
{
    /// <summary>A fresh, initialised store and what to do when the test is over.</summary>
    protected sealed class Scope(SqlAuditStore store, Func<ValueTask> cleanup) : IAsyncDisposable
    {
        public SqlAuditStore Store { get; } = store;

        public async ValueTask DisposeAsync()
        {
            await Store.DisposeAsync();
            await cleanup();
        }
    }

    protected abstract Task<Scope> OpenAsync();

    private static CancellationToken None => CancellationToken.None;

    [SkippableFact]
    public async Task InitializeAsync_RunTwice_SchemaAtCurrentVersionOnce()
    {
        await using var scope = await OpenAsync();
        await scope.Store.InitializeAsync(None);
        // One row per migration step (each applied once), the last at the current version.
        Assert.Equal((long)AuditSchema.Migrations.Count, Convert.ToInt64(await scope.Store.QueryScalarAsync("SELECT COUNT(*) FROM schema_version", None), System.Globalization.CultureInfo.InvariantCulture));
        Assert.Equal((long)AuditSchema.CurrentVersion, Convert.ToInt64(await scope.Store.QueryScalarAsync("SELECT MAX(version) FROM schema_version", None), System.Globalization.CultureInfo.InvariantCulture));
    }

    [SkippableFact]
    public async Task LastReviewedAsync_OverriddenCard_OutcomeTimeForTheSamePatientAndFingerprintOnly()
    {
        await using var scope = await OpenAsync();
        var card = Some.Card() with { FindingsFingerprint = "fingerprint-1" };
        var since = Some.Now.AddHours(-24);
        await scope.Store.RecordIssuedAsync([card], None);
        Assert.Null(await scope.Store.LastReviewedAsync(card.PatientPseudonym, "fingerprint-1", since, None)); // issued, not answered

        var at = Some.Now.AddMinutes(5);
        await scope.Store.RecordFeedbackAsync(card.ServiceId, [Some.Overridden(card, at: at)], at, None);

        Assert.Equal(at, await scope.Store.LastReviewedAsync(card.PatientPseudonym, "fingerprint-1", since, None));
        Assert.Null(await scope.Store.LastReviewedAsync(card.PatientPseudonym, "fingerprint-2", since, None)); // other findings
        Assert.Null(await scope.Store.LastReviewedAsync(new string('0', 64), "fingerprint-1", since, None)); // other patient
        Assert.Null(await scope.Store.LastReviewedAsync(card.PatientPseudonym, "fingerprint-1", at.AddMinutes(1), None)); // before the period
    }

    [SkippableFact]
    public async Task LastReviewedAsync_AcceptedThenPurged_NullAfterThePurge()
    {
        await using var scope = await OpenAsync();
        var card = Some.Card(issuedAt: Some.Now.AddDays(-800)) with { FindingsFingerprint = "fingerprint-a" };
        await scope.Store.RecordIssuedAsync([card], None);
        var at = card.IssuedAt.AddMinutes(2);
        await scope.Store.RecordFeedbackAsync(card.ServiceId, [Some.Accepted(card, at)], at, None);
        Assert.Equal(at, await scope.Store.LastReviewedAsync(card.PatientPseudonym, "fingerprint-a", at.AddDays(-1), None));

        await scope.Store.PurgeAsync(Some.Now.AddDays(-730), None);

        Assert.Null(await scope.Store.LastReviewedAsync(card.PatientPseudonym, "fingerprint-a", at.AddDays(-1), None));
        Assert.Equal(0L, Convert.ToInt64(await scope.Store.QueryScalarAsync("SELECT COUNT(*) FROM card_fingerprint", None), System.Globalization.CultureInfo.InvariantCulture));
        Assert.Equal(0L, Convert.ToInt64(await scope.Store.QueryScalarAsync("SELECT COUNT(*) FROM reviewed_fingerprint", None), System.Globalization.CultureInfo.InvariantCulture));
    }

    [SkippableFact]
    public async Task LastReviewedAsync_ManyCardsOfOneFingerprintAnsweredOutOfOrder_LatestOutcomeTime()
    {
        await using var scope = await OpenAsync();
        var cards = Enumerable.Range(0, 5).Select(i => Some.Card(issuedAt: Some.Now.AddMinutes(i)) with { FindingsFingerprint = "fingerprint-m" }).ToList();
        await scope.Store.RecordIssuedAsync(cards, None);
        var later = Some.Now.AddMinutes(40);
        var earlier = Some.Now.AddMinutes(20);

        // The later answer arrives first; the earlier one must not move the review time back.
        await scope.Store.RecordFeedbackAsync(cards[3].ServiceId, [Some.Overridden(cards[3], at: later)], later, None);
        await scope.Store.RecordFeedbackAsync(cards[1].ServiceId, [Some.Accepted(cards[1], earlier)], later.AddMinutes(1), None);

        Assert.Equal(later, await scope.Store.LastReviewedAsync(cards[0].PatientPseudonym, "fingerprint-m", Some.Now, None));
        Assert.Null(await scope.Store.LastReviewedAsync(cards[0].PatientPseudonym, "fingerprint-m", later.AddMilliseconds(1), None));
    }

    [SkippableFact]
    public async Task PurgeAsync_OldCardsGoneNewerCardOfTheSameFingerprintKept_RecentReviewKept()
    {
        await using var scope = await OpenAsync();
        var old = Some.Card(issuedAt: Some.Now.AddDays(-800)) with { FindingsFingerprint = "fingerprint-k" };
        var recent = Some.Card(issuedAt: Some.Now.AddHours(-2)) with { FindingsFingerprint = "fingerprint-k" };
        await scope.Store.RecordIssuedAsync([old, recent], None);
        var at = Some.Now.AddHours(-1);
        await scope.Store.RecordFeedbackAsync(recent.ServiceId, [Some.Overridden(recent, at: at)], at, None);

        await scope.Store.PurgeAsync(Some.Now.AddDays(-730), None);

        Assert.Equal(at, await scope.Store.LastReviewedAsync(recent.PatientPseudonym, "fingerprint-k", Some.Now.AddHours(-24), None));
        Assert.Equal(1L, Convert.ToInt64(await scope.Store.QueryScalarAsync("SELECT COUNT(*) FROM reviewed_fingerprint", None), System.Globalization.CultureInfo.InvariantCulture));
    }

    [SkippableFact]
    public async Task FindCardAsync_AfterRecord_EveryFieldAsWritten()
    {
        await using var scope = await OpenAsync();
        var card = Some.Card(rules: ["sodium.severity", "workup.tonicity"], suggestions: 2);
        await scope.Store.RecordIssuedAsync([card], None);

        var found = await scope.Store.FindCardAsync(card.CardUuid, None);

        Assert.NotNull(found);
        Assert.Equal(card.ServiceId, found.ServiceId);
        Assert.Equal(card.Hook, found.Hook);
        Assert.Equal(card.HookInstance, found.HookInstance);
        Assert.Equal(card.PatientPseudonym, found.PatientPseudonym);
        Assert.Equal(card.RuleIds, found.RuleIds);
        Assert.Equal(card.KnowledgeVersion, found.KnowledgeVersion);
        Assert.Equal(card.SoftwareVersion, found.SoftwareVersion);
        Assert.Equal(card.Indicator, found.Indicator);
        Assert.Equal(card.Topic, found.Topic);
        Assert.Equal(card.Summary, found.Summary);
        Assert.Equal(card.ResourcesUsed, found.ResourcesUsed);
        Assert.Equal(card.SuggestionUuids.OrderBy(s => s.Key), found.SuggestionUuids.OrderBy(s => s.Key));
        Assert.Equal(card.IssuedAt, found.IssuedAt);
        Assert.Null(await scope.Store.FindCardAsync(Guid.NewGuid(), None));
    }

    [SkippableFact]
    public async Task RecordFeedbackAsync_SameEntryTwice_StoredOnce()
    {
        await using var scope = await OpenAsync();
        var card = Some.Card();
        await scope.Store.RecordIssuedAsync([card], None);
        var entry = Some.Accepted(card);

        var first = await scope.Store.RecordFeedbackAsync(Some.ServiceId, [entry], Some.Now, None);
        var second = await scope.Store.RecordFeedbackAsync(Some.ServiceId, [entry with { }], Some.Now.AddMinutes(5), None);
        var inOneRequest = await scope.Store.RecordFeedbackAsync(Some.ServiceId, [entry, entry], Some.Now.AddMinutes(6), None);

        Assert.Equal(new FeedbackResult.Stored(1, 0), first);
        Assert.Equal(new FeedbackResult.Stored(0, 1), second);
        Assert.Equal(new FeedbackResult.Stored(0, 2), inOneRequest);
        Assert.Single(await scope.Store.FindFeedbackAsync(card.CardUuid, None));
    }

    [SkippableFact]
    public async Task RecordFeedbackAsync_SameCardOtherTimestampOrOutcome_StoredAsNewFeedback()
    {
        await using var scope = await OpenAsync();
        var card = Some.Card();
        await scope.Store.RecordIssuedAsync([card], None);

        var result = await scope.Store.RecordFeedbackAsync(Some.ServiceId,
            [Some.Overridden(card, "benefit-outweighs-risk", at: card.IssuedAt.AddMinutes(1)),
             Some.Overridden(card, "benefit-outweighs-risk", at: card.IssuedAt.AddMinutes(2)),
             Some.Accepted(card, at: card.IssuedAt.AddMinutes(2))],
            Some.Now, None);

        Assert.Equal(new FeedbackResult.Stored(3, 0), result);
        var stored = await scope.Store.FindFeedbackAsync(card.CardUuid, None);
        Assert.Equal(3, stored.Count);
        Assert.Equal("benefit-outweighs-risk", stored[0].OverrideReason?.Code);
    }

    [SkippableFact]
    public async Task RecordFeedbackAsync_OneUnknownCard_NothingStored()
    {
        await using var scope = await OpenAsync();
        var card = Some.Card();
        await scope.Store.RecordIssuedAsync([card], None);
        var stranger = Some.Card();

        var result = await scope.Store.RecordFeedbackAsync(Some.ServiceId, [Some.Accepted(card), Some.Overridden(stranger)], Some.Now, None);

        var unknown = Assert.IsType<FeedbackResult.UnknownCard>(result);
        Assert.Contains(unknown.Problems, p => p.Contains(stranger.CardUuid.ToString(), StringComparison.Ordinal) && p.Contains("feedback[1]", StringComparison.Ordinal));
        Assert.Equal((1L, 0L), await scope.Store.CountAsync(None));
    }

    [SkippableFact]
    public async Task RecordFeedbackAsync_CardOfAnotherService_MismatchAndNothingStored()
    {
        await using var scope = await OpenAsync();
        var card = Some.Card(serviceId: "natremia-order-sign");
        await scope.Store.RecordIssuedAsync([card], None);

        var result = await scope.Store.RecordFeedbackAsync(Some.ServiceId, [Some.Overridden(card)], Some.Now, None);

        var mismatch = Assert.IsType<FeedbackResult.Mismatch>(result);
        Assert.Contains("another CDS service", Assert.Single(mismatch.Problems), StringComparison.Ordinal);
        Assert.Equal((1L, 0L), await scope.Store.CountAsync(None));
    }

    [SkippableFact]
    public async Task RecordFeedbackAsync_SuggestionOfAnotherCard_MismatchAndNothingStored()
    {
        await using var scope = await OpenAsync();
        var card = Some.Card();
        var other = Some.Card();
        await scope.Store.RecordIssuedAsync([card, other], None);
        var entry = Some.Accepted(card) with { AcceptedSuggestions = [other.SuggestionUuids.Values.First()] };

        var result = await scope.Store.RecordFeedbackAsync(Some.ServiceId, [Some.Overridden(other), entry], Some.Now, None);

        Assert.Contains("is not a suggestion of card", Assert.Single(Assert.IsType<FeedbackResult.Mismatch>(result).Problems), StringComparison.Ordinal);
        Assert.Equal((2L, 0L), await scope.Store.CountAsync(None));
    }

    [SkippableFact]
    public async Task Concurrent_200CardWritesAnd200FeedbackPostsEachSentTwice_AllPresentExactlyOnce()
    {
        await using var scope = await OpenAsync();
        var existing = Enumerable.Range(0, 200).Select(_ => Some.Card()).ToList();
        await scope.Store.RecordIssuedAsync(existing, None);
        var fresh = Enumerable.Range(0, 200).Select(_ => Some.Card()).ToList();
        var entries = existing.Select((c, i) => i % 2 == 0 ? Some.Accepted(c) : Some.Overridden(c, "benefit-outweighs-risk")).ToList();

        var writes = fresh.Select(c => scope.Store.RecordIssuedAsync([c], None))
            .Concat(entries.Select(e => (Task)scope.Store.RecordFeedbackAsync(Some.ServiceId, [e], Some.Now, None)))
            .Concat(entries.Select(e => (Task)scope.Store.RecordFeedbackAsync(Some.ServiceId, [e], Some.Now, None)))
            .ToList();
        await Task.WhenAll(writes);

        Assert.Equal((400L, 200L), await scope.Store.CountAsync(None));
        foreach (var card in existing.Take(20).Concat(fresh.TakeLast(20)))
        {
            Assert.NotNull(await scope.Store.FindCardAsync(card.CardUuid, None));
        }

        foreach (var card in existing)
        {
            Assert.Single(await scope.Store.FindFeedbackAsync(card.CardUuid, None));
        }
    }

    [SkippableFact]
    public async Task RecordIssuedAsync_PseudonymisedPatient_ClearIdInNoTable()
    {
        await using var scope = await OpenAsync();
        const string PatientId = "pt-clear-9q7z4"; // invented; must not be found in any table
        var pseudonym = new PatientPseudonymizer(new byte[32]).Pseudonym(PatientId);
        var card = Some.Card(pseudonym: pseudonym);
        await scope.Store.RecordIssuedAsync([card], None);
        await scope.Store.RecordFeedbackAsync(Some.ServiceId, [Some.Overridden(card, "benefit-outweighs-risk", comment: "stable for years")], Some.Now, None);

        var values = await scope.Store.DumpAllTextAsync(None);

        Assert.Contains(values, v => v == pseudonym);
        Assert.Contains(values, v => v == "feedback");
        Assert.DoesNotContain(values, v => v.Contains(PatientId, StringComparison.OrdinalIgnoreCase));
    }

    [SkippableFact]
    public async Task PurgeAsync_CardsBeforeTheCut_DeletedWithTheirFeedbackOnly()
    {
        await using var scope = await OpenAsync();
        var old = Some.Card(issuedAt: Some.Now.AddDays(-800));
        var edge = Some.Card(issuedAt: Some.Now.AddDays(-730));
        var recent = Some.Card(issuedAt: Some.Now.AddDays(-1));
        await scope.Store.RecordIssuedAsync([old, edge, recent], None);
        await scope.Store.RecordFeedbackAsync(Some.ServiceId, [Some.Accepted(old), Some.Overridden(edge), Some.Overridden(recent)], Some.Now, None);

        var deleted = await scope.Store.PurgeAsync(Some.Now.AddDays(-730), None);

        Assert.Equal(1, deleted);
        Assert.Null(await scope.Store.FindCardAsync(old.CardUuid, None));
        Assert.Empty(await scope.Store.FindFeedbackAsync(old.CardUuid, None));
        Assert.NotNull(await scope.Store.FindCardAsync(edge.CardUuid, None));
        Assert.Equal((2L, 2L), await scope.Store.CountAsync(None));
        Assert.Equal(0L, Convert.ToInt64(await scope.Store.QueryScalarAsync($"SELECT COUNT(*) FROM card_suggestion WHERE card_uuid = '{old.CardUuid:D}'", None), System.Globalization.CultureInfo.InvariantCulture));
        Assert.IsType<FeedbackResult.UnknownCard>(await scope.Store.RecordFeedbackAsync(Some.ServiceId, [Some.Overridden(old)], Some.Now, None));
    }

    [SkippableFact]
    public async Task ReportAsync_HandCountedFixture_CountsPerRule()
    {
        await using var scope = await OpenAsync();
        var (cards, feedback) = OverrideFixture.Build();
        await scope.Store.RecordIssuedAsync(cards, None);
        foreach (var (service, entry) in feedback)
        {
            Assert.IsType<FeedbackResult.Stored>(await scope.Store.RecordFeedbackAsync(service, [entry], Some.Now, None));
        }

        var report = await scope.Store.ReportAsync(OverrideFixture.From, OverrideFixture.To, null, false, None);

        ReportExpectations.AllServices(report);
        var chartOnly = await scope.Store.ReportAsync(OverrideFixture.From, OverrideFixture.To, Some.ServiceId, false, None);
        ReportExpectations.ChartReviewOnly(chartOnly);
    }

    [SkippableFact]
    public async Task FindCardAsync_TestTrafficCard_FlagKept()
    {
        await using var scope = await OpenAsync();
        var test = Some.Card() with { TestTraffic = true };
        var real = Some.Card();
        await scope.Store.RecordIssuedAsync([test, real], None);

        Assert.True((await scope.Store.FindCardAsync(test.CardUuid, None))!.TestTraffic);
        Assert.False((await scope.Store.FindCardAsync(real.CardUuid, None))!.TestTraffic);
    }

    [SkippableFact]
    public async Task ReportAsync_TestTrafficCards_LeftOutAndCountedUnlessIncluded()
    {
        await using var scope = await OpenAsync();
        var real = Some.Card(issuedAt: OverrideFixture.From.AddDays(1));
        var tests = Enumerable.Range(0, 3).Select(i => Some.Card(issuedAt: OverrideFixture.From.AddDays(1).AddMinutes(i)) with { TestTraffic = true }).ToList();
        await scope.Store.RecordIssuedAsync([real, .. tests], None);
        Assert.IsType<FeedbackResult.Stored>(await scope.Store.RecordFeedbackAsync(Some.ServiceId, [Some.Overridden(tests[0], "patient-declined")], Some.Now, None));

        var report = await scope.Store.ReportAsync(OverrideFixture.From, OverrideFixture.To, null, false, None);
        var withTests = await scope.Store.ReportAsync(OverrideFixture.From, OverrideFixture.To, null, true, None);

        var rule = Assert.Single(report.Rules);
        Assert.Equal(1, rule.Shown); // only the real card
        Assert.Equal(0, rule.Overridden); // the override was of a test card
        Assert.False(report.TestTrafficIncluded);
        Assert.Equal(3L, report.TestCardsExcluded);
        Assert.Equal(4, Assert.Single(withTests.Rules).Shown);
        Assert.Equal(1, withTests.Rules[0].Overridden);
        Assert.True(withTests.TestTrafficIncluded);
        Assert.Equal(0L, withTests.TestCardsExcluded);
    }

    [SkippableFact]
    public async Task FindCardsOfPatientAsync_AfterKeyRotation_FindsRecordsOfTheOldAndTheNewKey()
    {
        await using var scope = await OpenAsync();
        var oldKey = Enumerable.Repeat((byte)7, 32).ToArray();
        var newKey = Enumerable.Repeat((byte)9, 32).ToArray();
        var before = new PatientPseudonymizer(oldKey);
        var after = new PatientPseudonymizer(newKey, [oldKey]);
        var underOld = Some.Card(issuedAt: Some.Now) with { PatientPseudonym = before.Pseudonym("pat-rotation"), PseudonymKeyId = before.KeyId };
        var underNew = Some.Card(issuedAt: Some.Now.AddDays(1)) with { PatientPseudonym = after.Pseudonym("pat-rotation"), PseudonymKeyId = after.KeyId };
        var otherPatient = Some.Card(issuedAt: Some.Now) with { PatientPseudonym = after.Pseudonym("pat-other"), PseudonymKeyId = after.KeyId };
        await scope.Store.RecordIssuedAsync([underOld, underNew, otherPatient], None);

        var found = await scope.Store.FindCardsOfPatientAsync(after.AllPseudonyms("pat-rotation"), None);
        var withoutOldKey = await scope.Store.FindCardsOfPatientAsync(new PatientPseudonymizer(newKey).AllPseudonyms("pat-rotation"), None);

        Assert.Equal([underOld.CardUuid, underNew.CardUuid], found.Select(c => c.CardUuid));
        Assert.Equal([before.KeyId, after.KeyId], found.Select(c => c.PseudonymKeyId));
        Assert.Equal([underNew.CardUuid], withoutOldKey.Select(c => c.CardUuid));
    }

    // Group commit (AuditWriteQueue) over this store. The gate holds the writer inside its first commit, so what queues
    // meanwhile is known exactly: no timing decides the outcome.

    [SkippableFact]
    public async Task AuditWriteQueue_AnswersQueuedDuringACommit_ShareOneTransactionAndEveryRecordIsStored()
    {
        await using var scope = await OpenAsync();
        var gated = new GatedStore(scope.Store);
        await using var queue = new AuditWriteQueue(gated, capacity: 100, maxAnswersPerCommit: 256);
        gated.Hold();
        var first = Some.Card();
        var firstDone = queue.RecordAsync([first], None);
        await gated.Entered;
        var answers = Enumerable.Range(0, 20).Select(i => i % 2 == 0 ? new[] { Some.Card() } : [Some.Card(), Some.Card(suggestions: 0)]).ToList();
        var waiting = answers.Select(a => queue.RecordAsync(a, None)).ToList();
        Assert.All(waiting, t => Assert.False(t.IsCompleted)); // nobody is released before the commit

        gated.Release();
        await firstDone;
        await Task.WhenAll(waiting);

        Assert.Equal([1, answers.Sum(a => a.Length)], gated.Calls); // the first alone, then all twenty in one transaction
        foreach (var card in answers.SelectMany(a => a).Append(first))
        {
            Assert.Equal(card.HookInstance, (await scope.Store.FindCardAsync(card.CardUuid, None))?.HookInstance);
        }
    }

    [SkippableFact]
    public async Task AuditWriteQueue_QueueFull_RefusedAtOnceAndEveryAcceptedRecordStored()
    {
        await using var scope = await OpenAsync();
        var gated = new GatedStore(scope.Store);
        await using var queue = new AuditWriteQueue(gated, capacity: 2, maxAnswersPerCommit: 1);
        gated.Hold();
        var (a, b, c, refused) = (Some.Card(), Some.Card(), Some.Card(), Some.Card());
        var aDone = queue.RecordAsync([a], None);
        await gated.Entered; // a is in the writer's hands; the queue itself is empty
        var bDone = queue.RecordAsync([b], None);
        var cDone = queue.RecordAsync([c], None); // the queue is now full (2)

        // Thrown at once, by the call itself: nothing was queued that could later go missing.
        Assert.Throws<AuditQueueFullException>(() => { _ = queue.RecordAsync([refused], None); });

        gated.Release();
        await Task.WhenAll(aDone, bDone, cDone);
        Assert.Equal((3L, 0L), await scope.Store.CountAsync(None)); // every accepted answer stored, the refused one not
        Assert.Null(await scope.Store.FindCardAsync(refused.CardUuid, None));
    }

    [SkippableFact]
    public async Task AuditWriteQueue_OneAnswerRefusedByTheDatabase_OnlyThatAnswerFailsTheOthersAreStored()
    {
        await using var scope = await OpenAsync();
        var gated = new GatedStore(scope.Store);
        await using var queue = new AuditWriteQueue(gated, capacity: 100, maxAnswersPerCommit: 256);
        gated.Hold();
        var (a, b, poisoned, d) = (Some.Card(), Some.Card(), Some.Card(), Some.Card());
        gated.Poison(poisoned.CardUuid);
        var aDone = queue.RecordAsync([a], None);
        await gated.Entered;
        var bDone = queue.RecordAsync([b], None);
        var poisonedDone = queue.RecordAsync([poisoned], None);
        var dDone = queue.RecordAsync([d], None);

        gated.Release();
        await Task.WhenAll(aDone, bDone, dDone);
        await Assert.ThrowsAsync<GatedStore.RefusedException>(() => poisonedDone);

        Assert.Equal([1, 3, 1, 1, 1], gated.Calls); // the shared commit failed whole, then each answer alone
        Assert.Equal((3L, 0L), await scope.Store.CountAsync(None));
        Assert.Null(await scope.Store.FindCardAsync(poisoned.CardUuid, None));
    }

    [SkippableFact]
    public async Task AuditWriteQueue_CompleteWhileAnswersWait_EveryQueuedRecordWrittenBeforeItReturns()
    {
        await using var scope = await OpenAsync();
        var gated = new GatedStore(scope.Store);
        var queue = new AuditWriteQueue(gated, capacity: 100, maxAnswersPerCommit: 256);
        gated.Hold();
        var cards = Enumerable.Range(0, 5).Select(_ => Some.Card()).ToList();
        var first = queue.RecordAsync([cards[0]], None);
        await gated.Entered;
        var rest = cards.Skip(1).Select(c => queue.RecordAsync([c], None)).ToList();

        var completing = queue.CompleteAsync(); // what graceful shutdown does after the server drained
        Assert.False(completing.IsCompleted);
        gated.Release();
        await completing;

        Assert.True(first.IsCompletedSuccessfully);
        Assert.All(rest, t => Assert.True(t.IsCompletedSuccessfully));
        Assert.Equal((5L, 0L), await scope.Store.CountAsync(None));

        var late = Some.Card();
        await queue.RecordAsync([late], None); // after completion: written on its own, never dropped
        Assert.NotNull(await scope.Store.FindCardAsync(late.CardUuid, None));
    }
}
