namespace CdsNatremia.Audit.Storage;

/// <summary>
/// The schema, as numbered migrations applied in order at start-up and recorded in <c>schema_version</c>. The SQL is
/// the common subset of SQLite and PostgreSQL (TEXT, BIGINT, ON CONFLICT), so both databases hold the same tables.
/// Times are BIGINT milliseconds since 1970-01-01 UTC; uuids are lowercase text; lists are JSON text.
/// A new version is appended here, never an old one edited.
/// </summary>
internal static class AuditSchema
{
    public const string VersionTable = "CREATE TABLE IF NOT EXISTS schema_version (version INTEGER NOT NULL PRIMARY KEY, applied_at_ms BIGINT NOT NULL)";

    public static IReadOnlyList<(int Version, string[] Statements)> Migrations { get; } =
    [
        (1,
        [
            """
            CREATE TABLE issued_card (
                card_uuid TEXT NOT NULL PRIMARY KEY,
                service_id TEXT NOT NULL,
                hook TEXT NOT NULL,
                hook_instance TEXT NOT NULL,
                patient_pseudonym TEXT NOT NULL,
                rule_ids TEXT NOT NULL,
                knowledge_version TEXT NOT NULL,
                software_version TEXT NOT NULL,
                indicator TEXT NOT NULL,
                topic TEXT NOT NULL,
                summary TEXT NOT NULL,
                resources_used TEXT NOT NULL,
                suggestion_uuids TEXT NOT NULL,
                issued_at_ms BIGINT NOT NULL)
            """,
            "CREATE INDEX ix_issued_card_issued_at ON issued_card (issued_at_ms)",
            "CREATE TABLE card_rule (card_uuid TEXT NOT NULL, rule_id TEXT NOT NULL, PRIMARY KEY (card_uuid, rule_id))",
            "CREATE INDEX ix_card_rule_rule ON card_rule (rule_id)",
            "CREATE TABLE card_suggestion (suggestion_uuid TEXT NOT NULL PRIMARY KEY, card_uuid TEXT NOT NULL, suggestion_key TEXT NOT NULL)",
            "CREATE INDEX ix_card_suggestion_card ON card_suggestion (card_uuid)",
            """
            CREATE TABLE feedback (
                feedback_key TEXT NOT NULL PRIMARY KEY,
                card_uuid TEXT NOT NULL,
                service_id TEXT NOT NULL,
                outcome TEXT NOT NULL,
                accepted_suggestions TEXT NOT NULL,
                reason_system TEXT,
                reason_code TEXT,
                reason_display TEXT,
                user_comment TEXT,
                outcome_at_ms BIGINT NOT NULL,
                received_at_ms BIGINT NOT NULL)
            """,
            "CREATE INDEX ix_feedback_card ON feedback (card_uuid)",
        ]),
        // Test traffic (requests the toolkit marks, docs/audit.md "Test traffic") is kept, flagged, and left out of reports.
        (2,
        [
            "ALTER TABLE issued_card ADD COLUMN test_traffic INTEGER NOT NULL DEFAULT 0",
        ]),

        (3,
        [
            // Which pseudonym key made each pseudonym (records from before this version keep '' = unknown key), and a
            // look-up of one patient's cards across key rotations.
            "ALTER TABLE issued_card ADD COLUMN pseudonym_key_id TEXT NOT NULL DEFAULT ''",
            "CREATE INDEX ix_issued_card_patient ON issued_card (patient_pseudonym)",

            // Token ids (jti) already used, shared by every instance on PostgreSQL (unused on SQLite, whose single
            // process keeps them in memory); a row is deleted once its token has expired.
            "CREATE TABLE used_token (issuer TEXT NOT NULL, jti TEXT NOT NULL, expires_at_ms BIGINT NOT NULL, PRIMARY KEY (issuer, jti))",
            "CREATE INDEX ix_used_token_expires ON used_token (expires_at_ms)",
        ]),

        // Advice that is not repeated: each issued card's findings fingerprint under the patient pseudonym.
        (4,
        [
            "CREATE TABLE card_fingerprint (card_uuid TEXT NOT NULL PRIMARY KEY, patient_pseudonym TEXT NOT NULL, fingerprint TEXT NOT NULL)",
            "CREATE INDEX ix_card_fingerprint_patient ON card_fingerprint (patient_pseudonym, fingerprint)",
        ]),

        // The last time a clinician answered a card of each findings fingerprint for each patient, kept as feedback is
        // recorded, so a chart opening asks one primary-key row instead of joining every card the patient ever had with
        // that fingerprint (a chart opened often had thousands). Filled from the feedback already stored.
        (5,
        [
            "CREATE TABLE reviewed_fingerprint (patient_pseudonym TEXT NOT NULL, fingerprint TEXT NOT NULL, reviewed_at_ms BIGINT NOT NULL, PRIMARY KEY (patient_pseudonym, fingerprint))",
            """
            INSERT INTO reviewed_fingerprint (patient_pseudonym, fingerprint, reviewed_at_ms)
            SELECT c.patient_pseudonym, c.fingerprint, MAX(f.outcome_at_ms) FROM feedback f JOIN card_fingerprint c ON c.card_uuid = f.card_uuid
            GROUP BY c.patient_pseudonym, c.fingerprint
            """,
        ]),
    ];

    public static int CurrentVersion => Migrations[^1].Version;
}
