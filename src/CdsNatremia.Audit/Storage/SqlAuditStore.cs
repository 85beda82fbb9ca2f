using System.Data;
using System.Data.Common;
using System.Text.Json;
using CdsNatremia.Audit.Records;
using CdsNatremia.Audit.Reports;

namespace CdsNatremia.Audit.Storage;

/// <summary>
/// The SQL shared by both databases. Subclasses open connections, begin write transactions and take the migration
/// lock their own way; everything else (statements, mapping, the feedback checks) lives here once.
/// </summary>
public abstract class SqlAuditStore : IAuditStore
{
    private static readonly JsonSerializerOptions Json = new(JsonSerializerDefaults.Web);

    /// <inheritdoc />
    public abstract string Kind { get; }

    /// <summary>Opens a connection ready for use.</summary>
    protected abstract Task<DbConnection> OpenAsync(CancellationToken cancellationToken);

    /// <summary>Begins a write transaction (SQLite: BEGIN IMMEDIATE; PostgreSQL: read committed).</summary>
    protected abstract Task<DbTransaction> BeginWriteAsync(DbConnection connection, CancellationToken cancellationToken);

    /// <summary>Serialises migrations of several instances starting at once (inside the migration transaction).</summary>
    protected abstract Task LockForMigrationAsync(DbConnection connection, DbTransaction transaction, CancellationToken cancellationToken);

    /// <summary>Names of the tables in the store's schema (for the pseudonymisation scan in tests).</summary>
    protected abstract string ListTablesSql { get; }

    /// <summary>Runs a write; SQLite overrides it to let one writer of this process in at a time.</summary>
    protected virtual Task<T> WriteAsync<T>(Func<Task<T>> write, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(write);
        return write();
    }

    /// <inheritdoc />
    public virtual async Task InitializeAsync(CancellationToken cancellationToken)
    {
        await WriteAsync(async () =>
        {
            await using var connection = await OpenAsync(cancellationToken).ConfigureAwait(false);
            await using var transaction = await BeginWriteAsync(connection, cancellationToken).ConfigureAwait(false);
            await LockForMigrationAsync(connection, transaction, cancellationToken).ConfigureAwait(false);
            await ExecuteAsync(connection, transaction, AuditSchema.VersionTable, cancellationToken).ConfigureAwait(false);
            var current = Convert.ToInt32(
                await ScalarAsync(connection, transaction, "SELECT COALESCE(MAX(version), 0) FROM schema_version", cancellationToken).ConfigureAwait(false),
                System.Globalization.CultureInfo.InvariantCulture);
            if (current > AuditSchema.CurrentVersion)
            {
                throw new InvalidOperationException($"The audit database is at schema version {current}, newer than this software knows ({AuditSchema.CurrentVersion}).");
            }

            foreach (var (version, statements) in AuditSchema.Migrations.Where(m => m.Version > current))
            {
                foreach (var statement in statements)
                {
                    await ExecuteAsync(connection, transaction, statement, cancellationToken).ConfigureAwait(false);
                }

                await ExecuteAsync(connection, transaction, "INSERT INTO schema_version (version, applied_at_ms) VALUES (@v, @t)", cancellationToken,
                    ("@v", version), ("@t", DateTimeOffset.UtcNow.ToUnixTimeMilliseconds())).ConfigureAwait(false);
            }

            await transaction.CommitAsync(cancellationToken).ConfigureAwait(false);
            return 0;
        }, cancellationToken).ConfigureAwait(false);
    }

