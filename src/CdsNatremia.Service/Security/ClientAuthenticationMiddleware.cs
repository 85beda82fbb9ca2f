using Microsoft.AspNetCore.Mvc;

namespace CdsNatremia.Service.Security;

/// <summary>
/// Guards every path under /cds-services (discovery, services, feedback and whatever is added there later): a request
/// without an accepted bearer token gets 401 and a <c>WWW-Authenticate</c> challenge. The answer says only that the
/// token was not accepted; the log says why (never the token). CORS preflight requests, which carry no credentials by
/// design, pass through to the CORS middleware's answer. With no trusted client configured (Development only) the
/// guard lets every call through.
/// </summary>
internal sealed partial class ClientAuthenticationMiddleware(
    RequestDelegate next,
    ClientAuthenticator authenticator,
    IProblemDetailsService problemDetails,
    ILogger<ClientAuthenticationMiddleware> logger)
{
    /// <summary>HttpContext.Items key under which the accepted client's issuer is kept for the request log.</summary>
    public const string ClientItem = "natremia.client";

    public async Task InvokeAsync(HttpContext context)
    {
        if (!authenticator.Enforced || IsPreflight(context.Request))
        {
            await next(context).ConfigureAwait(false);
            return;
        }

        var result = await authenticator.AuthenticateAsync(context.Request, context.RequestAborted).ConfigureAwait(false);
        if (result.Succeeded)
        {
            context.Items[ClientItem] = result.Issuer;
            await next(context).ConfigureAwait(false);
            return;
        }

        LogRefused(logger, context.TraceIdentifier, result.Status, result.LogReason);
        if (result.LogReason.EndsWith("(replay)", StringComparison.Ordinal))
        {
            Telemetry.NatremiaTelemetry.RecordReplayRefusal();
        }

        context.Response.StatusCode = result.Status;
        string detail;
        if (result.Status == StatusCodes.Status401Unauthorized)
        {
            context.Response.Headers.WWWAuthenticate = result.MissingToken
                ? "Bearer realm=\"cds-services\""
                : "Bearer realm=\"cds-services\", error=\"invalid_token\"";
            detail = result.MissingToken
                ? "This service needs a bearer token signed by a trusted CDS client (CDS Hooks 2.0 security)."
                : "The bearer token was not accepted.";
        }
        else
        {
            context.Response.Headers.RetryAfter = "5";
            detail = "The service cannot check tokens right now; try again shortly.";
        }

        await problemDetails.WriteAsync(new ProblemDetailsContext
        {
            HttpContext = context,
            ProblemDetails = new ProblemDetails
            {
                Status = result.Status,
                Title = result.Status == StatusCodes.Status401Unauthorized ? "Unauthorized" : "Service unavailable",
                Detail = detail,
            },
        }).ConfigureAwait(false);
    }

    private static bool IsPreflight(HttpRequest request)
        => HttpMethods.IsOptions(request.Method)
           && request.Headers.Origin.Count > 0
           && request.Headers.AccessControlRequestMethod.Count > 0;

    [LoggerMessage(Level = LogLevel.Warning, Message = "Refused CDS client call (request {RequestId}, status {StatusCode}): {Reason}")]
    private static partial void LogRefused(ILogger logger, string requestId, int statusCode, string reason);
}
