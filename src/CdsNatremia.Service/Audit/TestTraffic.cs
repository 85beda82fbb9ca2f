namespace CdsNatremia.Service.Audit;

/// <summary>
/// The marker of test traffic: a hook request carrying the header <c>X-Natremia-Test-Traffic: true</c> is answered like
/// any other, and its cards are recorded with the test flag, so governance reports leave them out unless asked
/// (docs/audit.md, "Test traffic"). The natremia toolkit sends it on every request. It changes no answer, and it
/// hides nothing: flagged cards stay in the trail and are counted in every report.
/// </summary>
public static class TestTraffic
{
    /// <summary>The request header that marks test traffic.</summary>
    public const string Header = "X-Natremia-Test-Traffic";

    /// <summary>The one value that marks it (case-insensitive); any other value is ordinary traffic.</summary>
    public const string Value = "true";

    /// <summary>True when the request carries the marker.</summary>
    public static bool IsMarked(HttpRequest request)
    {
        ArgumentNullException.ThrowIfNull(request);
        return request.Headers.TryGetValue(Header, out var values)
            && values.Count == 1
            && string.Equals(values[0]?.Trim(), Value, StringComparison.OrdinalIgnoreCase);
    }
}
