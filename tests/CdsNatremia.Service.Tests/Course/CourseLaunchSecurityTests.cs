using System.Net;
using CdsNatremia.Service.Course;
using CdsNatremia.Service.Tests.Support;
using Microsoft.AspNetCore.Mvc.Testing;
using Microsoft.AspNetCore.WebUtilities;
using WireMock.RequestBuilders;
using WireMock.ResponseBuilders;

namespace CdsNatremia.Service.Tests.Course;

/// <summary>
/// The SMART EHR launch of the sodium-course view refuses what it must (SMART App Launch 2.0; docs/sodium-course-view.md):
/// no launch, an unknown iss (with no request made), a wrong state, an expired session.
/// </summary>
public sealed class CourseLaunchSecurityTests : IDisposable
{
    private const string ClientId = "course-client";
    private const string Secret = "TEST-ONLY-course-secret";
    private readonly FhirServerFake _ehr = FhirServerFake.Start();
    private readonly NatremiaFactory _factory;

    public CourseLaunchSecurityTests()
    {
        _factory = NatremiaFactory.With(new Dictionary<string, string?>
        {
            ["Natremia:Course:Ehrs:0:Issuer"] = _ehr.BaseUrl,
            ["Natremia:Course:Ehrs:0:ClientId"] = ClientId,
            ["Natremia:Course:Ehrs:0:ClientSecret"] = Secret,
        });
        _ehr.Server.Given(Request.Create().WithPath("/fhir/.well-known/smart-configuration").UsingGet())
            .RespondWith(Response.Create().WithStatusCode(200).WithHeader("Content-Type", "application/json").WithBody($$"""
                {"authorization_endpoint":"{{_ehr.Origin}}/auth/authorize","token_endpoint":"{{_ehr.Origin}}/auth/token",
                 "capabilities":["launch-ehr","client-confidential-symmetric","context-ehr-patient"],"code_challenge_methods_supported":["S256"]}
                """));
        _ehr.Server.Given(Request.Create().WithPath("/auth/token").UsingPost())
            .RespondWith(Response.Create().WithStatusCode(200).WithHeader("Content-Type", "application/json")
                .WithBody("""{"access_token":"at-test","token_type":"Bearer","expires_in":3600,"scope":"launch patient/Observation.read","patient":"s01-patient"}"""));
    }

    private HttpClient Browser() => _factory.CreateClient(new WebApplicationFactoryClientOptions { AllowAutoRedirect = false, HandleCookies = true });

    private string LaunchPath(string iss) => "/course/launch?iss=" + Uri.EscapeDataString(iss) + "&launch=launch-123";

    [Fact]
    public async Task View_NoLaunch_RefusedWith401()
    {
        using var browser = Browser();
        using var response = await browser.GetAsync(new Uri("/course", UriKind.Relative));
        Assert.Equal(HttpStatusCode.Unauthorized, response.StatusCode);
        var page = await response.Content.ReadAsStringAsync();
        Assert.Contains("Open the sodium course from your EHR", page, StringComparison.Ordinal);
        Assert.DoesNotContain("<svg", page, StringComparison.Ordinal);
    }

    [Fact]
    public async Task Launch_UnknownIss_RefusedWithNoOutboundRequest()
    {
        using var unknown = FhirServerFake.Start();
        using var browser = Browser();
        using var response = await browser.GetAsync(new Uri(LaunchPath(unknown.BaseUrl), UriKind.Relative));
        Assert.Equal(HttpStatusCode.BadRequest, response.StatusCode);
        Assert.Contains("not known to the sodium course", await response.Content.ReadAsStringAsync(), StringComparison.Ordinal);
        Assert.Empty(unknown.Requests);
        Assert.Empty(_ehr.Requests);
    }

    [Fact]
    public async Task Launch_MissingLaunchParameter_RefusedWith400()
    {
        using var browser = Browser();
        using var response = await browser.GetAsync(new Uri("/course/launch?iss=" + Uri.EscapeDataString(_ehr.BaseUrl), UriKind.Relative));
        Assert.Equal(HttpStatusCode.BadRequest, response.StatusCode);
        Assert.Empty(_ehr.Requests);
    }

