using System.Globalization;
using System.Security.Cryptography;
using System.Text;
using CdsNatremia.Audit;
using CdsNatremia.Audit.Reports;
using CdsNatremia.Audit.Storage;
using CdsNatremia.Service.Hooks;
using Microsoft.AspNetCore.Http.HttpResults;
using Microsoft.Extensions.Options;

namespace CdsNatremia.Service.Endpoints;

/// <summary>
/// GET /admin/reports/overrides?from=YYYY-MM-DD&amp;to=YYYY-MM-DD[&amp;service=id][&amp;includeTest=true]: the override
/// report as JSON, for cards issued from the start of <c>from</c> to the end of <c>to</c> (UTC days, both included);
/// cards marked as test traffic are left out (and counted) unless <c>includeTest=true</c>. Outside the CDS Hooks
/// paths on purpose (the standard defines every path under /cds-services). Protected by the configured admin key in
/// the <c>X-Natremia-Admin-Key</c> header: no key configured → 403 for everyone; missing or wrong key → 401.
/// </summary>
internal static class AdminReportEndpoints
{
    public const string KeyHeader = "X-Natremia-Admin-Key";

    /// <summary>Longest range one report covers, in days.</summary>
    public const int MaxDays = 731;

    public static IEndpointRouteBuilder MapAdminReports(this IEndpointRouteBuilder app)
    {
        app.MapGet("/admin/reports/overrides", Overrides).WithName("OverrideReport");
        return app;
    }

    public static async Task<Results<Ok<OverrideReport>, ProblemHttpResult>> Overrides(
        HttpRequest http,
        IAuditStore store,
        ServiceCatalog catalog,
        IOptions<AuditOptions> options,
        CancellationToken cancellationToken)
    {
        if (Refusal(http, options.Value) is { } refused)
        {
            return refused;
        }

        var problems = new List<string>();
        var from = Day(http.Query["from"], "from", problems);
        var to = Day(http.Query["to"], "to", problems);
        string? service = http.Query["service"];
        var includeTest = IncludeTest(http.Query["includeTest"], problems);
        if (service is not null && catalog.Find(service) is null)
        {
            problems.Add($"'service': no CDS service has the id '{(service.Length <= 64 ? service : service[..64] + "…")}'.");
        }

        if (from is { } start && to is { } end)
        {
            if (end < start)
            {
                problems.Add("'to' must not be before 'from'.");
            }
            else if ((end - start).TotalDays + 1 > MaxDays)
            {
                problems.Add($"The range covers more than {MaxDays} days; ask for a shorter one.");
            }
        }

        if (problems.Count > 0 || from is null || to is null)
        {
            return Problems.Of(StatusCodes.Status400BadRequest, "Invalid report request", problems);
        }

        var report = await store.ReportAsync(from.Value, to.Value.AddDays(1), service, includeTest, cancellationToken).ConfigureAwait(false);
        return TypedResults.Ok(report);
    }

    private static ProblemHttpResult? Refusal(HttpRequest http, AuditOptions options)
    {
        if (string.IsNullOrEmpty(options.AdminApiKey))
        {
            return Problems.Of(StatusCodes.Status403Forbidden, "Reports disabled", ["No admin key is configured (Natremia:Audit:AdminApiKey), so reports are refused to everyone."]);
        }

        var sent = http.Headers[KeyHeader].ToString();
        if (sent.Length == 0 || !CryptographicOperations.FixedTimeEquals(
                SHA256.HashData(Encoding.UTF8.GetBytes(sent)), SHA256.HashData(Encoding.UTF8.GetBytes(options.AdminApiKey))))
        {
            http.HttpContext.Response.Headers.WWWAuthenticate = KeyHeader;
            return Problems.Of(StatusCodes.Status401Unauthorized, "Admin key required", [$"Send the configured admin key in the {KeyHeader} header."]);
        }

        return null;
    }

    private static bool IncludeTest(string? text, List<string> problems)
    {
        switch (text?.ToLowerInvariant())
        {
            case null or "" or "false":
                return false;
            case "true":
                return true;
            default:
                problems.Add($"'includeTest' must be true or false (got '{(text.Length <= 32 ? text : text[..32] + "…")}').");
                return false;
        }
    }

    private static DateTimeOffset? Day(string? text, string name, List<string> problems)
    {
        if (string.IsNullOrEmpty(text))
        {
            problems.Add($"'{name}' is required (a UTC date, YYYY-MM-DD).");
            return null;
        }

        if (!DateOnly.TryParseExact(text, "yyyy-MM-dd", CultureInfo.InvariantCulture, DateTimeStyles.None, out var day))
        {
            problems.Add($"'{name}' must be a date as YYYY-MM-DD (got '{(text.Length <= 32 ? text : text[..32] + "…")}').");
            return null;
        }

        return new DateTimeOffset(day.ToDateTime(TimeOnly.MinValue), TimeSpan.Zero);
    }
}
