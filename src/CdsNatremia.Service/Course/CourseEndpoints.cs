using System.Security.Claims;
using System.Security.Cryptography;
using System.Text;
using Microsoft.AspNetCore.Authentication;
using Microsoft.Extensions.Options;

namespace CdsNatremia.Service.Course;

/// <summary>
/// The SMART App Launch 2.0 EHR launch of the sodium-course view, as a confidential server-side client:
/// <c>GET /course/launch?iss=…&amp;launch=…</c> (only a configured iss; discovery; redirect to the EHR's authorization
/// endpoint with PKCE S256, a state bound to this browser by an HttpOnly cookie, aud = iss and the view's scopes),
/// <c>GET /course/callback</c> (state checked, code exchanged server-side, the token kept in server memory, a session
/// cookie set) and <c>GET /course</c> (the page, only with a live session). No URL carries patient data; nothing here
/// logs or audits the patient.
/// </summary>
public static class CourseEndpoints
{
    /// <summary>The authentication scheme of the view's session cookie.</summary>
    public const string Scheme = "NatremiaCourse";

    /// <summary>The session cookie's name.</summary>
    public const string SessionCookie = "natremia-course";

    /// <summary>The cookie that binds a started launch (and its state) to this browser.</summary>
    public const string LaunchCookie = "natremia-course-launch";

    /// <summary>The claim holding the server-side session id.</summary>
    public const string SessionClaim = "natremia-course-session";

    private const int MaxParameterLength = 2048;

    /// <summary>Maps the view's endpoints (and, in Development, the test EHR and a start page).</summary>
    public static IEndpointRouteBuilder MapCourse(this IEndpointRouteBuilder endpoints)
    {
        ArgumentNullException.ThrowIfNull(endpoints);
        var services = endpoints.ServiceProvider;
        var options = services.GetRequiredService<IOptions<CourseOptions>>().Value;
        if (!options.Enabled)
        {
            return endpoints;
        }

        var environment = services.GetRequiredService<IHostEnvironment>();
        var devEhr = environment.IsDevelopment() && options.DevelopmentEhr ? services.GetRequiredService<DevelopmentEhr>() : null;
        var group = endpoints.MapGroup("/course").AddEndpointFilter(async (context, next) =>
        {
            CourseHeaders.Apply(context.HttpContext, options);
            return await next(context).ConfigureAwait(false);
        });
        group.MapGet("/launch", (HttpContext context, CancellationToken cancel) => LaunchAsync(context, options, devEhr, cancel));
        group.MapGet("/callback", (HttpContext context, CancellationToken cancel) => CallbackAsync(context, options, cancel));
        group.MapGet("/", (HttpContext context, CancellationToken cancel) => ViewAsync(context, cancel));
        group.MapGet("/course.css", () => Results.Text(CoursePage.Css, "text/css; charset=utf-8"));
        if (devEhr is not null)
        {
            devEhr.Map(endpoints);
            group.MapGet("/dev", (HttpContext context) => Page(200, DevStartPage(context)));
        }

        return endpoints;
    }

    private static async Task<IResult> LaunchAsync(HttpContext context, CourseOptions options, DevelopmentEhr? devEhr, CancellationToken cancel)
    {
        var iss = context.Request.Query["iss"].ToString();
        var launch = context.Request.Query["launch"].ToString();
        if (iss.Length == 0 || launch.Length == 0 || iss.Length > MaxParameterLength || launch.Length > MaxParameterLength)
        {
            return Error(400, "Open the sodium course from your EHR", "This address is opened by an EHR with its FHIR server (iss) and a launch id (launch); one or both are missing or too long.");
        }

        var ehr = FindEhr(options, iss, context.Request, devEhr);
        if (ehr is null)
        {
            // No request of any kind goes to an issuer that is not configured.
            return Error(400, "This EHR is not known to the sodium course", "The launch came from an EHR this service is not configured for (Natremia:Course:Ehrs), so nothing was requested from it. Ask the service's operator to add the EHR.");
        }

        SmartConfiguration configuration;
        try
        {
            configuration = await context.RequestServices.GetRequiredService<SmartClient>().DiscoverAsync(ehr.Issuer, cancel).ConfigureAwait(false);
        }
        catch (SmartLaunchException ex)
        {
            return Error(502, "The EHR's SMART configuration could not be used", ex.Message);
        }

        var time = context.RequestServices.GetRequiredService<TimeProvider>();
        var sessions = context.RequestServices.GetRequiredService<CourseSessions>();
        var state = CourseSessions.NewId();
        var verifier = CourseSessions.NewId();
        var challenge = CourseSessions.Base64Url(SHA256.HashData(Encoding.ASCII.GetBytes(verifier)));
        var redirectUri = context.Request.Scheme + "://" + context.Request.Host + context.Request.PathBase + "/course/callback";
        var issuer = ehr.Issuer.TrimEnd('/');
        var pendingId = sessions.AddPending(new PendingLaunch(state, verifier, ehr, issuer, configuration.TokenEndpoint, redirectUri, time.GetUtcNow() + options.LaunchLifetime));
        context.Response.Cookies.Append(LaunchCookie, pendingId, CookieOptions(context, options.LaunchLifetime));
        var query = new Dictionary<string, string?>
        {
            ["response_type"] = "code",
            ["client_id"] = ehr.ClientId,
            ["redirect_uri"] = redirectUri,
            ["launch"] = launch,
            ["scope"] = SmartScopes.Requested,
            ["state"] = state,
            ["aud"] = issuer,
            ["code_challenge"] = challenge,
            ["code_challenge_method"] = "S256",
        };
        return Results.Redirect(Microsoft.AspNetCore.WebUtilities.QueryHelpers.AddQueryString(configuration.AuthorizationEndpoint.ToString(), query));
    }

