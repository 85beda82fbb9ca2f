using System.Collections.Concurrent;
using System.Security.Cryptography;

namespace CdsNatremia.Service.Course;

/// <summary>A launch sent to the EHR's authorization server and not yet back: what the callback must match.</summary>
/// <param name="State">The unguessable state sent with the authorization request.</param>
/// <param name="CodeVerifier">The PKCE code verifier (its S256 challenge was sent).</param>
/// <param name="Ehr">The EHR the launch came from.</param>
/// <param name="Issuer">The iss, as configured.</param>
/// <param name="TokenEndpoint">From the EHR's SMART configuration.</param>
/// <param name="RedirectUri">The redirect_uri sent (must be sent again with the code).</param>
/// <param name="ExpiresAt">When the launch is no longer accepted.</param>
public sealed record PendingLaunch(string State, string CodeVerifier, SmartEhrOptions Ehr, string Issuer, Uri TokenEndpoint, string RedirectUri, DateTimeOffset ExpiresAt);

/// <summary>A completed launch: the token and the patient, kept in server memory only. Never logged.</summary>
/// <param name="Issuer">The EHR's FHIR base URL.</param>
/// <param name="ClientId">The client id the token was issued to.</param>
/// <param name="AccessToken">The access token.</param>
/// <param name="Scope">The granted scope.</param>
/// <param name="PatientId">The patient in context.</param>
/// <param name="ExpiresAt">When the session ends (the earlier of the token's end and the session lifetime).</param>
public sealed record CourseSession(string Issuer, string ClientId, string AccessToken, string Scope, string PatientId, DateTimeOffset ExpiresAt)
{
    /// <inheritdoc />
    public override string ToString() => "CourseSession { (hidden) }";
}

/// <summary>
/// Pending launches and sessions, by random id, in this process's memory only: a restart ends every session, and a fleet
/// needs sticky routing for the view (docs/sodium-course-view.md). Expired entries are dropped when met and on each add.
/// </summary>
public sealed class CourseSessions
{
    /// <summary>Most entries of each kind kept at once; the oldest are dropped beyond it.</summary>
    public const int MaxEntries = 10_000;

    private readonly ConcurrentDictionary<string, PendingLaunch> _pending = new(StringComparer.Ordinal);
    private readonly ConcurrentDictionary<string, CourseSession> _sessions = new(StringComparer.Ordinal);
    private readonly TimeProvider _time;

    /// <summary>Creates the store on a clock.</summary>
    public CourseSessions(TimeProvider time) => _time = time;

    /// <summary>A new random id (256 bits, URL-safe).</summary>
    public static string NewId() => Base64Url(RandomNumberGenerator.GetBytes(32));

    /// <summary>URL-safe base64 without padding.</summary>
    public static string Base64Url(byte[] bytes) => Convert.ToBase64String(bytes).TrimEnd('=').Replace('+', '-').Replace('/', '_');

    /// <summary>Keeps a pending launch; returns its id (for the launch cookie).</summary>
    public string AddPending(PendingLaunch launch)
    {
        Sweep(_pending, p => p.ExpiresAt);
        var id = NewId();
        _pending[id] = launch;
        return id;
    }

    /// <summary>Takes a pending launch out (one use only); null when unknown or expired.</summary>
    public PendingLaunch? TakePending(string? id)
    {
        if (string.IsNullOrEmpty(id) || !_pending.TryRemove(id, out var launch))
        {
            return null;
        }

        return launch.ExpiresAt > _time.GetUtcNow() ? launch : null;
    }

    /// <summary>Keeps a session; returns its id (for the session cookie).</summary>
    public string AddSession(CourseSession session)
    {
        Sweep(_sessions, s => s.ExpiresAt);
        var id = NewId();
        _sessions[id] = session;
        return id;
    }

    /// <summary>The live session of an id, or null when unknown or expired (an expired one is dropped).</summary>
    public CourseSession? Session(string? id)
    {
        if (string.IsNullOrEmpty(id) || !_sessions.TryGetValue(id, out var session))
        {
            return null;
        }

        if (session.ExpiresAt > _time.GetUtcNow())
        {
            return session;
        }

        _sessions.TryRemove(id, out _);
        return null;
    }

    /// <summary>Ends a session.</summary>
    public void End(string? id)
    {
        if (!string.IsNullOrEmpty(id))
        {
            _sessions.TryRemove(id, out _);
        }
    }

    private void Sweep<T>(ConcurrentDictionary<string, T> entries, Func<T, DateTimeOffset> expiresAt)
    {
        var now = _time.GetUtcNow();
        foreach (var (key, value) in entries)
        {
            if (expiresAt(value) <= now)
            {
                entries.TryRemove(key, out _);
            }
        }

        if (entries.Count >= MaxEntries)
        {
            foreach (var key in entries.OrderBy(e => expiresAt(e.Value)).Take(entries.Count - MaxEntries + 1).Select(e => e.Key).ToList())
            {
                entries.TryRemove(key, out _);
            }
        }
    }
}
