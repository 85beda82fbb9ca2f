namespace CdsNatremia.Service.Fetching;

/// <summary>
/// What one HTTP attempt brought back: the status, the headers the fetch needs, and the body of a 2xx answer read
/// up to the byte cap (never the body of an error or a redirect: it is not used and may be large).
/// </summary>
/// <param name="Status">The HTTP status code.</param>
/// <param name="ContentType">The media type of the body, without parameters.</param>
/// <param name="RetryAfter">The delay the server asked for with Retry-After, when it gave one.</param>
/// <param name="Body">The body of a 2xx answer; null otherwise, or when it was over the cap.</param>
/// <param name="Oversize">Whether the body was larger than the cap (and was not read further).</param>
internal sealed record FhirResponse(int Status, string? ContentType, TimeSpan? RetryAfter, byte[]? Body, bool Oversize)
{
    /// <summary>Whether a retry may succeed where this attempt failed: 408, 429 and 5xx.</summary>
    public bool IsTransientFailure => Status is 408 or 429 or >= 500;
}