    private static async Task<IResult> CallbackAsync(HttpContext context, CourseOptions options, CancellationToken cancel)
    {
        var sessions = context.RequestServices.GetRequiredService<CourseSessions>();
        var pending = sessions.TakePending(context.Request.Cookies[LaunchCookie]);
        context.Response.Cookies.Delete(LaunchCookie, CookieOptions(context, null));
        if (pending is null)
        {
            return Error(400, "This launch is not known in this browser", "The launch was not started in this browser, was already used, or took too long. Open the sodium course again from the EHR.");
        }

        var query = context.Request.Query;
        if (query["error"].ToString() is { Length: > 0 } error)
        {
            var text = error.Length > 100 ? error[..100] : error;
            return Error(400, "The EHR did not authorize the sodium course", "The EHR answered: " + text + ". Open the sodium course again from the EHR.");
        }

        var state = query["state"].ToString();
        if (!CryptographicOperations.FixedTimeEquals(Encoding.ASCII.GetBytes(state), Encoding.ASCII.GetBytes(pending.State)))
        {
            return Error(400, "The launch could not be verified", "The state returned by the EHR does not match the launch started in this browser, so the answer was not used. Open the sodium course again from the EHR.");
        }

        var code = query["code"].ToString();
        if (code.Length == 0 || code.Length > MaxParameterLength)
        {
            return Error(400, "The EHR sent no authorization code", "Open the sodium course again from the EHR.");
        }

        SmartToken token;
        try
        {
            token = await context.RequestServices.GetRequiredService<SmartClient>().ExchangeAsync(pending, code, cancel).ConfigureAwait(false);
        }
        catch (SmartLaunchException ex)
        {
            return Error(502, "The EHR did not give the sodium course access", ex.Message);
        }

        var now = context.RequestServices.GetRequiredService<TimeProvider>().GetUtcNow();
        var lifetime = token.ExpiresIn is { } seconds && TimeSpan.FromSeconds(seconds) < options.SessionLifetime ? TimeSpan.FromSeconds(seconds) : options.SessionLifetime;
        var id = sessions.AddSession(new CourseSession(pending.Issuer, pending.Ehr.ClientId, token.AccessToken, token.Scope, token.PatientId, now + lifetime));
        var principal = new ClaimsPrincipal(new ClaimsIdentity([new Claim(SessionClaim, id)], Scheme));
        await context.SignInAsync(Scheme, principal, new AuthenticationProperties { IsPersistent = false, AllowRefresh = false, ExpiresUtc = now + lifetime }).ConfigureAwait(false);
        return Results.Redirect(context.Request.PathBase + "/course");
    }

