using System.Text.Json.Nodes;
using CdsNatremia.Core.Engine;
using CdsNatremia.Service.Hooks;
using CdsNatremia.Service.Security;
using Microsoft.AspNetCore.Http.HttpResults;
using Microsoft.Extensions.Options;

namespace CdsNatremia.Service.Endpoints;

/// <summary>GET /cds-services: the CDS Hooks discovery document.</summary>
internal static class DiscoveryEndpoints
{
    public static IEndpointRouteBuilder MapDiscovery(this IEndpointRouteBuilder app)
    {
        app.MapGet("/cds-services", Discover).WithName("Discovery");
        return app;
    }

    public static Ok<JsonObject> Discover(ServiceCatalog catalog, IOptions<ClientAuthenticationOptions> authentication)
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
            if (OpenModeNotice.UsageRequirements(service.UsageRequirements, authentication.Value.TrustedClients.Count == 0) is { } usage)
            {
                json["usageRequirements"] = usage;
            }

            services.Add(json);
        }

        return TypedResults.Ok(new JsonObject { ["services"] = services });
    }
}
