using System.Net.Http.Headers;
using System.Runtime.CompilerServices;
using Microsoft.Extensions.Options;
using Polly;
using Polly.CircuitBreaker;
using Polly.Timeout;

namespace CdsNatremia.Service.Fetching;

/// <summary>
/// One GET against the EHR's FHIR server through that server's resilience pipeline. The token goes in the
/// Authorization header of a request to the URL given, and only there: the HttpClient follows no redirects, keeps
/// no cookies and logs nothing (its default logging would write the URL, which names the patient).
/// </summary>
internal sealed class ResilientFhirClient
{
    /// <summary>The named HttpClient.</summary>
    public const string HttpClientName = "CdsNatremia.Fetching";

    private readonly IHttpClientFactory _clients;
    private readonly FhirResiliencePipelines _pipelines;
    private readonly FhirFetchOptions _options;
    private readonly TimeProvider _time;

    public ResilientFhirClient(
        IHttpClientFactory clients,
        FhirResiliencePipelines pipelines,
        IOptions<FhirFetchOptions> options,
        [FromKeyedServices(FetchingRegistration.ClockKey)] TimeProvider time)
    {
        _clients = clients;
        _pipelines = pipelines;
        _options = options.Value;
        _time = time;
    }

    /// <summary>
    /// GETs the URL. Returns the last response or the failure that ended the attempts; throws
    /// <see cref="OperationCanceledException"/> when the token (the overall deadline, or the EHR hanging up) fires.
    /// </summary>
    public async Task<FhirGetResult> GetAsync(Uri url, string baseUrl, string accessToken, DateTimeOffset deadline, CancellationToken cancellationToken)
    {
        var attempts = new StrongBox<int>();
        var context = ResilienceContextPool.Shared.Get(cancellationToken);
        context.Properties.Set(FhirResiliencePipelines.Deadline, deadline);
        try
        {
            var client = _clients.CreateClient(HttpClientName);
            var response = await _pipelines.For(baseUrl).ExecuteAsync(
                static (ctx, state) => state.Self.SendAsync(state.Client, state.Url, state.Token, state.Attempts, ctx.CancellationToken),
                context,
                (Self: this, Client: client, Url: url, Token: accessToken, Attempts: attempts)).ConfigureAwait(false);
            return new FhirGetResult(response, null, attempts.Value);
        }
        catch (Exception ex) when (ex is HttpRequestException or TimeoutRejectedException or BrokenCircuitException or IOException)
        {
            return new FhirGetResult(null, ex, attempts.Value);
        }
        finally
        {
            ResilienceContextPool.Shared.Return(context);
        }
    }

    private async ValueTask<FhirResponse> SendAsync(HttpClient client, Uri url, string token, StrongBox<int> attempts, CancellationToken cancellationToken)
    {
        attempts.Value++;
        using var request = new HttpRequestMessage(HttpMethod.Get, url);
        request.Headers.Authorization = new AuthenticationHeaderValue("Bearer", token);
        request.Headers.Accept.Add(new MediaTypeWithQualityHeaderValue("application/fhir+json"));
        using var response = await client.SendAsync(request, HttpCompletionOption.ResponseHeadersRead, cancellationToken).ConfigureAwait(false);
        var status = (int)response.StatusCode;
        var contentType = response.Content.Headers.ContentType?.MediaType;
        var retryAfter = RetryAfter(response.Headers.RetryAfter);
        if (status is < 200 or > 299)
        {
            return new FhirResponse(status, contentType, retryAfter, null, false);
        }

        if (response.Content.Headers.ContentLength > _options.MaxResponseBytes)
        {
            return new FhirResponse(status, contentType, retryAfter, null, true);
        }

        var stream = await response.Content.ReadAsStreamAsync(cancellationToken).ConfigureAwait(false);
        await using (stream.ConfigureAwait(false))
        {
            using var body = new MemoryStream();
            var buffer = new byte[81920];
            int read;
            while ((read = await stream.ReadAsync(buffer, cancellationToken).ConfigureAwait(false)) > 0)
            {
                if (body.Length + read > _options.MaxResponseBytes)
                {
                    return new FhirResponse(status, contentType, retryAfter, null, true);
                }

                body.Write(buffer, 0, read);
            }

            return new FhirResponse(status, contentType, retryAfter, body.ToArray(), false);
        }
    }

    private TimeSpan? RetryAfter(RetryConditionHeaderValue? header)
    {
        if (header?.Delta is { } delta)
        {
            return delta < TimeSpan.Zero ? TimeSpan.Zero : delta;
        }

        if (header?.Date is { } date)
        {
            var wait = date - _time.GetUtcNow();
            return wait < TimeSpan.Zero ? TimeSpan.Zero : wait;
        }

        return null;
    }
}
