namespace CdsNatremia.Service.Fetching;

/// <summary>
/// The one log line per fetched key. It names the key (our own constant), the server's origin, the outcome, the last
/// HTTP status, pages, retries and duration: never the patient id, the query string or the token.
/// </summary>
internal static partial class FetchLog
{
    [LoggerMessage(EventId = 6001, Level = LogLevel.Information,
        Message = "FHIR fetch of '{Key}' from {Origin}: {Outcome}, HTTP {Status}, {Pages} page(s), {Retries} retries, {ElapsedMs} ms")]
    public static partial void Fetched(ILogger logger, string key, string origin, string outcome, int status, int pages, int retries, long elapsedMs);

    [LoggerMessage(EventId = 6002, Level = LogLevel.Warning,
        Message = "FHIR fetch not attempted for {Keys} key(s): {Reason}")]
    public static partial void NotAttempted(ILogger logger, int keys, string reason);
}