    /// <inheritdoc />
    public Task RecordIssuedAsync(IReadOnlyList<IssuedCardRecord> cards, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(cards);
        if (cards.Count == 0)
        {
            return Task.CompletedTask;
        }

        return WriteAsync(async () =>
        {
            await using var connection = await OpenAsync(cancellationToken).ConfigureAwait(false);
            await using var transaction = await BeginWriteAsync(connection, cancellationToken).ConfigureAwait(false);
            // One prepared command per statement for the whole group: a group commit writes many cards and their rules.
            await using var statements = new ReusedCommands(connection, transaction);
            foreach (var card in cards)
            {
                var uuid = Id(card.CardUuid);
                await statements.ExecuteAsync(
                    """
                    INSERT INTO issued_card (card_uuid, service_id, hook, hook_instance, patient_pseudonym, rule_ids, knowledge_version,
                        software_version, indicator, topic, summary, resources_used, suggestion_uuids, issued_at_ms, test_traffic, pseudonym_key_id)
                    VALUES (@card, @service, @hook, @instance, @patient, @rules, @knowledge, @software, @indicator, @topic, @summary, @resources, @suggestions, @at, @test, @keyid)
                    """,
                    cancellationToken,
                    ("@card", uuid), ("@service", card.ServiceId), ("@hook", card.Hook), ("@instance", Id(card.HookInstance)),
                    ("@patient", card.PatientPseudonym), ("@rules", JsonSerializer.Serialize(card.RuleIds, Json)),
                    ("@knowledge", card.KnowledgeVersion), ("@software", card.SoftwareVersion), ("@indicator", card.Indicator),
                    ("@topic", card.Topic), ("@summary", card.Summary), ("@resources", JsonSerializer.Serialize(card.ResourcesUsed, Json)),
                    ("@suggestions", JsonSerializer.Serialize(card.SuggestionUuids.ToDictionary(s => s.Key, s => Id(s.Value)), Json)),
                    ("@at", card.IssuedAt.ToUnixTimeMilliseconds()), ("@test", card.TestTraffic ? 1 : 0), ("@keyid", card.PseudonymKeyId)).ConfigureAwait(false);
                if (!string.IsNullOrEmpty(card.FindingsFingerprint))
                {
                    await statements.ExecuteAsync( "INSERT INTO card_fingerprint (card_uuid, patient_pseudonym, fingerprint) VALUES (@card, @patient, @fingerprint)", cancellationToken,
                        ("@card", uuid), ("@patient", card.PatientPseudonym), ("@fingerprint", card.FindingsFingerprint)).ConfigureAwait(false);
                }

                foreach (var rule in card.RuleIds.Distinct(StringComparer.Ordinal))
                {
                    await statements.ExecuteAsync( "INSERT INTO card_rule (card_uuid, rule_id) VALUES (@card, @rule)", cancellationToken,
                        ("@card", uuid), ("@rule", rule)).ConfigureAwait(false);
                }

                foreach (var (key, suggestion) in card.SuggestionUuids)
                {
                    await statements.ExecuteAsync( "INSERT INTO card_suggestion (suggestion_uuid, card_uuid, suggestion_key) VALUES (@s, @card, @key)", cancellationToken,
                        ("@s", Id(suggestion)), ("@card", uuid), ("@key", key)).ConfigureAwait(false);
                }
            }

            await transaction.CommitAsync(cancellationToken).ConfigureAwait(false);
            return 0;
        }, cancellationToken);
    }

