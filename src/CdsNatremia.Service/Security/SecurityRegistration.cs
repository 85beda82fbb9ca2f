using System.Globalization;
using System.Threading.RateLimiting;
using CdsNatremia.Audit.Storage;
using Microsoft.AspNetCore.Mvc;
using Microsoft.AspNetCore.RateLimiting;
using Microsoft.AspNetCore.Cors.Infrastructure;
using Microsoft.AspNetCore.Server.Kestrel.Core;
using Microsoft.Extensions.Options;

namespace CdsNatremia.Service.Security;

/// <summary>
/// Wires client authentication, input bounds, CORS and the patient-data-free request log. Called from
/// <c>ServiceRegistration</c>; everything else about security lives in this folder.
/// </summary>
public static partial class SecurityRegistration
{
    /// <summary>The CORS policy applied when origins are configured.</summary>
    public const string CorsPolicy = "natremia-cors";

    /// <summary>Registers options (validated at start-up), the authenticator, the JWK Set client, Kestrel limits and CORS.</summary>
    public static WebApplicationBuilder AddNatremiaSecurity(this WebApplicationBuilder builder)
    {
        ArgumentNullException.ThrowIfNull(builder);
        var services = builder.Services;
        var authSection = builder.Configuration.GetSection(ClientAuthenticationOptions.Section);
        services.AddOptions<ClientAuthenticationOptions>()
            .Bind(authSection)
            .PostConfigure(o =>
            {
                // A JWK Set written as a nested object in configuration binds to nothing; rebuild its JSON text.
                for (var i = 0; i < o.TrustedClients.Count; i++)
                {
                    var jwks = authSection.GetSection(string.Create(CultureInfo.InvariantCulture, $"TrustedClients:{i}:Jwks"));
                    o.TrustedClients[i].Jwks = ConfigurationJson.Read(jwks) ?? o.TrustedClients[i].Jwks;
                }
            })
            .ValidateOnStart();
        services.AddSingleton<IValidateOptions<ClientAuthenticationOptions>, ClientAuthenticationOptionsValidator>();
        services.AddOptions<InputLimitsOptions>().Bind(builder.Configuration.GetSection(InputLimitsOptions.Section)).ValidateDataAnnotations().ValidateOnStart();
        services.AddOptions<CrossOriginOptions>().Bind(builder.Configuration.GetSection(CrossOriginOptions.Section))
            .Validate(o => o.AllowedOrigins.All(IsOrigin), $"{CrossOriginOptions.Section}:AllowedOrigins: each entry must be an origin such as https://ehr.hospital.example (scheme, host, optional port; no path; \"*\" is refused).")
            .Validate(o => o.PreflightMaxAgeSeconds is >= 0 and <= 86_400, $"{CrossOriginOptions.Section}:PreflightMaxAgeSeconds must be 0–86400.")
            .ValidateOnStart();

        services.AddSingleton<JwksSource>();
        services.AddSingleton<ClientAuthenticator>();

        // Used token ids: shared by every instance in PostgreSQL when the audit uses it, else kept in this process.
        var postgres = builder.Configuration["Natremia:Audit:PostgresConnectionString"];
        if (string.IsNullOrWhiteSpace(postgres))
        {
            services.AddSingleton<ITokenReplayStore>(sp => new PartitionedReplayCache(sp.GetRequiredService<IOptions<ClientAuthenticationOptions>>().Value.ReplayCacheCapacity));
        }
        else
        {
            services.AddSingleton(_ => new UsedTokenLedger(postgres));
            services.AddSingleton<ITokenReplayStore, SharedReplayStore>();
        }

        services.AddOptions<RateLimitingOptions>().Bind(builder.Configuration.GetSection(RateLimitingOptions.Section)).ValidateDataAnnotations().ValidateOnStart();
        services.AddRateLimiter(_ => { });
        services.AddOptions<RateLimiterOptions>().Configure<IOptions<RateLimitingOptions>>((limiter, limits) =>
        {
            var l = limits.Value;
            limiter.GlobalLimiter = PartitionedRateLimiter.Create<HttpContext, string>(context =>
                context.Items[ClientAuthenticationMiddleware.ClientItem] is string client
                    ? RateLimitPartition.GetTokenBucketLimiter(client, _ => new TokenBucketRateLimiterOptions
                    {
                        TokenLimit = l.TokenLimit,
                        TokensPerPeriod = l.TokensPerPeriod,
                        ReplenishmentPeriod = TimeSpan.FromSeconds(l.ReplenishmentPeriodSeconds),
                        QueueLimit = 0,
                        AutoReplenishment = true,
                    })
                    : RateLimitPartition.GetNoLimiter(string.Empty));
            limiter.OnRejected = (rejected, cancellationToken) => RejectAsync(rejected, l, cancellationToken);
        });
        services.AddHttpClient(JwksSource.HttpClientName)
            .ConfigureHttpClient((sp, client) =>
            {
                var auth = sp.GetRequiredService<IOptions<ClientAuthenticationOptions>>().Value;
                client.Timeout = TimeSpan.FromSeconds(auth.JwksFetchTimeoutSeconds);
                client.MaxResponseContentBufferSize = auth.JwksMaxBytes;
            })
            // A redirect could lead off the allowlist: follow none.
            .ConfigurePrimaryHttpMessageHandler(() => new SocketsHttpHandler { AllowAutoRedirect = false, UseCookies = false });

        services.AddOptions<KestrelServerOptions>().Configure<IOptions<InputLimitsOptions>>((kestrel, limits) =>
        {
            var l = limits.Value;
            kestrel.AddServerHeader = false;
            kestrel.Limits.MaxRequestBodySize = l.MaxRequestBodyBytes;
            kestrel.Limits.RequestHeadersTimeout = TimeSpan.FromSeconds(l.RequestHeadersTimeoutSeconds);
            kestrel.Limits.MinRequestBodyDataRate = new MinDataRate(l.MinRequestBodyBytesPerSecond, TimeSpan.FromSeconds(l.MinRequestBodyGraceSeconds));
            kestrel.Limits.KeepAliveTimeout = TimeSpan.FromSeconds(l.KeepAliveTimeoutSeconds);
        });

        services.AddCors();
        services.AddOptions<CorsOptions>().Configure<IOptions<CrossOriginOptions>>((cors, origins) =>
        {
            var o = origins.Value;
            cors.AddPolicy(CorsPolicy, policy => policy
                .WithOrigins([.. o.AllowedOrigins])
                .WithMethods(HttpMethods.Get, HttpMethods.Post)
                .WithHeaders("Authorization", "Content-Type")
                .WithExposedHeaders("WWW-Authenticate")
                .SetPreflightMaxAge(TimeSpan.FromSeconds(o.PreflightMaxAgeSeconds)));
        });

        // Bodies, headers and outgoing URLs (a FHIR query names the patient) never go to the log, whatever the
        // configuration says: HTTP body logging is silenced and HttpClient logs only failures.
        builder.Logging.AddFilter("Microsoft.AspNetCore.HttpLogging", LogLevel.None);
        builder.Logging.AddFilter("System.Net.Http.HttpClient", LogLevel.Warning);
        return builder;
    }

