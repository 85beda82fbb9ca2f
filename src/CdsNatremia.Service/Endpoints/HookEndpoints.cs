using System.Text.Json;
using CdsNatremia.Audit;
using CdsNatremia.Audit.Storage;
using CdsNatremia.Service.Audit;
using CdsNatremia.Service.Configuration;
using CdsNatremia.Service.Hooks;
using CdsNatremia.Service.Security;
using Microsoft.AspNetCore.Http.HttpResults;
using Microsoft.Extensions.Options;

namespace CdsNatremia.Service.Endpoints;

/// <summary>POST /cds-services/{id}: run one service.</summary>
internal static class HookEndpoints
{
    public static IEndpointRouteBuilder MapHooks(this IEndpointRouteBuilder app)
    {
        app.MapPost("/cds-services/{id}", Invoke).WithName("InvokeService");
        return app;
    }

    public static async Task<Results<CardsResponse, ProblemHttpResult>> Invoke(
        string id,
        HttpRequest http,
        ServiceCatalog catalog,
        HookHandler handler,
        CardResponseWriter writer,
        CardAudit audit,
        RepeatSuppression repeats,
        Reports.CardReports reports,
        IOptions<Reports.ReportOptions> reportOptions,
        IOptions<ClientAuthenticationOptions> authOptions,
        IOptions<NatremiaServiceOptions> options,
        IOptions<InputLimitsOptions> limits,
        IOptions<AuditOptions> auditOptions,
        CancellationToken cancellationToken)
    {
        var (service, document, problem) = await CdsRequestReader.ReadAsync(id, http, catalog, options.Value.MaxJsonDepth, cancellationToken).ConfigureAwait(false);
        if (problem is not null || service is null || document is null)
        {
            return problem!;
        }

        using (document)
        {
            if (BundleEntryCounter.Exceeds(document.RootElement, limits.Value.MaxBundleEntries, out var entries))
            {
                return Problems.Of(StatusCodes.Status413PayloadTooLarge, "Too many Bundle entries", [$"Prefetch and context together hold more than {limits.Value.MaxBundleEntries} Bundle entries (counted {entries} before stopping); this service reads at most that many. Narrow the prefetch queries or send fewer draft orders."]);
            }

            var outcome = await handler.HandleAsync(service, document.RootElement, cancellationToken).ConfigureAwait(false);
            switch (outcome)
            {
                case HookOutcome.Invalid invalid:
                    return Problems.Of(StatusCodes.Status400BadRequest, "Invalid CDS Hooks request", invalid.Problems);
                case HookOutcome.MissingData missing:
                    return Problems.Of(StatusCodes.Status412PreconditionFailed, "Required data not available", missing.Problems);
                case HookOutcome.Cards decided:
                    var cards = decided with { Items = await repeats.ApplyAsync(service, decided.PatientId, decided.Now, decided.Items, cancellationToken).ConfigureAwait(false) };
                    var reportBase = reportOptions.Value.PublicBaseUrl ?? authOptions.Value.PublicBaseUrl ?? $"{http.Scheme}://{http.Host}";
                    var (body, issued) = writer.Write(cards.Items, cards.PatientId, cards.Now, reportBase);
                    // The audit record is committed before the answer leaves: no answered card without its record (docs/audit.md).
                    switch (await AuditRecorded(audit, service, document.RootElement, cards, issued, TestTraffic.IsMarked(http), cancellationToken).ConfigureAwait(false))
                    {
                        case AuditResult.Unavailable:
                            return Problems.Of(StatusCodes.Status503ServiceUnavailable, "Audit trail unavailable", ["The cards could not be recorded in the audit trail, so none are shown; try again shortly."]);
                        case AuditResult.QueueFull:
                            // Nothing was queued, so nothing is recorded and nothing is shown: the client retries after the pause.
                            var seconds = auditOptions.Value.QueueFullRetryAfterSeconds;
                            http.HttpContext.Response.Headers.RetryAfter = seconds.ToString(System.Globalization.CultureInfo.InvariantCulture);
                            return Problems.Of(StatusCodes.Status503ServiceUnavailable, "Audit trail busy", [$"Too many answers are waiting for their audit records, so none are shown for this request; try again in {seconds} s."]);
                    }

                    foreach (var card in issued.Where(c => c.ReportId is not null))
                    {
                        reports.Keep(card.ReportId!, card.Card.Report);
                    }

                    RequestLogItems.NoteCards(http.HttpContext, cards.Items);
                    return body;
                default:
                    throw new InvalidOperationException("Unknown hook outcome.");
            }
        }
    }

    private enum AuditResult
    {
        Recorded,
        Unavailable,
        QueueFull,
    }

    private static async Task<AuditResult> AuditRecorded(CardAudit audit, ServiceDefinition service, JsonElement root, HookOutcome.Cards cards, IReadOnlyList<IssuedCard> issued, bool testTraffic, CancellationToken cancellationToken)
    {
        try
        {
            // The parser has already validated hookInstance as a UUID.
            var hookInstance = root.GetProperty("hookInstance").GetGuid();
            await audit.RecordAsync(service, hookInstance, cards.PatientId, cards.Now, issued, testTraffic, cancellationToken).ConfigureAwait(false);
            return AuditResult.Recorded;
        }
        catch (AuditQueueFullException)
        {
            return AuditResult.QueueFull;
        }
        catch (Exception ex) when (ex is System.Data.Common.DbException or IOException or TimeoutException)
        {
            return AuditResult.Unavailable;
        }
    }

}