    /// <inheritdoc />
    public Task<FeedbackResult> RecordFeedbackAsync(string serviceId, IReadOnlyList<FeedbackEntry> entries, DateTimeOffset receivedAt, CancellationToken cancellationToken)
    {
        ArgumentException.ThrowIfNullOrEmpty(serviceId);
        ArgumentNullException.ThrowIfNull(entries);
        return WriteAsync<FeedbackResult>(async () =>
        {
            await using var connection = await OpenAsync(cancellationToken).ConfigureAwait(false);
            await using var transaction = await BeginWriteAsync(connection, cancellationToken).ConfigureAwait(false);
            var unknown = new List<string>();
            var mismatch = new List<string>();
            for (var i = 0; i < entries.Count; i++)
            {
                var entry = entries[i];
                var owner = await ScalarAsync(connection, transaction, "SELECT service_id FROM issued_card WHERE card_uuid = @card", cancellationToken,
                    ("@card", Id(entry.Card))).ConfigureAwait(false) as string;
                if (owner is null)
                {
                    unknown.Add($"'feedback[{i}].card': no card {entry.Card} was issued by this service (or its record has passed the retention period).");
                    continue;
                }

                if (!string.Equals(owner, serviceId, StringComparison.Ordinal))
                {
                    mismatch.Add($"'feedback[{i}].card': card {entry.Card} was issued by another CDS service; send its feedback to that service's feedback endpoint.");
                    continue;
                }

                foreach (var suggestion in entry.AcceptedSuggestions)
                {
                    var card = await ScalarAsync(connection, transaction, "SELECT card_uuid FROM card_suggestion WHERE suggestion_uuid = @s", cancellationToken,
                        ("@s", Id(suggestion))).ConfigureAwait(false) as string;
                    if (!string.Equals(card, Id(entry.Card), StringComparison.Ordinal))
                    {
                        mismatch.Add($"'feedback[{i}].acceptedSuggestions': {suggestion} is not a suggestion of card {entry.Card}.");
                    }
                }
            }

            if (unknown.Count > 0)
            {
                return new FeedbackResult.UnknownCard([.. unknown, .. mismatch]);
            }

            if (mismatch.Count > 0)
            {
                return new FeedbackResult.Mismatch(mismatch);
            }

            var added = 0;
            foreach (var entry in entries)
            {
                added += await ExecuteAsync(connection, transaction,
                    """
                    INSERT INTO feedback (feedback_key, card_uuid, service_id, outcome, accepted_suggestions, reason_system, reason_code,
                        reason_display, user_comment, outcome_at_ms, received_at_ms)
                    VALUES (@key, @card, @service, @outcome, @accepted, @system, @code, @display, @comment, @at, @received)
                    ON CONFLICT (feedback_key) DO NOTHING
                    """,
                    cancellationToken,
                    ("@key", entry.IdentityKey()), ("@card", Id(entry.Card)), ("@service", serviceId), ("@outcome", Outcome(entry.Outcome)),
                    ("@accepted", JsonSerializer.Serialize(entry.AcceptedSuggestions.Select(Id).Order(StringComparer.Ordinal), Json)),
                    ("@system", entry.OverrideReason?.System), ("@code", entry.OverrideReason?.Code), ("@display", entry.OverrideReason?.Display),
                    ("@comment", entry.UserComment), ("@at", entry.OutcomeTimestamp.ToUnixTimeMilliseconds()),
                    ("@received", receivedAt.ToUnixTimeMilliseconds())).ConfigureAwait(false);

                // The card's fingerprint counts as reviewed at the latest outcome time seen for it (LastReviewedAsync).
                await ExecuteAsync(connection, transaction,
                    """
                    INSERT INTO reviewed_fingerprint (patient_pseudonym, fingerprint, reviewed_at_ms)
                    SELECT patient_pseudonym, fingerprint, @at FROM card_fingerprint WHERE card_uuid = @card
                    ON CONFLICT (patient_pseudonym, fingerprint) DO UPDATE SET reviewed_at_ms = excluded.reviewed_at_ms
                    WHERE excluded.reviewed_at_ms > reviewed_fingerprint.reviewed_at_ms
                    """,
                    cancellationToken, ("@card", Id(entry.Card)), ("@at", entry.OutcomeTimestamp.ToUnixTimeMilliseconds())).ConfigureAwait(false);
            }

            await transaction.CommitAsync(cancellationToken).ConfigureAwait(false);
            return new FeedbackResult.Stored(added, entries.Count - added);
        }, cancellationToken);
    }

    private const string CardColumns =
        """
        card_uuid, service_id, hook, hook_instance, patient_pseudonym, rule_ids, knowledge_version, software_version,
            indicator, topic, summary, resources_used, suggestion_uuids, issued_at_ms, pseudonym_key_id, test_traffic
        """;

    /// <inheritdoc />
    public async Task<DateTimeOffset?> LastReviewedAsync(string patientPseudonym, string fingerprint, DateTimeOffset since, CancellationToken cancellationToken)
    {
        ArgumentException.ThrowIfNullOrEmpty(patientPseudonym);
        ArgumentException.ThrowIfNullOrEmpty(fingerprint);
        await using var connection = await OpenAsync(cancellationToken).ConfigureAwait(false);
        var value = await ScalarAsync(connection, null,
            """
            SELECT reviewed_at_ms FROM reviewed_fingerprint
            WHERE patient_pseudonym = @patient AND fingerprint = @fingerprint AND reviewed_at_ms >= @since
            """,
            cancellationToken, ("@patient", patientPseudonym), ("@fingerprint", fingerprint), ("@since", since.ToUnixTimeMilliseconds())).ConfigureAwait(false);
        return value is null or DBNull ? null : DateTimeOffset.FromUnixTimeMilliseconds(Convert.ToInt64(value, System.Globalization.CultureInfo.InvariantCulture));
    }

