using CdsNatremia.Service.Hooks;
using Microsoft.Extensions.DependencyInjection.Extensions;

namespace CdsNatremia.Service.Fetching;

/// <summary>Registers fetching from the EHR's FHIR server in place of the completer that never fetches.</summary>
public static class FetchingRegistration
{
    /// <summary>
    /// Key of the <see cref="TimeProvider"/> that times fetches (deadline, time-outs, back-off, circuit breaks). It is
    /// separate from the clock the assessment reads: tests pin the assessment clock at a scenario's date, while
    /// network time must run (or be driven by a test's own fake clock).
    /// </summary>
    public const string ClockKey = "CdsNatremia.Fetching.Clock";

    /// <summary>Adds the options, the allowlist, the per-server pipelines, the HttpClient and the completer.</summary>
    public static IServiceCollection AddFhirFetching(this IServiceCollection services, IConfiguration configuration)
    {
        ArgumentNullException.ThrowIfNull(services);
        ArgumentNullException.ThrowIfNull(configuration);
        services.AddOptions<FhirFetchOptions>().Bind(configuration.GetSection(FhirFetchOptions.Section)).ValidateDataAnnotations().ValidateOnStart();
        services.AddSingleton<Microsoft.Extensions.Options.IValidateOptions<FhirFetchOptions>, FhirFetchOptionsValidator>();
        services.TryAddKeyedSingleton(ClockKey, TimeProvider.System);
        services.TryAddSingleton<FhirServerAllowlist>();
        services.TryAddSingleton<FhirResiliencePipelines>();
        services.TryAddSingleton<ResilientFhirClient>();
        services.AddHttpClient(ResilientFhirClient.HttpClientName, client => client.Timeout = Timeout.InfiniteTimeSpan)
            .ConfigurePrimaryHttpMessageHandler(() => new SocketsHttpHandler
            {
                // A redirect would carry the token to wherever the server points; 3xx is treated as a failure instead.
                AllowAutoRedirect = false,
                UseCookies = false,
                AutomaticDecompression = System.Net.DecompressionMethods.All,
                PooledConnectionLifetime = TimeSpan.FromMinutes(2),
            })
            .RemoveAllLoggers();
        services.RemoveAll<IPrefetchCompleter>();
        services.AddSingleton<IPrefetchCompleter, FhirFetchPrefetchCompleter>();
        return services;
    }
}