    private static async Task<IResult> ViewAsync(HttpContext context, CancellationToken cancel)
    {
        var result = await context.AuthenticateAsync(Scheme).ConfigureAwait(false);
        var id = result.Principal?.FindFirst(SessionClaim)?.Value;
        if (!result.Succeeded || id is null)
        {
            return Error(401, "Open the sodium course from your EHR", "The sodium course shows a patient only after a launch from the EHR, and no launch was completed in this browser.");
        }

        var sessions = context.RequestServices.GetRequiredService<CourseSessions>();
        if (sessions.Session(id) is not { } session)
        {
            await context.SignOutAsync(Scheme).ConfigureAwait(false);
            return Error(401, "The session has ended", "The sodium course session has ended. Open it again from the EHR to see the patient's current course.");
        }

        var loaded = await context.RequestServices.GetRequiredService<CourseLoader>().LoadAsync(session, cancel).ConfigureAwait(false);
        if (loaded.Data is not { } data)
        {
            return Error(502, "The patient's data could not be read", "The EHR's FHIR server did not give what the course needs: " + string.Join("; ", loaded.Unavailable!.Reasons));
        }

        var report = context.RequestServices.GetRequiredService<CourseReport>().Render(data.Cards);
        return Page(200, CoursePage.Render(data, report, inlineStyle: false));
    }

    private static SmartEhrOptions? FindEhr(CourseOptions options, string iss, HttpRequest request, DevelopmentEhr? devEhr)
    {
        var wanted = iss.TrimEnd('/');
        var configured = options.Ehrs.FirstOrDefault(e => string.Equals(e.Issuer.TrimEnd('/'), wanted, StringComparison.Ordinal));
        if (configured is not null)
        {
            return configured;
        }

        if (devEhr is not null && request.HttpContext.Connection.RemoteIpAddress is { } remote && System.Net.IPAddress.IsLoopback(remote)
            && string.Equals(DevelopmentEhr.IssuerFor(request), wanted, StringComparison.Ordinal))
        {
            return devEhr.Registration(wanted);
        }

        return null;
    }

    private static CookieOptions CookieOptions(HttpContext context, TimeSpan? maxAge)
    {
        var development = context.RequestServices.GetRequiredService<IHostEnvironment>().IsDevelopment();
        return new CookieOptions
        {
            HttpOnly = true,
            Secure = !development || context.Request.IsHttps,
            SameSite = SameSiteMode.Lax,
            Path = "/course",
            MaxAge = maxAge,
            IsEssential = true,
        };
    }

    private static string DevStartPage(HttpContext context)
    {
        var iss = DevelopmentEhr.IssuerFor(context.Request);
        var html = new StringBuilder();
        html.Append("<!DOCTYPE html><html lang=\"en\"><head><meta charset=\"utf-8\"><title>Sodium course: local launch</title><link rel=\"stylesheet\" href=\"/course/course.css\"></head><body><main>");
        html.Append("<h1>Sodium course: local launch (Development)</h1><p>Each link launches the view as an EHR would, against the loopback test EHR of this process, with an invented patient whose dates are moved to now.</p><ul>");
        foreach (var scenario in CdsNatremia.Scenarios.ScenarioLibrary.All.Where(s => s.Hook is "patient-view" or "result"))
        {
            var number = scenario.Id[..2];
            var href = "/course/launch?iss=" + Uri.EscapeDataString(iss) + "&launch=" + Uri.EscapeDataString(number);
            html.Append("<li><a href=\"").Append(System.Net.WebUtility.HtmlEncode(href)).Append("\">").Append(System.Net.WebUtility.HtmlEncode(number + ": " + scenario.Title)).Append("</a></li>");
        }

        html.Append("</ul></main></body></html>");
        return html.ToString();
    }

    private static IResult Error(int status, string title, string message) => Page(status, CoursePage.Message(title, message));

    private static IResult Page(int status, string html) => Results.Content(html, "text/html; charset=utf-8", Encoding.UTF8, status);
}

/// <summary>The view's response headers: a strict Content-Security-Policy (no script at all), no caching, no referrer.</summary>
public static class CourseHeaders
{
    /// <summary>Sets the headers.</summary>
    public static void Apply(HttpContext context, CourseOptions options)
    {
        ArgumentNullException.ThrowIfNull(context);
        ArgumentNullException.ThrowIfNull(options);
        var ancestors = string.Join(' ', options.Ehrs
            .Select(e => Uri.TryCreate(e.Issuer, UriKind.Absolute, out var u) ? u.GetLeftPart(UriPartial.Authority) : null)
            .OfType<string>()
            .Distinct(StringComparer.Ordinal));
        var headers = context.Response.Headers;
        headers.ContentSecurityPolicy = "default-src 'none'; style-src 'self'; img-src 'self' data:; form-action 'none'; base-uri 'none'; frame-ancestors 'self'" + (ancestors.Length > 0 ? " " + ancestors : string.Empty);
        headers.XContentTypeOptions = "nosniff";
        headers.CacheControl = "no-store";
        headers["Referrer-Policy"] = "no-referrer";
    }
}
