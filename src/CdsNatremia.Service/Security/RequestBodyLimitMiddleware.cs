using Microsoft.AspNetCore.Http.Features;
using Microsoft.Extensions.Options;

namespace CdsNatremia.Service.Security;

/// <summary>
/// Enforces <see cref="InputLimitsOptions.MaxRequestBodyBytes"/>: a declared length beyond it is refused before the
/// body is read; otherwise the server's own limit is set (Kestrel) and the body is wrapped so that a chunked body is
/// cut off as soon as it passes the limit. The 413 comes from <c>ClientErrorExceptionHandler</c>.
/// </summary>
internal sealed class RequestBodyLimitMiddleware(RequestDelegate next, IOptions<InputLimitsOptions> options)
{
    public Task InvokeAsync(HttpContext context)
    {
        var limit = options.Value.MaxRequestBodyBytes;
        if (context.Request.ContentLength > limit)
        {
            throw new BadHttpRequestException("Request body too large.", StatusCodes.Status413PayloadTooLarge);
        }

        if (context.Features.Get<IHttpMaxRequestBodySizeFeature>() is { IsReadOnly: false } feature)
        {
            feature.MaxRequestBodySize = limit;
        }

        context.Request.Body = new LimitedRequestBodyStream(context.Request.Body, limit);
        return next(context);
    }
}