    /// <inheritdoc />
    public async Task<IssuedCardRecord?> FindCardAsync(Guid cardUuid, CancellationToken cancellationToken)
    {
        await using var connection = await OpenAsync(cancellationToken).ConfigureAwait(false);
        await using var command = Command(connection, null, $"SELECT {CardColumns} FROM issued_card WHERE card_uuid = @card", ("@card", Id(cardUuid)));
        await using var reader = await command.ExecuteReaderAsync(cancellationToken).ConfigureAwait(false);
        return await reader.ReadAsync(cancellationToken).ConfigureAwait(false) ? ReadCard(reader) : null;
    }

    /// <inheritdoc />
    public async Task<IReadOnlyList<IssuedCardRecord>> FindCardsOfPatientAsync(IReadOnlyList<Pseudonyms.KeyedPseudonym> pseudonyms, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(pseudonyms);
        var result = new List<IssuedCardRecord>();
        await using var connection = await OpenAsync(cancellationToken).ConfigureAwait(false);
        foreach (var pseudonym in pseudonyms.Distinct())
        {
            // A record made before key ids were kept ('') matches on the pseudonym alone.
            await using var command = Command(connection, null,
                $"SELECT {CardColumns} FROM issued_card WHERE patient_pseudonym = @p AND (pseudonym_key_id = @k OR pseudonym_key_id = '') ORDER BY issued_at_ms, card_uuid",
                ("@p", pseudonym.Pseudonym), ("@k", pseudonym.KeyId));
            await using var reader = await command.ExecuteReaderAsync(cancellationToken).ConfigureAwait(false);
            while (await reader.ReadAsync(cancellationToken).ConfigureAwait(false))
            {
                result.Add(ReadCard(reader));
            }
        }

        return result.DistinctBy(c => c.CardUuid).OrderBy(c => c.IssuedAt).ThenBy(c => c.CardUuid).ToList();
    }

    private static IssuedCardRecord ReadCard(DbDataReader reader) => new()
    {
        CardUuid = Guid.Parse(reader.GetString(0)),
        ServiceId = reader.GetString(1),
        Hook = reader.GetString(2),
        HookInstance = Guid.Parse(reader.GetString(3)),
        PatientPseudonym = reader.GetString(4),
        RuleIds = JsonSerializer.Deserialize<List<string>>(reader.GetString(5), Json) ?? [],
        KnowledgeVersion = reader.GetString(6),
        SoftwareVersion = reader.GetString(7),
        Indicator = reader.GetString(8),
        Topic = reader.GetString(9),
        Summary = reader.GetString(10),
        ResourcesUsed = JsonSerializer.Deserialize<List<string>>(reader.GetString(11), Json) ?? [],
        SuggestionUuids = (JsonSerializer.Deserialize<Dictionary<string, string>>(reader.GetString(12), Json) ?? [])
            .ToDictionary(s => s.Key, s => Guid.Parse(s.Value), StringComparer.Ordinal),
        IssuedAt = DateTimeOffset.FromUnixTimeMilliseconds(reader.GetInt64(13)),
        PseudonymKeyId = reader.GetString(14),
        TestTraffic = Convert.ToInt64(reader.GetValue(15), System.Globalization.CultureInfo.InvariantCulture) != 0,
    };

