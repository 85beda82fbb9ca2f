using Microsoft.AspNetCore.Authentication.Cookies;
using Microsoft.AspNetCore.DataProtection;

namespace CdsNatremia.Service.Course;

/// <summary>Registers the sodium-course view: options, the SMART client, the session store, the loader and the cookie handler.</summary>
public static class CourseRegistration
{
    /// <summary>Adds the view's services.</summary>
    public static WebApplicationBuilder AddNatremiaCourse(this WebApplicationBuilder builder)
    {
        ArgumentNullException.ThrowIfNull(builder);
        var services = builder.Services;
        var development = builder.Environment.IsDevelopment();
        services.AddOptions<CourseOptions>().Bind(builder.Configuration.GetSection(CourseOptions.Section)).ValidateDataAnnotations().ValidateOnStart();
        services.AddSingleton<Microsoft.Extensions.Options.IValidateOptions<CourseOptions>>(new CourseOptionsValidator(development));
        services.AddSingleton<CourseSessions>();
        services.AddSingleton<SmartClient>();
        services.AddSingleton<CourseLoader>();
        services.AddKeyedSingleton<CdsNatremia.Service.Hooks.IPrefetchCompleter>(CourseLoader.CompleterKey, (sp, _) =>
        {
            var fetch = sp.GetRequiredService<Microsoft.Extensions.Options.IOptions<CdsNatremia.Service.Fetching.FhirFetchOptions>>().Value;
            var course = sp.GetRequiredService<Microsoft.Extensions.Options.IOptions<CourseOptions>>().Value;
            return new CdsNatremia.Service.Fetching.FhirFetchPrefetchCompleter(
                sp.GetRequiredService<CdsNatremia.Service.Fetching.ResilientFhirClient>(),
                sp.GetRequiredService<CdsNatremia.Service.Fetching.FhirServerAllowlist>(),
                sp.GetRequiredService<CdsNatremia.Fhir.Reading.BundleReader>(),
                Microsoft.Extensions.Options.Options.Create(WithBudget(fetch, course.FetchBudget)),
                sp.GetRequiredKeyedService<TimeProvider>(CdsNatremia.Service.Fetching.FetchingRegistration.ClockKey),
                sp.GetRequiredService<Microsoft.Extensions.Logging.ILogger<CdsNatremia.Service.Fetching.FhirFetchPrefetchCompleter>>());
        });
        services.AddSingleton<CourseReport>();
        services.AddSingleton<DevelopmentEhr>();
        services.AddHttpClient(SmartClient.HttpClientName, client => client.Timeout = TimeSpan.FromSeconds(10))
            .ConfigurePrimaryHttpMessageHandler(() => new SocketsHttpHandler { AllowAutoRedirect = false, UseCookies = false })
            .RemoveAllLoggers();

        // The session cookie: HttpOnly, Secure outside Development, SameSite=Lax, no lifetime of its own beyond the
        // browser session; it holds only a random id of the server-side session. Its keys live in memory like the
        // sessions, so a restart ends both together.
        services.AddAuthentication().AddCookie(CourseEndpoints.Scheme, o =>
        {
            o.Cookie.Name = CourseEndpoints.SessionCookie;
            o.Cookie.HttpOnly = true;
            o.Cookie.SameSite = Microsoft.AspNetCore.Http.SameSiteMode.Lax;
            o.Cookie.SecurePolicy = development ? Microsoft.AspNetCore.Http.CookieSecurePolicy.SameAsRequest : Microsoft.AspNetCore.Http.CookieSecurePolicy.Always;
            o.Cookie.Path = "/course";
            o.SlidingExpiration = false;
            o.DataProtectionProvider = new EphemeralDataProtectionProvider();
            o.Events = new CookieAuthenticationEvents
            {
                OnRedirectToLogin = c =>
                {
                    c.Response.StatusCode = 401;
                    return Task.CompletedTask;
                },
            };
        });
        return builder;
    }

    /// <summary>The fetch settings with the view's own time budget (the rest unchanged).</summary>
    private static CdsNatremia.Service.Fetching.FhirFetchOptions WithBudget(CdsNatremia.Service.Fetching.FhirFetchOptions source, TimeSpan budget)
    {
        var copy = new CdsNatremia.Service.Fetching.FhirFetchOptions
        {
            Enabled = source.Enabled,
            Budget = budget,
            AttemptTimeout = source.AttemptTimeout,
            MaxRetries = source.MaxRetries,
            RetryBaseDelay = source.RetryBaseDelay,
            BreakerFailureRatio = source.BreakerFailureRatio,
            BreakerMinimumThroughput = source.BreakerMinimumThroughput,
            BreakerSamplingDuration = source.BreakerSamplingDuration,
            BreakDuration = source.BreakDuration,
            MaxPages = source.MaxPages,
            MaxEntries = source.MaxEntries,
            MaxResponseBytes = source.MaxResponseBytes,
        };
        foreach (var server in source.AllowedServers)
        {
            copy.AllowedServers.Add(server);
        }

        return copy;
    }
}

/// <summary>Checks the EHR list: each issuer an absolute https URL (http on loopback in Development), each with a client id.</summary>
internal sealed class CourseOptionsValidator(bool development) : Microsoft.Extensions.Options.IValidateOptions<CourseOptions>
{
    public Microsoft.Extensions.Options.ValidateOptionsResult Validate(string? name, CourseOptions options)
    {
        var problems = new List<string>();
        for (var i = 0; i < options.Ehrs.Count; i++)
        {
            var ehr = options.Ehrs[i];
            var at = $"{CourseOptions.Section}:Ehrs:{i}";
            if (!Uri.TryCreate(ehr.Issuer, UriKind.Absolute, out var issuer) || !string.IsNullOrEmpty(issuer.Query)
                || !(issuer.Scheme == Uri.UriSchemeHttps || (development && issuer.Scheme == Uri.UriSchemeHttp && issuer.IsLoopback)))
            {
                problems.Add($"{at}:Issuer must be the EHR's absolute https FHIR base URL (http only on loopback in Development)");
            }

            if (string.IsNullOrWhiteSpace(ehr.ClientId))
            {
                problems.Add($"{at}:ClientId is required");
            }

            if (!development && string.IsNullOrEmpty(ehr.ClientSecret))
            {
                problems.Add($"{at}:ClientSecret is required outside Development (a confidential client); set it from the environment or a secret store");
            }
        }

        // On Linux "/course/launch" parses as an absolute file: URI, so the scheme is checked too.
        if (!string.IsNullOrEmpty(options.LaunchUrl)
            && !(Uri.TryCreate(options.LaunchUrl, UriKind.Absolute, out var launch) && (launch.Scheme == Uri.UriSchemeHttps || launch.Scheme == Uri.UriSchemeHttp)))
        {
            problems.Add($"{CourseOptions.Section}:LaunchUrl must be an absolute http(s) URL");
        }

        return problems.Count == 0 ? Microsoft.Extensions.Options.ValidateOptionsResult.Success : Microsoft.Extensions.Options.ValidateOptionsResult.Fail(problems);
    }
}
