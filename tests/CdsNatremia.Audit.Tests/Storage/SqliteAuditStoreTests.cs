using System.Text;
using CdsNatremia.Audit.Pseudonyms;
using CdsNatremia.Audit.Storage;
using CdsNatremia.Audit.Tests.Support;

namespace CdsNatremia.Audit.Tests.Storage;

/// <summary>The store suite on SQLite, plus what only a file can show: WAL mode, bytes on disk, crash and reopen.</summary>
public sealed class SqliteAuditStoreTests : AuditStoreContract
{
    private static CancellationToken None => CancellationToken.None;

    protected override async Task<Scope> OpenAsync()
    {
        var folder = NewFolder();
        var store = new SqliteAuditStore(Path.Combine(folder, "audit.db"));
        await store.InitializeAsync(None);
        return new Scope(store, () =>
        {
            TryDelete(folder);
            return ValueTask.CompletedTask;
        });
    }

    [Fact]
    public async Task InitializeAsync_TrailAtVersionOne_MigratedAndItsCardsCountAsRealTraffic()
    {
        var folder = NewFolder();
        try
        {
            var card = Some.Card(issuedAt: OverrideFixture.From.AddDays(1));
            await using (var old = new SqliteAuditStore(Path.Combine(folder, "audit.db")))
            {
                // The schema as version 1 left it, with one card written before test traffic was flagged.
                await old.QueryScalarAsync(AuditSchema.VersionTable, None);
                foreach (var statement in AuditSchema.Migrations[0].Statements)
                {
                    await old.QueryScalarAsync(statement, None);
                }

                await old.QueryScalarAsync("INSERT INTO schema_version (version, applied_at_ms) VALUES (1, 0)", None);
                await old.QueryScalarAsync(
                    "INSERT INTO issued_card (card_uuid, service_id, hook, hook_instance, patient_pseudonym, rule_ids, knowledge_version, software_version, indicator, topic, summary, resources_used, suggestion_uuids, issued_at_ms) "
                    + $"VALUES ('{card.CardUuid:D}', '{card.ServiceId}', 'patient-view', '{card.HookInstance:D}', '{card.PatientPseudonym}', '[\"sodium.severity\"]', 'kb', 'sw', 'critical', 'sodium-assessment', 's', '[]', '{{}}', {card.IssuedAt.ToUnixTimeMilliseconds()})",
                    None);
                await old.QueryScalarAsync($"INSERT INTO card_rule (card_uuid, rule_id) VALUES ('{card.CardUuid:D}', 'sodium.severity')", None);
            }

            await using var store = new SqliteAuditStore(Path.Combine(folder, "audit.db"));
            await store.InitializeAsync(None);

            Assert.Equal((long)AuditSchema.CurrentVersion, await store.QueryScalarAsync("SELECT MAX(version) FROM schema_version", None));
            Assert.False((await store.FindCardAsync(card.CardUuid, None))!.TestTraffic);
            Assert.Equal(1, Assert.Single((await store.ReportAsync(OverrideFixture.From, OverrideFixture.To, null, false, None)).Rules).Shown);
        }
        finally
        {
            TryDelete(folder);
        }
    }

    [Fact]
    public async Task InitializeAsync_TrailAtVersionFourWithAnsweredCards_ReviewTimesCarriedOver()
    {
        var folder = NewFolder();
        try
        {
            var card = Some.Card(issuedAt: Some.Now) with { FindingsFingerprint = "fingerprint-v4" };
            var first = Some.Now.AddMinutes(3);
            var last = Some.Now.AddMinutes(9);
            await using (var old = new SqliteAuditStore(Path.Combine(folder, "audit.db")))
            {
                // The schema as version 4 left it, with one card answered twice (the review time was read by a join then).
                await old.QueryScalarAsync(AuditSchema.VersionTable, None);
                foreach (var (version, statements) in AuditSchema.Migrations.Where(m => m.Version <= 4))
                {
                    foreach (var statement in statements)
                    {
                        await old.QueryScalarAsync(statement, None);
                    }

                    await old.QueryScalarAsync($"INSERT INTO schema_version (version, applied_at_ms) VALUES ({version}, 0)", None);
                }

                await old.QueryScalarAsync(
                    "INSERT INTO issued_card (card_uuid, service_id, hook, hook_instance, patient_pseudonym, rule_ids, knowledge_version, software_version, indicator, topic, summary, resources_used, suggestion_uuids, issued_at_ms) "
                    + $"VALUES ('{card.CardUuid:D}', '{card.ServiceId}', 'patient-view', '{card.HookInstance:D}', '{card.PatientPseudonym}', '[]', 'kb', 'sw', 'warning', 'sodium-assessment', 's', '[]', '{{}}', {card.IssuedAt.ToUnixTimeMilliseconds()})",
                    None);
                await old.QueryScalarAsync($"INSERT INTO card_fingerprint (card_uuid, patient_pseudonym, fingerprint) VALUES ('{card.CardUuid:D}', '{card.PatientPseudonym}', 'fingerprint-v4')", None);
                foreach (var (key, at) in new[] { ("k1", first), ("k2", last) })
                {
                    await old.QueryScalarAsync(
                        "INSERT INTO feedback (feedback_key, card_uuid, service_id, outcome, accepted_suggestions, outcome_at_ms, received_at_ms) "
                        + $"VALUES ('{key}', '{card.CardUuid:D}', '{card.ServiceId}', 'overridden', '[]', {at.ToUnixTimeMilliseconds()}, {at.ToUnixTimeMilliseconds()})",
                        None);
                }
            }

            await using var store = new SqliteAuditStore(Path.Combine(folder, "audit.db"));
            await store.InitializeAsync(None);

            Assert.Equal(last, await store.LastReviewedAsync(card.PatientPseudonym, "fingerprint-v4", Some.Now, None));
        }
        finally
        {
            TryDelete(folder);
        }
    }