    /// <inheritdoc />
    public async Task<IReadOnlyList<FeedbackEntry>> FindFeedbackAsync(Guid cardUuid, CancellationToken cancellationToken)
    {
        await using var connection = await OpenAsync(cancellationToken).ConfigureAwait(false);
        await using var command = Command(connection, null,
            """
            SELECT outcome, accepted_suggestions, reason_system, reason_code, reason_display, user_comment, outcome_at_ms
            FROM feedback WHERE card_uuid = @card ORDER BY outcome_at_ms, feedback_key
            """,
            ("@card", Id(cardUuid)));
        await using var reader = await command.ExecuteReaderAsync(cancellationToken).ConfigureAwait(false);
        var result = new List<FeedbackEntry>();
        while (await reader.ReadAsync(cancellationToken).ConfigureAwait(false))
        {
            result.Add(new FeedbackEntry
            {
                Card = cardUuid,
                Outcome = ParseOutcome(reader.GetString(0)),
                AcceptedSuggestions = (JsonSerializer.Deserialize<List<string>>(reader.GetString(1), Json) ?? []).Select(Guid.Parse).ToList(),
                OverrideReason = reader.IsDBNull(3) ? null : new ReasonCoding(reader.GetString(2), reader.GetString(3), reader.IsDBNull(4) ? null : reader.GetString(4)),
                UserComment = reader.IsDBNull(5) ? null : reader.GetString(5),
                OutcomeTimestamp = DateTimeOffset.FromUnixTimeMilliseconds(reader.GetInt64(6)),
            });
        }

        return result;
    }

    /// <inheritdoc />
    public async Task<OverrideReport> ReportAsync(DateTimeOffset from, DateTimeOffset to, string? serviceId, bool includeTestTraffic, CancellationToken cancellationToken)
    {
        if (to <= from)
        {
            throw new ArgumentException("The report range must end after it starts.", nameof(to));
        }

        var serviceFilter = serviceId is null ? string.Empty : " AND c.service_id = @service";
        var filter = serviceFilter + (includeTestTraffic ? string.Empty : " AND c.test_traffic = 0");
        var parameters = new List<(string, object?)> { ("@from", from.ToUnixTimeMilliseconds()), ("@to", to.ToUnixTimeMilliseconds()) };
        if (serviceId is not null)
        {
            parameters.Add(("@service", serviceId));
        }

        await using var connection = await OpenAsync(cancellationToken).ConfigureAwait(false);
        var rules = new List<CardRuleRow>();
        await using (var command = Command(connection, null,
            "SELECT c.card_uuid, c.issued_at_ms, r.rule_id FROM issued_card c JOIN card_rule r ON r.card_uuid = c.card_uuid "
            + "WHERE c.issued_at_ms >= @from AND c.issued_at_ms < @to" + filter, [.. parameters]))
        {
            await using var reader = await command.ExecuteReaderAsync(cancellationToken).ConfigureAwait(false);
            while (await reader.ReadAsync(cancellationToken).ConfigureAwait(false))
            {
                rules.Add(new CardRuleRow(Guid.Parse(reader.GetString(0)), DateTimeOffset.FromUnixTimeMilliseconds(reader.GetInt64(1)), reader.GetString(2)));
            }
        }

        var feedback = new List<CardFeedbackRow>();
        await using (var command = Command(connection, null,
            "SELECT f.card_uuid, f.outcome, f.reason_system, f.reason_code, f.reason_display FROM feedback f JOIN issued_card c ON c.card_uuid = f.card_uuid "
            + "WHERE c.issued_at_ms >= @from AND c.issued_at_ms < @to" + filter, [.. parameters]))
        {
            await using var reader = await command.ExecuteReaderAsync(cancellationToken).ConfigureAwait(false);
            while (await reader.ReadAsync(cancellationToken).ConfigureAwait(false))
            {
                var reason = reader.IsDBNull(3) ? null : new ReasonCoding(reader.GetString(2), reader.GetString(3), reader.IsDBNull(4) ? null : reader.GetString(4));
                feedback.Add(new CardFeedbackRow(Guid.Parse(reader.GetString(0)), ParseOutcome(reader.GetString(1)), reason));
            }
        }

        var excluded = includeTestTraffic
            ? 0L
            : Convert.ToInt64(
                await ScalarAsync(connection, null, "SELECT COUNT(*) FROM issued_card c WHERE c.issued_at_ms >= @from AND c.issued_at_ms < @to AND c.test_traffic <> 0" + serviceFilter, cancellationToken, [.. parameters]).ConfigureAwait(false),
                System.Globalization.CultureInfo.InvariantCulture);
        return OverrideReportBuilder.Build(from, to, serviceId, rules, feedback) with { TestTrafficIncluded = includeTestTraffic, TestCardsExcluded = excluded };
    }