    /// <summary>The request log; goes first, so it sees the final status of every request, errors included.</summary>
    public static WebApplication UseNatremiaRequestLog(this WebApplication app)
    {
        ArgumentNullException.ThrowIfNull(app);
        app.UseMiddleware<RequestLogMiddleware>();
        return app;
    }

    /// <summary>Body limit, CORS, then client authentication on every /cds-services path. Warns loudly when running open.</summary>
    public static WebApplication UseNatremiaSecurity(this WebApplication app)
    {
        ArgumentNullException.ThrowIfNull(app);

        // Reading the options validates them: in Production without trusted clients the start stops here.
        var auth = app.Services.GetRequiredService<IOptions<ClientAuthenticationOptions>>().Value;
        var logger = app.Services.GetRequiredService<ILoggerFactory>().CreateLogger(typeof(SecurityRegistration).Namespace!);
        if (auth.TrustedClients.Count == 0)
        {
            LogOpenMode(logger, OpenModeNotice.Text);
        }
        else
        {
            LogEnforced(logger, auth.TrustedClients.Count, string.Join(", ", auth.EffectiveAlgorithms), auth.PublicBaseUrl!, app.Services.GetRequiredService<ITokenReplayStore>().Kind);
        }

        app.UseMiddleware<RequestBodyLimitMiddleware>();
        if (app.Services.GetRequiredService<IOptions<CrossOriginOptions>>().Value.AllowedOrigins.Count > 0)
        {
            app.UseCors(CorsPolicy);
        }

        var rateLimited = app.Services.GetRequiredService<IOptions<RateLimitingOptions>>().Value.Enabled;
        app.UseWhen(
            context => context.Request.Path.StartsWithSegments("/cds-services", StringComparison.OrdinalIgnoreCase),
            branch =>
            {
                branch.UseMiddleware<ClientAuthenticationMiddleware>();

                // After authentication: the limiter's partition is the authenticated client.
                if (rateLimited)
                {
                    branch.UseRateLimiter();
                }
            });
        return app;
    }

