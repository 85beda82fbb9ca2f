using CdsNatremia.Service.Hooks;

namespace CdsNatremia.Service.Security;

/// <summary>
/// One structured log line per request: request id, method, route template (never the raw path or query, which a
/// caller could fill with anything), the CDS service id when it is one of ours, the client's issuer, status, timing,
/// card count and rule ids. It never reads the body, headers or the patient's data, so nothing from them can reach
/// the log.
/// </summary>
internal sealed partial class RequestLogMiddleware(RequestDelegate next, ServiceCatalog catalog, TimeProvider time, ILogger<RequestLogMiddleware> logger)
{
    public async Task InvokeAsync(HttpContext context)
    {
        var started = time.GetTimestamp();

        // Routing has run already; read the route now, as an exception handler clears it on its way out.
        var route = (context.GetEndpoint() as RouteEndpoint)?.RoutePattern.RawText ?? "(no endpoint)";
        var id = context.Request.RouteValues.TryGetValue("id", out var value) && value is string text && catalog.Find(text) is { } service
            ? service.Id
            : "-";
        try
        {
            await next(context).ConfigureAwait(false);
        }
        finally
        {
            var elapsed = time.GetElapsedTime(started);
            LogRequest(
                logger,
                context.TraceIdentifier,
                context.Request.Method,
                route,
                id,
                context.Items.TryGetValue(ClientAuthenticationMiddleware.ClientItem, out var client) ? client as string ?? "-" : "-",
                context.Response.StatusCode,
                Math.Round(elapsed.TotalMilliseconds, 1),
                context.Items.TryGetValue(RequestLogItems.CardCount, out var cards) ? cards as int? ?? 0 : 0,
                context.Items.TryGetValue(RequestLogItems.RuleIds, out var rules) ? rules as string ?? "-" : "-");
        }
    }

    [LoggerMessage(
        Level = LogLevel.Information,
        Message = "Request {RequestId} {Method} {Route} service {ServiceId} client {ClientIssuer}: {StatusCode} in {ElapsedMs} ms, {CardCount} cards, rules {RuleIds}")]
    private static partial void LogRequest(
        ILogger logger, string requestId, string method, string route, string serviceId, string clientIssuer, int statusCode, double elapsedMs, int cardCount, string ruleIds);
}