    /// <inheritdoc />
    public Task<int> PurgeAsync(DateTimeOffset issuedBefore, CancellationToken cancellationToken)
        => WriteAsync(async () =>
        {
            await using var connection = await OpenAsync(cancellationToken).ConfigureAwait(false);
            await using var transaction = await BeginWriteAsync(connection, cancellationToken).ConfigureAwait(false);
            var cut = ("@cut", (object?)issuedBefore.ToUnixTimeMilliseconds());
            const string Old = "SELECT card_uuid FROM issued_card WHERE issued_at_ms < @cut";
            await ExecuteAsync(connection, transaction, $"DELETE FROM feedback WHERE card_uuid IN ({Old})", cancellationToken, cut).ConfigureAwait(false);
            await ExecuteAsync(connection, transaction, $"DELETE FROM card_rule WHERE card_uuid IN ({Old})", cancellationToken, cut).ConfigureAwait(false);
            await ExecuteAsync(connection, transaction, $"DELETE FROM card_fingerprint WHERE card_uuid IN ({Old})", cancellationToken, cut).ConfigureAwait(false);
            // A review stamp goes with the last card of its patient and fingerprint, or once it is older than the cut.
            await ExecuteAsync(connection, transaction,
                """
                DELETE FROM reviewed_fingerprint WHERE reviewed_at_ms < @cut OR NOT EXISTS (SELECT 1 FROM card_fingerprint c
                    WHERE c.patient_pseudonym = reviewed_fingerprint.patient_pseudonym AND c.fingerprint = reviewed_fingerprint.fingerprint)
                """,
                cancellationToken, cut).ConfigureAwait(false);
            await ExecuteAsync(connection, transaction, $"DELETE FROM card_suggestion WHERE card_uuid IN ({Old})", cancellationToken, cut).ConfigureAwait(false);
            var deleted = await ExecuteAsync(connection, transaction, "DELETE FROM issued_card WHERE issued_at_ms < @cut", cancellationToken, cut).ConfigureAwait(false);
            await transaction.CommitAsync(cancellationToken).ConfigureAwait(false);
            return deleted;
        }, cancellationToken);

    /// <inheritdoc />
    public async Task<(long Cards, long Feedback)> CountAsync(CancellationToken cancellationToken)
    {
        await using var connection = await OpenAsync(cancellationToken).ConfigureAwait(false);
        var cards = Convert.ToInt64(await ScalarAsync(connection, null, "SELECT COUNT(*) FROM issued_card", cancellationToken).ConfigureAwait(false), System.Globalization.CultureInfo.InvariantCulture);
        var feedback = Convert.ToInt64(await ScalarAsync(connection, null, "SELECT COUNT(*) FROM feedback", cancellationToken).ConfigureAwait(false), System.Globalization.CultureInfo.InvariantCulture);
        return (cards, feedback);
    }