    [Fact]
    public async Task Launch_KnownIss_RedirectsWithPkceStateAudAndLimitedScopes()
    {
        using var browser = Browser();
        using var response = await browser.GetAsync(new Uri(LaunchPath(_ehr.BaseUrl), UriKind.Relative));
        Assert.Equal(HttpStatusCode.Redirect, response.StatusCode);
        var location = response.Headers.Location!;
        Assert.StartsWith(_ehr.Origin + "/auth/authorize?", location.ToString(), StringComparison.Ordinal);
        var query = QueryHelpers.ParseQuery(location.Query);
        Assert.Equal("code", query["response_type"].ToString());
        Assert.Equal(ClientId, query["client_id"].ToString());
        Assert.Equal("launch-123", query["launch"].ToString());
        Assert.Equal(_ehr.BaseUrl, query["aud"].ToString());
        Assert.Equal("S256", query["code_challenge_method"].ToString());
        Assert.Equal(43, query["code_challenge"].ToString().Length);
        Assert.True(query["state"].ToString().Length >= 43);
        Assert.Equal(SmartScopes.Requested, query["scope"].ToString());
        Assert.DoesNotContain("write", query["scope"].ToString(), StringComparison.Ordinal);
        var cookie = Assert.Single(response.Headers.GetValues("Set-Cookie"), c => c.StartsWith(CourseEndpoints.LaunchCookie + "=", StringComparison.Ordinal));
        Assert.Contains("httponly", cookie, StringComparison.OrdinalIgnoreCase);
        Assert.Contains("samesite=lax", cookie, StringComparison.OrdinalIgnoreCase);
        Assert.Contains("default-src 'none'", response.Headers.GetValues("Content-Security-Policy").Single(), StringComparison.Ordinal);
    }

    [Fact]
    public async Task Callback_WrongState_RefusedAndNoTokenRequested()
    {
        using var browser = Browser();
        using var launch = await browser.GetAsync(new Uri(LaunchPath(_ehr.BaseUrl), UriKind.Relative));
        Assert.Equal(HttpStatusCode.Redirect, launch.StatusCode);
        using var callback = await browser.GetAsync(new Uri("/course/callback?code=abc&state=not-the-state", UriKind.Relative));
        Assert.Equal(HttpStatusCode.BadRequest, callback.StatusCode);
        Assert.Contains("does not match", await callback.Content.ReadAsStringAsync(), StringComparison.Ordinal);
        Assert.DoesNotContain(_ehr.Requests, r => r.RequestMessage.Path == "/auth/token");
    }

    [Fact]
    public async Task Callback_StateFromAnotherBrowser_Refused()
    {
        using var first = Browser();
        using var launch = await first.GetAsync(new Uri(LaunchPath(_ehr.BaseUrl), UriKind.Relative));
        var state = QueryHelpers.ParseQuery(launch.Headers.Location!.Query)["state"].ToString();
        using var other = Browser();
        using var callback = await other.GetAsync(new Uri("/course/callback?code=abc&state=" + Uri.EscapeDataString(state), UriKind.Relative));
        Assert.Equal(HttpStatusCode.BadRequest, callback.StatusCode);
        Assert.DoesNotContain(_ehr.Requests, r => r.RequestMessage.Path == "/auth/token");
    }

    [Fact]
    public async Task View_SessionExpired_AsksForANewLaunch()
    {
        using var browser = Browser();
        using var launch = await browser.GetAsync(new Uri(LaunchPath(_ehr.BaseUrl), UriKind.Relative));
        var state = QueryHelpers.ParseQuery(launch.Headers.Location!.Query)["state"].ToString();
        using var callback = await browser.GetAsync(new Uri("/course/callback?code=abc&state=" + Uri.EscapeDataString(state), UriKind.Relative));
        Assert.Equal(HttpStatusCode.Redirect, callback.StatusCode);
        Assert.Equal("/course", callback.Headers.Location!.ToString());
        var token = Assert.Single(_ehr.Requests, r => r.RequestMessage.Path == "/auth/token");
        Assert.StartsWith("Basic ", token.RequestMessage.Headers!["Authorization"].Single(), StringComparison.Ordinal);
        Assert.Contains("code_verifier=", token.RequestMessage.Body, StringComparison.Ordinal);
        var session = Assert.Single(callback.Headers.GetValues("Set-Cookie"), c => c.StartsWith(CourseEndpoints.SessionCookie + "=", StringComparison.Ordinal));
        Assert.Contains("httponly", session, StringComparison.OrdinalIgnoreCase);
        Assert.Contains("samesite=lax", session, StringComparison.OrdinalIgnoreCase);
        Assert.DoesNotContain("s01-patient", callback.Headers.Location!.ToString(), StringComparison.Ordinal);

        _factory.Clock.Advance(TimeSpan.FromMinutes(31));
        using var view = await browser.GetAsync(new Uri("/course", UriKind.Relative));
        Assert.Equal(HttpStatusCode.Unauthorized, view.StatusCode);
        var page = await view.Content.ReadAsStringAsync();
        Assert.True(page.Contains("session has ended", StringComparison.Ordinal) || page.Contains("Open the sodium course from your EHR", StringComparison.Ordinal));
        Assert.DoesNotContain("<svg", page, StringComparison.Ordinal);
    }

    public void Dispose()
    {
        _factory.Dispose();
        _ehr.Dispose();
    }
}
