using System.Text.Json;
using CdsNatremia.Audit.Feedback;
using CdsNatremia.Audit.Records;
using CdsNatremia.Audit.Storage;
using CdsNatremia.Service.Configuration;
using CdsNatremia.Service.Hooks;
using Microsoft.AspNetCore.Http.HttpResults;
using Microsoft.Extensions.Options;

namespace CdsNatremia.Service.Endpoints;

/// <summary>
/// POST /cds-services/{id}/feedback (CDS Hooks 2.0). 200 with an empty body when stored (the standard defines no
/// response body, and its JSON rule forbids an empty object where none is defined); 400 for a malformed body, 404 when
/// a card uuid was never issued (or is past retention), 422 when a card belongs to another service or an accepted
/// suggestion is not on its card. All or nothing: a refused request stores no entry.
/// </summary>
internal static class FeedbackEndpoints
{
    public static IEndpointRouteBuilder MapFeedback(this IEndpointRouteBuilder app)
    {
        app.MapPost("/cds-services/{id}/feedback", Receive).WithName("Feedback");
        return app;
    }

    public static async Task<Results<Ok, ProblemHttpResult>> Receive(
        string id,
        HttpRequest http,
        ServiceCatalog catalog,
        IAuditStore store,
        TimeProvider time,
        IOptions<NatremiaServiceOptions> options,
        CancellationToken cancellationToken)
    {
        var (service, document, problem) = await CdsRequestReader.ReadAsync(id, http, catalog, options.Value.MaxJsonDepth, cancellationToken).ConfigureAwait(false);
        if (problem is not null || service is null || document is null)
        {
            return problem!;
        }

        using (document)
        {
            var now = time.GetUtcNow();
            var entries = FeedbackParser.Parse(document.RootElement, now, out var problems);
            if (entries is null)
            {
                return Problems.Of(StatusCodes.Status400BadRequest, "Invalid CDS Hooks feedback", problems);
            }

            FeedbackResult result;
            try
            {
                result = await store.RecordFeedbackAsync(service.Id, entries, now, cancellationToken).ConfigureAwait(false);
            }
            catch (Exception ex) when (ex is System.Data.Common.DbException or IOException or TimeoutException)
            {
                // Not the client's fault, and nothing was stored: tell it to send the same feedback again later.
                return Problems.Of(StatusCodes.Status503ServiceUnavailable, "Audit trail unavailable", ["The feedback could not be stored now; nothing was recorded. Send it again shortly."]);
            }

            return result switch
            {
                FeedbackResult.Stored => TypedResults.Ok(),
                FeedbackResult.UnknownCard unknown => Problems.Of(StatusCodes.Status404NotFound, "Unknown card", unknown.Problems),
                FeedbackResult.Mismatch mismatch => Problems.Of(StatusCodes.Status422UnprocessableEntity, "Feedback does not match the card", mismatch.Problems),
                _ => throw new InvalidOperationException("Unknown feedback result."),
            };
        }
    }

}
