using System.Buffers.Text;
using System.Security.Cryptography;
using Microsoft.Extensions.Caching.Memory;
using Microsoft.Extensions.Options;

namespace CdsNatremia.Service.Reports;

/// <summary>
/// The full reports of answered cards, kept in memory for the card's link: a random 128-bit id (URL-safe base64, 22
/// characters) per card, reachable for <see cref="ReportOptions.KeepHours"/>, at most <see cref="ReportOptions.MaxReports"/>.
/// A report is kept only once its card's audit record is committed. Instance-local: behind a load balancer a link
/// opens on the instance that answered (sticky routing, or the SMART view; see docs/architecture.md). Thread-safe.
/// </summary>
public sealed class CardReports : IDisposable
{
    private readonly MemoryCache _cache;
    private readonly ReportOptions _options;
    private readonly TimeProvider _time;

    /// <summary>Creates the store.</summary>
    public CardReports(IOptions<ReportOptions> options, TimeProvider time)
    {
        _options = options.Value;
        _time = time;
        _cache = new MemoryCache(new MemoryCacheOptions { SizeLimit = _options.MaxReports, Clock = null });
    }

    /// <summary>A new random report id.</summary>
    public static string NewId() => Base64Url.EncodeToString(RandomNumberGenerator.GetBytes(16));

    /// <summary>True when <paramref name="id"/> has the shape of a report id (so nothing else reaches the cache).</summary>
    public static bool IsWellFormed(string? id)
        => id is { Length: 22 } && id.All(c => char.IsAsciiLetterOrDigit(c) || c is '-' or '_');

    /// <summary>Keeps <paramref name="markdown"/> under <paramref name="id"/>.</summary>
    public void Keep(string id, string markdown)
    {
        ArgumentNullException.ThrowIfNull(markdown);
        var expires = _time.GetUtcNow().AddHours(_options.KeepHours);
        _cache.Set(id, new Entry(markdown, expires), new MemoryCacheEntryOptions { Size = 1, AbsoluteExpiration = expires });
    }

    /// <summary>The report under <paramref name="id"/>, or null when unknown or expired.</summary>
    public string? Find(string id)
        => IsWellFormed(id) && _cache.TryGetValue(id, out Entry? entry) && entry is not null && entry.Expires > _time.GetUtcNow()
            ? entry.Markdown
            : null;

    /// <inheritdoc />
    public void Dispose() => _cache.Dispose();

    private sealed record Entry(string Markdown, DateTimeOffset Expires);
}
