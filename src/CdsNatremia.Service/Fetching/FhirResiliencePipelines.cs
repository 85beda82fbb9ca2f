using Microsoft.Extensions.Options;
using Polly;
using Polly.CircuitBreaker;
using Polly.Registry;
using Polly.Retry;
using Polly.Timeout;

namespace CdsNatremia.Service.Fetching;

/// <summary>
/// One Polly pipeline per FHIR base URL, kept in a registry: retry (outermost) → circuit breaker → per-attempt
/// time-out. The breaker sits inside the retry so that every attempt counts towards it, and it is per server so
/// that one failing EHR server never stops calls to another. The overall deadline is not a strategy here: it is the
/// cancellation token of the whole fetch, which spans every key and page.
/// </summary>
internal sealed class FhirResiliencePipelines : IAsyncDisposable, IDisposable
{
    /// <summary>When the whole fetch must be over (from the fetch clock); a Retry-After past it is not waited for.</summary>
    public static readonly ResiliencePropertyKey<DateTimeOffset> Deadline = new("natremia.fetch.deadline");

    private readonly ResiliencePipelineRegistry<string> _registry = new();
    private readonly FhirFetchOptions _options;
    private readonly TimeProvider _time;

    public FhirResiliencePipelines(IOptions<FhirFetchOptions> options, [FromKeyedServices(FetchingRegistration.ClockKey)] TimeProvider time)
    {
        _options = options.Value;
        _time = time;
    }

    /// <summary>The pipeline for a base URL (as <see cref="FhirServerAllowlist.BaseOf"/> gives it); created on first use.</summary>
    public ResiliencePipeline<FhirResponse> For(string baseUrl) => _registry.GetOrAddPipeline<FhirResponse>(baseUrl, Configure);

    /// <summary>Whether an outcome is worth another attempt (and counts against the server's circuit).</summary>
    public static bool IsTransient(Outcome<FhirResponse> outcome)
        => outcome.Exception is HttpRequestException or TimeoutRejectedException or IOException
            || outcome.Result is { IsTransientFailure: true };

    public ValueTask DisposeAsync() => _registry.DisposeAsync();

    // A container disposed synchronously (tests, tools) needs this; disposing the registry only releases its pipelines.
    public void Dispose() => _registry.DisposeAsync().AsTask().GetAwaiter().GetResult();

    private void Configure(ResiliencePipelineBuilder<FhirResponse> builder)
    {
        builder.TimeProvider = _time;
        if (_options.MaxRetries > 0)
        {
            builder.AddRetry(new RetryStrategyOptions<FhirResponse>
            {
                MaxRetryAttempts = _options.MaxRetries,
                BackoffType = DelayBackoffType.Exponential,
                UseJitter = true,
                Delay = _options.RetryBaseDelay,
                ShouldHandle = args => ValueTask.FromResult(IsTransient(args.Outcome) && !RetryAfterPastDeadline(args.Outcome, args.Context)),
                DelayGenerator = args => ValueTask.FromResult(args.Outcome.Result?.RetryAfter),
            });
        }

        builder.AddCircuitBreaker(new CircuitBreakerStrategyOptions<FhirResponse>
        {
            FailureRatio = _options.BreakerFailureRatio,
            MinimumThroughput = _options.BreakerMinimumThroughput,
            SamplingDuration = _options.BreakerSamplingDuration,
            BreakDuration = _options.BreakDuration,
            ShouldHandle = args => ValueTask.FromResult(IsTransient(args.Outcome)),
        });
        builder.AddTimeout(_options.AttemptTimeout);
    }

    // A server that asks us to come back after the deadline has, in effect, said no for this request: answering now
    // (with what we have, or 412) is better than waiting past the time the EHR gives us.
    private bool RetryAfterPastDeadline(Outcome<FhirResponse> outcome, ResilienceContext context)
        => outcome.Result?.RetryAfter is { } wait
            && context.Properties.TryGetValue(Deadline, out var deadline)
            && _time.GetUtcNow() + wait > deadline;
}
