using CdsNatremia.Core.Engine;
using CdsNatremia.Fhir.Knowledge;
using CdsNatremia.Fhir.Reading;
using CdsNatremia.Service.Audit;
using CdsNatremia.Service.Course;
using CdsNatremia.Service.Endpoints;
using CdsNatremia.Service.Fetching;
using CdsNatremia.Service.Hooks;
using CdsNatremia.Service.Knowledge;
using CdsNatremia.Service.Security;
using Microsoft.Extensions.Options;

namespace CdsNatremia.Service.Configuration;

/// <summary>Wires the service: options, knowledge, the FHIR layer, the engine and the endpoints.</summary>
public static class ServiceRegistration
{
    /// <summary>Registers everything the service needs. Loads the knowledge files now, so a bad file stops start-up.</summary>
    public static WebApplicationBuilder AddNatremia(this WebApplicationBuilder builder)
    {
        ArgumentNullException.ThrowIfNull(builder);
        var services = builder.Services;
        services.AddOptions<NatremiaServiceOptions>().Bind(builder.Configuration.GetSection(NatremiaServiceOptions.Section)).ValidateDataAnnotations().ValidateOnStart();
        services.AddOptions<RuleOptions>().Bind(builder.Configuration.GetSection(NatremiaServiceOptions.Section + ":Rules")).ValidateOnStart();
        services.AddSingleton<IValidateOptions<RuleOptions>, RuleOptionsValidator>();
        services.AddProblemDetails();
        services.AddExceptionHandler<ClientErrorExceptionHandler>();
        services.ConfigureHttpJsonOptions(o => o.SerializerOptions.PropertyNamingPolicy = System.Text.Json.JsonNamingPolicy.CamelCase);

        services.AddSingleton(TimeProvider.System);
        services.AddSingleton<ResourceParser>();
        if (builder.Configuration.GetSection(NatremiaServiceOptions.Section).GetValue(nameof(NatremiaServiceOptions.FastPrefetchReader), defaultValue: true))
        {
            services.AddSingleton<FastResourceReader>(); // BundleReader takes it when registered
        }

        services.AddSingleton<BundleReader>();
        services.AddSingleton(sp => new FactsAssembler(sp.GetRequiredService<IOptions<RuleOptions>>().Value.Reading));
        services.AddSingleton<ServiceCatalog>();
        services.AddSingleton<CardResponseWriter>();
        services.AddOptions<Reports.ReportOptions>().Bind(builder.Configuration.GetSection(Reports.ReportOptions.Section)).ValidateDataAnnotations().ValidateOnStart();
        services.AddSingleton<Reports.CardReports>();
        services.AddFhirFetching(builder.Configuration);
        services.AddSingleton<HookHandler>();
        builder.AddNatremiaSecurity();

        var directory = KnowledgeDirectory.Resolve(
            builder.Configuration[NatremiaServiceOptions.Section + ":" + nameof(NatremiaServiceOptions.KnowledgeDirectory)],
            builder.Environment.ContentRootPath);
        // Each file is checked first (a bad edit names its file and problem), then the whole set against the manifest
        // (a missing, unlisted or other-version file stops the start).
        var knowledge = KnowledgeLoader.Load(directory);
        knowledge = knowledge with { ManifestVersion = KnowledgeManifest.Verify(directory).Version };
        // An unknown display time zone stops start-up here, naming the setting.
        var displayZone = (builder.Configuration.GetSection(DisplayOptions.Section).Get<DisplayOptions>() ?? new DisplayOptions()).ResolveTimeZone();
        services.AddSingleton(knowledge);
        services.AddSingleton(new KnowledgeState { Current = knowledge });
        services.AddSingleton(sp => new DecisionEngine(
            CardProducers.Default(),
            sp.GetRequiredService<IOptions<RuleOptions>>().Value,
            sp.GetRequiredService<LoadedKnowledge>().Base,
            displayZone));
        builder.AddNatremiaAudit();
        builder.AddNatremiaCourse();
        return builder;
    }

    /// <summary>Adds the middleware and endpoints.</summary>
    public static WebApplication UseNatremia(this WebApplication app)
    {
        ArgumentNullException.ThrowIfNull(app);
        app.UseNatremiaRequestLog();
        app.UseExceptionHandler();
        app.UseStatusCodePages();
        app.UseNatremiaSecurity();
        app.MapDiscovery();
        app.MapHooks();
        app.MapCardReports();
        app.MapHealth();
        app.MapFeedback();
        app.MapAdminReports();
        app.MapCourse();
        return app;
    }
}
