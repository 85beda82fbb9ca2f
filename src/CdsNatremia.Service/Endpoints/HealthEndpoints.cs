using CdsNatremia.Service.Knowledge;
using Microsoft.AspNetCore.Http.HttpResults;

namespace CdsNatremia.Service.Endpoints;

/// <summary>/healthz (the process answers) and /readyz (knowledge and configuration loaded).</summary>
internal static class HealthEndpoints
{
    public static IEndpointRouteBuilder MapHealth(this IEndpointRouteBuilder app)
    {
        app.MapGet("/healthz", () => TypedResults.Ok(new { status = "alive" }));
        app.MapGet("/readyz", Ready);
        return app;
    }

    public static Results<Ok<ReadyBody>, JsonHttpResult<ReadyBody>> Ready(KnowledgeState knowledge)
        => knowledge.Current is { } loaded
            ? TypedResults.Ok(new ReadyBody("ready", loaded.Base.Version, loaded.Base.Sets.Count, loaded.ManifestVersion))
            : TypedResults.Json(new ReadyBody("loading", null, 0, null), statusCode: StatusCodes.Status503ServiceUnavailable);

    public sealed record ReadyBody(string Status, string? KnowledgeVersion, int CodeSets, string? KnowledgeManifestVersion);
}