    /// <summary>429 with Retry-After (whole seconds until the client's bucket has a call again) and a problem body.</summary>
    private static async ValueTask RejectAsync(OnRejectedContext rejected, RateLimitingOptions limits, CancellationToken cancellationToken)
    {
        var context = rejected.HttpContext;
        Telemetry.NatremiaTelemetry.RecordRateLimitRefusal();
        var wait = rejected.Lease.TryGetMetadata(MetadataName.RetryAfter, out var retryAfter)
            ? retryAfter
            : TimeSpan.FromSeconds(limits.ReplenishmentPeriodSeconds);
        var seconds = Math.Max(1, (int)Math.Ceiling(wait.TotalSeconds));
        context.Response.StatusCode = StatusCodes.Status429TooManyRequests;
        context.Response.Headers.RetryAfter = seconds.ToString(CultureInfo.InvariantCulture);
        await context.RequestServices.GetRequiredService<IProblemDetailsService>().WriteAsync(new ProblemDetailsContext
        {
            HttpContext = context,
            ProblemDetails = new ProblemDetails
            {
                Status = StatusCodes.Status429TooManyRequests,
                Title = "Too many requests",
                Detail = string.Create(CultureInfo.InvariantCulture, $"This client has used its {limits.TokenLimit} calls; {limits.TokensPerPeriod} more are allowed every {limits.ReplenishmentPeriodSeconds} s. Try again in {seconds} s."),
            },
        }).ConfigureAwait(false);
    }

    private static bool IsOrigin(string text)
        => text != "*"
           && Uri.TryCreate(text, UriKind.Absolute, out var uri)
           && (uri.Scheme == Uri.UriSchemeHttps || uri.Scheme == Uri.UriSchemeHttp)
           && uri.AbsolutePath == "/" && !text.EndsWith('/')
           && string.IsNullOrEmpty(uri.Query) && string.IsNullOrEmpty(uri.Fragment) && string.IsNullOrEmpty(uri.UserInfo);

    [LoggerMessage(Level = LogLevel.Warning, Message = "\n!!!!!!!!!!!!!!!!!!!!!!!!!!!!!!!!!!!!!!!!!!!!!!!!!!!!!!!!!!!!!!!!\n{Notice}\n!!!!!!!!!!!!!!!!!!!!!!!!!!!!!!!!!!!!!!!!!!!!!!!!!!!!!!!!!!!!!!!!")]
    private static partial void LogOpenMode(ILogger logger, string notice);

    [LoggerMessage(Level = LogLevel.Information, Message = "CDS client authentication on: {ClientCount} trusted clients, algorithms {Algorithms}, audience base {PublicBaseUrl}, used token ids kept in {ReplayStore}")]
    private static partial void LogEnforced(ILogger logger, int clientCount, string algorithms, string publicBaseUrl, string replayStore);
}
