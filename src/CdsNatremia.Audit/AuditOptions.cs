using System.ComponentModel.DataAnnotations;

namespace CdsNatremia.Audit;

/// <summary>Audit trail settings, bound from the "Natremia:Audit" configuration section.</summary>
public sealed class AuditOptions
{
    /// <summary>The configuration section.</summary>
    public const string Section = "Natremia:Audit";

    /// <summary>
    /// Folder for the embedded SQLite database and, in Development only, the generated pseudonym key. Relative paths
    /// are taken from the content root. Default "data" (so <c>data/audit.db</c> under the content root).
    /// </summary>
    [Required]
    public string DataDirectory { get; set; } = "data";

    /// <summary>SQLite file name inside <see cref="DataDirectory"/>. Default "audit.db".</summary>
    [Required]
    [RegularExpression("^[A-Za-z0-9._-]+$")]
    public string SqliteFileName { get; set; } = "audit.db";

    /// <summary>
    /// PostgreSQL connection string. When set, the audit goes to PostgreSQL instead of SQLite (several service
    /// instances behind a load balancer share it). Default: not set.
    /// </summary>
    public string? PostgresConnectionString { get; set; }

    /// <summary>
    /// Secret key for the patient pseudonym (HMAC-SHA256 of the patient id), at least 32 characters. Required outside
    /// Development; in Development a random key is generated once and kept in <c>{DataDirectory}/pseudonym.key</c>.
    /// Changing it breaks the link between old and new pseudonyms of the same patient.
    /// </summary>
    [MinLength(32)]
    public string? PseudonymKey { get; set; }

    /// <summary>
    /// Keys used before a rotation, kept so one patient's older records can still be found (they make no new
    /// pseudonym). Every record stores the id of the key that made its pseudonym. Default: none.
    /// </summary>
    public IList<string> PreviousPseudonymKeys { get; } = [];

    /// <summary>
    /// Days an issued-card record and its feedback are kept before the purge deletes them. Default 730 (two years),
    /// a neutral starting point: each site sets its own records-retention period.
    /// </summary>
    [Range(1, 36500)]
    public int RetentionDays { get; set; } = 730;

    /// <summary>
    /// Hours during which a chart-opening card whose findings a clinician already answered (accepted or overridden) for the
    /// same patient is shown as information instead of interrupting again. Default 24, a local choice; 0 turns it off.
    /// </summary>
    [System.ComponentModel.DataAnnotations.Range(0, 720)]
    public int RepeatQuietHours { get; set; } = 24;

    /// <summary>Hours between two purges by the background service. Default 24.</summary>
    [Range(1, 24 * 31)]
    public int PurgeIntervalHours { get; set; } = 24;

    /// <summary>
    /// Group commit of issued-card records: one writer takes the records of every answer waiting at that moment and
    /// commits them in one transaction (one disk flush), then releases those answers. Each answer still waits until
    /// its own record is durable. Default true; false writes each answer's records in a transaction of its own (the
    /// behaviour before group commit, kept for comparison and for a site that wants it).
    /// </summary>
    public bool GroupCommit { get; set; } = true;

    /// <summary>
    /// Answers that may wait for the group-commit writer at once (1 to 100000). When the queue is full the hook answers
    /// 503 with <c>Retry-After</c>: a record is never dropped, the answer is refused instead. Default 1024, far above the
    /// answers a 2-core instance has in flight (at 32 connections, at most 32 wait).
    /// </summary>
    [Range(1, 100_000)]
    public int WriteQueueCapacity { get; set; } = 1024;

    /// <summary>
    /// Most answers whose records share one transaction (1 to 10000). Default 256: a batch of typical answers (one
    /// or two cards each) commits in a few milliseconds on SQLite and PostgreSQL, so the first answer of a batch
    /// never waits long for the last.
    /// </summary>
    [Range(1, 10_000)]
    public int MaxAnswersPerCommit { get; set; } = 256;

    /// <summary>
    /// Seconds a client is asked to wait (<c>Retry-After</c>) when the write queue is full (1 to 60). Default 1:
    /// the queue drains in milliseconds once the disk catches up.
    /// </summary>
    [Range(1, 60)]
    public int QueueFullRetryAfterSeconds { get; set; } = 1;

    /// <summary>
    /// Key an administrator sends in the <c>X-Natremia-Admin-Key</c> header to read reports, at least 32 characters.
    /// Default: not set, and then the report endpoint refuses every call.
    /// </summary>
    [MinLength(32)]
    public string? AdminApiKey { get; set; }
}
