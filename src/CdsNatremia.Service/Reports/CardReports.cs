using System.Buffers;
using System.Buffers.Text;
using System.IO.Compression;
using System.Security.Cryptography;
using System.Text;
using Microsoft.Extensions.Caching.Memory;
using Microsoft.Extensions.Options;

namespace CdsNatremia.Service.Reports;

/// <summary>
/// The full reports of answered cards, kept in memory for the card's link: a random 128-bit id (URL-safe base64, 22
/// characters) per card, reachable for <see cref="ReportOptions.KeepHours"/>, at most <see cref="ReportOptions.MaxReports"/>.
/// A report is kept only once its card's audit record is committed. Instance-local: behind a load balancer a link
/// opens on the instance that answered (sticky routing, or the SMART view; see docs/architecture.md). Each report is
/// held as Brotli-compressed UTF-8 (quality 1: about a fifth of the text's size for a few tens of microseconds), so a
/// full store stays a small part of the service's memory. Thread-safe.
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
        // The cache evicts on its own clock; the expiry that counts is checked on the service's clock in Find.
        _cache.Set(id, new Entry(Compress(markdown), expires), new MemoryCacheEntryOptions { Size = 1, AbsoluteExpirationRelativeToNow = TimeSpan.FromHours(_options.KeepHours) });
    }

    /// <summary>The report under <paramref name="id"/>, or null when unknown or expired.</summary>
    public string? Find(string id)
        => IsWellFormed(id) && _cache.TryGetValue(id, out Entry? entry) && entry is not null && entry.Expires > _time.GetUtcNow()
            ? Decompress(entry.Report)
            : null;

    private const int Quality = 1;
    private const int Window = 22;

    /// <summary>The text's UTF-8 length (4 bytes, little-endian), then its Brotli compression.</summary>
    private static byte[] Compress(string markdown)
    {
        var utf8 = ArrayPool<byte>.Shared.Rent(Encoding.UTF8.GetMaxByteCount(markdown.Length));
        var packed = ArrayPool<byte>.Shared.Rent(4 + BrotliEncoder.GetMaxCompressedLength(Encoding.UTF8.GetMaxByteCount(markdown.Length)));
        try
        {
            var length = Encoding.UTF8.GetBytes(markdown, utf8);
            BitConverter.TryWriteBytes(packed.AsSpan(0, 4), length);
            if (!BrotliEncoder.TryCompress(utf8.AsSpan(0, length), packed.AsSpan(4), out var written, Quality, Window))
            {
                throw new InvalidOperationException("A report could not be compressed into a buffer of its maximum compressed size.");
            }

            return packed.AsSpan(0, 4 + written).ToArray();
        }
        finally
        {
            ArrayPool<byte>.Shared.Return(utf8);
            ArrayPool<byte>.Shared.Return(packed);
        }
    }

    private static string Decompress(byte[] packed)
    {
        var length = BitConverter.ToInt32(packed, 0);
        var utf8 = ArrayPool<byte>.Shared.Rent(Math.Max(length, 1));
        try
        {
            if (!BrotliDecoder.TryDecompress(packed.AsSpan(4), utf8.AsSpan(0, length), out var written) || written != length)
            {
                throw new InvalidOperationException("A kept report could not be decompressed to its recorded length.");
            }

            return Encoding.UTF8.GetString(utf8, 0, length);
        }
        finally
        {
            ArrayPool<byte>.Shared.Return(utf8);
        }
    }

    /// <inheritdoc />
    public void Dispose() => _cache.Dispose();

    private sealed record Entry(byte[] Report, DateTimeOffset Expires);
}