    [Fact]
    public async Task InitializeAsync_NewFile_WriteAheadLogMode()
    {
        await using var scope = await OpenAsync();
        Assert.Equal("wal", await scope.Store.QueryScalarAsync("PRAGMA journal_mode", None));
        Assert.Equal(2L, await scope.Store.QueryScalarAsync("PRAGMA synchronous", None)); // 2 = FULL (SQLite documentation, PRAGMA synchronous)
    }

    [SkippableFact]
    [System.Runtime.Versioning.UnsupportedOSPlatform("windows")]
    public async Task InitializeAsync_NewFolder_FolderOwnerOnlyAndEveryDatabaseFileOwnerOnly()
    {
        Skip.If(OperatingSystem.IsWindows(), "Unix permissions only");
        var folder = Path.Combine(NewFolder(), "data");
        try
        {
            var path = Path.Combine(folder, "audit.db");
            await using (var store = new SqliteAuditStore(path))
            {
                await store.InitializeAsync(None);
                await store.RecordIssuedAsync([Some.Card()], None);

                Assert.Equal(PrivateFiles.FolderMode, File.GetUnixFileMode(folder));
                var files = Directory.GetFiles(folder);
                Assert.Contains(path + "-wal", files);
                Assert.All(files, f => Assert.Equal(PrivateFiles.FileMode, File.GetUnixFileMode(f)));
            }
        }
        finally
        {
            TryDelete(Path.GetDirectoryName(folder)!);
        }
    }

    [Fact]
    public async Task FileBytes_PseudonymisedPatient_ClearIdNowhereInDatabaseOrLog()
    {
        var folder = NewFolder();
        try
        {
            const string PatientId = "pt-clear-5k2w8"; // invented
            var pseudonym = new PatientPseudonymizer(Enumerable.Repeat((byte)7, 32).ToArray()).Pseudonym(PatientId);
            var store = new SqliteAuditStore(Path.Combine(folder, "audit.db"));
            await store.InitializeAsync(None);
            var card = Some.Card(pseudonym: pseudonym);
            await store.RecordIssuedAsync([card], None);
            await store.RecordFeedbackAsync(Some.ServiceId, [Some.Overridden(card, "benefit-outweighs-risk")], Some.Now, None);

            var bytes = Directory.GetFiles(folder).SelectMany(File.ReadAllBytes).ToArray();

            Assert.True(Contains(bytes, Encoding.UTF8.GetBytes(pseudonym)), "the pseudonym is stored");
            Assert.False(Contains(bytes, Encoding.UTF8.GetBytes(PatientId)), "the clear patient id must not be in any file");
            Assert.False(Contains(bytes, Encoding.Unicode.GetBytes(PatientId)), "nor in UTF-16");
            await store.DisposeAsync();
        }
        finally
        {
            TryDelete(folder);
        }
    }

    [Fact]
    public async Task Reopen_AfterCrashWithoutClose_EveryCommittedRecordPresent()
    {
        var folder = NewFolder();
        var copy = NewFolder();
        try
        {
            var path = Path.Combine(folder, "audit.db");
            var writer = new SqliteAuditStore(path);
            await writer.InitializeAsync(None);
            var cards = Enumerable.Range(0, 50).Select(_ => Some.Card()).ToList();
            foreach (var card in cards)
            {
                await writer.RecordIssuedAsync([card], None);
            }

            await writer.RecordFeedbackAsync(Some.ServiceId, cards.Select(c => Some.Overridden(c)).ToList(), Some.Now, None);

            // The crash: the writer is never disposed and no checkpoint runs. What a crash leaves is the files as they
            // are on disk now (database plus write-ahead log), so copy them as they are and open the copy.
            foreach (var file in Directory.GetFiles(folder).Where(f => !f.EndsWith("-shm", StringComparison.Ordinal)))
            {
                File.Copy(file, Path.Combine(copy, Path.GetFileName(file)));
            }

            Assert.True(File.Exists(Path.Combine(copy, "audit.db-wal")), "the records are still in the log, not yet checkpointed");
            await using var reopened = new SqliteAuditStore(Path.Combine(copy, "audit.db"));
            await reopened.InitializeAsync(None);
            Assert.Equal((50L, 50L), await reopened.CountAsync(None));
            Assert.NotNull(await reopened.FindCardAsync(cards[^1].CardUuid, None));

            // And a second process opening the same live file while the first still holds it sees the same.
            await using var second = new SqliteAuditStore(path);
            await second.InitializeAsync(None);
            Assert.Equal((50L, 50L), await second.CountAsync(None));
            GC.KeepAlive(writer);
        }
        finally
        {
            TryDelete(folder);
            TryDelete(copy);
        }
    }

    private static bool Contains(byte[] haystack, byte[] needle) => haystack.AsSpan().IndexOf(needle) >= 0;

    private static string NewFolder()
    {
        var folder = Path.Combine(Path.GetTempPath(), "natremia-audit-tests", Guid.NewGuid().ToString("N"));
        Directory.CreateDirectory(folder);
        return folder;
    }

    private static void TryDelete(string folder)
    {
        try
        {
            Microsoft.Data.Sqlite.SqliteConnection.ClearAllPools();
            Directory.Delete(folder, recursive: true);
        }
        catch (IOException)
        {
            // A leftover temp folder is harmless.
        }
        catch (UnauthorizedAccessException)
        {
        }
    }
}
