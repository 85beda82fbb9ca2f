using System.Net;
using CdsNatremia.Service.Reports;
using Markdig;

namespace CdsNatremia.Service.Endpoints;

/// <summary>
/// GET /reports/{reportId}: the full report behind a card's link, as a plain HTML page (Markdown rendered with raw HTML
/// disabled, so nothing in the data becomes markup), never cached, with a strict Content-Security-Policy. An unknown or
/// expired id answers 404 with a page that says so (no hint whether it ever existed).
/// </summary>
public static class CardReportEndpoints
{
    /// <summary>The route of the report page.</summary>
    public const string Route = "/reports/{reportId}";

    private static readonly MarkdownPipeline Pipeline = new MarkdownPipelineBuilder().DisableHtml().UsePipeTables().Build();

    /// <summary>Maps the route.</summary>
    public static IEndpointRouteBuilder MapCardReports(this IEndpointRouteBuilder app)
    {
        app.MapGet(Route, Show).WithName("CardReport");
        return app;
    }

    private static IResult Show(string reportId, HttpContext http, CardReports reports)
    {
        var headers = http.Response.Headers;
        headers.CacheControl = "no-store";
        headers["Content-Security-Policy"] = "default-src 'none'; style-src 'unsafe-inline'; base-uri 'none'; form-action 'none'; frame-ancestors 'self'";
        headers["X-Content-Type-Options"] = "nosniff";
        headers["Referrer-Policy"] = "no-referrer";
        var markdown = reports.Find(reportId);
        if (markdown is null)
        {
            return Results.Content(Page("Report not available", "<p>This report is not available: it has expired or the link is wrong. Open the patient's chart again for a fresh card.</p>"), "text/html; charset=utf-8", statusCode: StatusCodes.Status404NotFound);
        }

        return Results.Content(Page("Sodium decision support: full report", Markdown.ToHtml(markdown, Pipeline)), "text/html; charset=utf-8");
    }

    private static string Page(string title, string body)
        => "<!DOCTYPE html><html lang=\"en\"><head><meta charset=\"utf-8\"><meta name=\"robots\" content=\"noindex\"><title>"
            + WebUtility.HtmlEncode(title)
            + "</title><style>body{font-family:system-ui,sans-serif;max-width:52rem;margin:2rem auto;padding:0 1rem;line-height:1.45;color:#1b1b1b}li{margin:.2rem 0}</style></head><body>"
            + body + "</body></html>";
}
