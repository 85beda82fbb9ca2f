using System.Net;

namespace CdsNatremia.Service.Tests.Support;

/// <summary>A request body that announces no length, as a chunked upload does: the server learns its size only by reading.</summary>
public sealed class UnsizedContent(byte[] bytes, string mediaType = "application/json") : HttpContent
{
    public UnsizedContent(string text)
        : this(System.Text.Encoding.UTF8.GetBytes(text))
    {
    }

    protected override void SerializeToStream(Stream stream, TransportContext? context, CancellationToken cancellationToken)
    {
        Headers.ContentType ??= new System.Net.Http.Headers.MediaTypeHeaderValue(mediaType);
        stream.Write(bytes);
    }

    protected override Task SerializeToStreamAsync(Stream stream, TransportContext? context)
        => stream.WriteAsync(bytes).AsTask();

    protected override bool TryComputeLength(out long length)
    {
        length = 0;
        return false;
    }
}
