using Microsoft.AspNetCore.Diagnostics;
using Microsoft.AspNetCore.Mvc;

namespace CdsNatremia.Service.Configuration;

/// <summary>
/// Maps errors a client caused (body too large, connection cut, bad request framing) to their 4xx status, so nothing a
/// client sends can produce a 500. Anything else is left to the default handler and logged as a server fault.
/// </summary>
internal sealed class ClientErrorExceptionHandler(IProblemDetailsService problemDetails) : IExceptionHandler
{
    public async ValueTask<bool> TryHandleAsync(HttpContext httpContext, Exception exception, CancellationToken cancellationToken)
    {
        var status = exception switch
        {
            BadHttpRequestException bad => bad.StatusCode,
            OperationCanceledException when httpContext.RequestAborted.IsCancellationRequested => 499,
            _ => 0,
        };
        if (status == 0)
        {
            return false;
        }

        httpContext.Response.StatusCode = status;
        return await problemDetails.TryWriteAsync(new ProblemDetailsContext
        {
            HttpContext = httpContext,
            ProblemDetails = new ProblemDetails
            {
                Status = status,
                Title = status == StatusCodes.Status413PayloadTooLarge ? "Request body too large" : "Bad request",
                Detail = status == StatusCodes.Status413PayloadTooLarge
                    ? "The request body is larger than this service accepts."
                    : "The request could not be read.",
            },
        }).ConfigureAwait(false);
    }
}
