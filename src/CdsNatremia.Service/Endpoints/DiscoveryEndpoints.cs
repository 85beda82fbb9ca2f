using System.Text.Json.Nodes;
using CdsNatremia.Service.Hooks;
using Microsoft.AspNetCore.Http.HttpResults;

namespace CdsNatremia.Service.Endpoints;

/// <summary>GET /cds-services: the CDS Hooks discovery document.</summary>
internal static class DiscoveryEndpoints
{
    public static IEndpointRouteBuilder MapDiscovery(this IEndpointRouteBuilder app)
    {
        app.MapGet("/cds-services", Discover).WithName("Discovery");
        return app;
    }

    public static Ok<JsonObject> Discover(ServiceCatalog catalog)
    {
        var services = new JsonArray();
        foreach (var service in catalog.Services)
        {
            var prefetch = new JsonObject();
            foreach (var key in service.PrefetchKeys)
            {
                prefetch[key] = PrefetchKeys.Templates[key];
            }

            var json = new JsonObject
            {
                ["hook"] = service.Hook,
                ["title"] = service.Title,
                ["description"] = service.Description,
                ["id"] = service.Id,
                ["prefetch"] = prefetch,
            };
            if (service.UsageRequirements is { } usage)
            {
                json["usageRequirements"] = usage;
            }

            services.Add(json);
        }

        return TypedResults.Ok(new JsonObject { ["services"] = services });
    }
}