    /// <summary>Every value of every table as text (for tests that prove the patient id is stored nowhere).</summary>
    internal async Task<IReadOnlyList<string>> DumpAllTextAsync(CancellationToken cancellationToken)
    {
        await using var connection = await OpenAsync(cancellationToken).ConfigureAwait(false);
        var tables = new List<string>();
        await using (var command = Command(connection, null, ListTablesSql))
        await using (var reader = await command.ExecuteReaderAsync(cancellationToken).ConfigureAwait(false))
        {
            while (await reader.ReadAsync(cancellationToken).ConfigureAwait(false))
            {
                tables.Add(reader.GetString(0));
            }
        }

        var values = new List<string>();
        foreach (var table in tables)
        {
            values.Add(table);
            await using var command = Command(connection, null, $"SELECT * FROM \"{table.Replace("\"", "\"\"", StringComparison.Ordinal)}\"");
            await using var reader = await command.ExecuteReaderAsync(cancellationToken).ConfigureAwait(false);
            while (await reader.ReadAsync(cancellationToken).ConfigureAwait(false))
            {
                for (var i = 0; i < reader.FieldCount; i++)
                {
                    values.Add(Convert.ToString(reader.GetValue(i), System.Globalization.CultureInfo.InvariantCulture) ?? string.Empty);
                }
            }
        }

        return values;
    }

    /// <summary>Runs one query and returns its first value (tests read the schema version and pragmas with it).</summary>
    internal async Task<object?> QueryScalarAsync(string sql, CancellationToken cancellationToken)
    {
        await using var connection = await OpenAsync(cancellationToken).ConfigureAwait(false);
        return await ScalarAsync(connection, null, sql, cancellationToken).ConfigureAwait(false);
    }

    /// <inheritdoc />
    public abstract ValueTask DisposeAsync();

    /// <summary>
    /// Commands kept prepared for the length of one transaction, one per SQL text: the second and later rows of a statement
    /// only bind new values (no new parse). Parameters keep the names, order and types of the first use.
    /// </summary>
    private sealed class ReusedCommands(DbConnection connection, DbTransaction transaction) : IAsyncDisposable
    {
        private readonly Dictionary<string, DbCommand> _commands = new(StringComparer.Ordinal);

        public async Task<int> ExecuteAsync(string sql, CancellationToken cancellationToken, params (string Name, object? Value)[] parameters)
        {
            if (_commands.TryGetValue(sql, out var command))
            {
                for (var i = 0; i < parameters.Length; i++)
                {
                    var parameter = command.Parameters[i];
                    if (!string.Equals(parameter.ParameterName, parameters[i].Name, StringComparison.Ordinal))
                    {
                        throw new InvalidOperationException($"A reused statement was given parameter {parameters[i].Name} where {parameter.ParameterName} was.");
                    }

                    parameter.Value = parameters[i].Value ?? DBNull.Value;
                }
            }
            else
            {
                command = Command(connection, transaction, sql, parameters);
                _commands[sql] = command;
            }

            return await command.ExecuteNonQueryAsync(cancellationToken).ConfigureAwait(false);
        }

        public async ValueTask DisposeAsync()
        {
            foreach (var command in _commands.Values)
            {
                await command.DisposeAsync().ConfigureAwait(false);
            }
        }
    }

    /// <summary>Runs a statement; returns the rows affected.</summary>
    protected static async Task<int> ExecuteAsync(DbConnection connection, DbTransaction? transaction, string sql, CancellationToken cancellationToken, params (string Name, object? Value)[] parameters)
    {
        await using var command = Command(connection, transaction, sql, parameters);
        return await command.ExecuteNonQueryAsync(cancellationToken).ConfigureAwait(false);
    }

    /// <summary>Runs a query; returns the first column of the first row, or null.</summary>
    protected static async Task<object?> ScalarAsync(DbConnection connection, DbTransaction? transaction, string sql, CancellationToken cancellationToken, params (string Name, object? Value)[] parameters)
    {
        await using var command = Command(connection, transaction, sql, parameters);
        var value = await command.ExecuteScalarAsync(cancellationToken).ConfigureAwait(false);
        return value is DBNull ? null : value;
    }

    private static DbCommand Command(DbConnection connection, DbTransaction? transaction, string sql, params (string Name, object? Value)[] parameters)
    {
        var command = connection.CreateCommand();
#pragma warning disable CA2100 // The SQL is this class's own constant text; every value travels as a parameter.
        command.CommandText = sql;
#pragma warning restore CA2100
        command.Transaction = transaction;
        foreach (var (name, value) in parameters)
        {
            var parameter = command.CreateParameter();
            parameter.ParameterName = name;
            parameter.Value = value ?? DBNull.Value;
            parameter.DbType = value switch
            {
                long => DbType.Int64,
                int => DbType.Int32,
                _ => DbType.String,
            };
            command.Parameters.Add(parameter);
        }

        return command;
    }

    private static string Id(Guid id) => id.ToString("D");

    private static string Outcome(FeedbackOutcome outcome) => outcome == FeedbackOutcome.Accepted ? "accepted" : "overridden";

    private static FeedbackOutcome ParseOutcome(string text) => text == "accepted" ? FeedbackOutcome.Accepted : FeedbackOutcome.Overridden;
}
