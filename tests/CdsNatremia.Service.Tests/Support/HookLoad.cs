using System.Collections.Concurrent;
using System.Diagnostics;
using System.Net;
using System.Text;
using System.Text.Json;
using System.Text.Json.Nodes;
using CdsNatremia.Scenarios;

namespace CdsNatremia.Service.Tests.Support;

/// <summary>What became of one hook call sent under load.</summary>
/// <param name="HookInstance">The request's hookInstance (the audit records carry it).</param>
/// <param name="Status">HTTP status, or 0 when no response came (connection refused or reset before any header).</param>
/// <param name="CardUuids">The uuids of the cards answered (a 200 whose body was read whole and parsed).</param>
/// <param name="Cut">True when headers arrived but the body could not be read whole or was not complete JSON.</param>
/// <param name="Phase">How many marks the run had made when the call was sent (see <see cref="HookLoad.Mark"/>).</param>
/// <param name="Instance">The service instance that answered (X-Natremia-Test-Backend from HAProxy), when known.</param>
public sealed record HookCallResult(Guid HookInstance, int Status, IReadOnlyList<Guid> CardUuids, bool Cut, int Phase, string? Instance)
{
    /// <summary>Sent after the first mark (e.g. the stop signal).</summary>
    public bool StartedAfter => Phase > 0;
}

/// <summary>
/// Loopback load for shutdown and fleet tests: a few workers post scenario 01 (an invented patient whose sodium of
/// 124 mmol/L always gives a card) with a fresh hookInstance each time, until stopped or a call budget is spent, and
/// record for every call whether it was answered, refused before any answer, or cut mid-body.
/// </summary>
public sealed class HookLoad
{
    private readonly ConcurrentQueue<HookCallResult> _results = new();
    private readonly Func<string, string?>? _token;
    private long _answered;
    private int _phase;

    /// <param name="token">Bearer token per call (given the path), when the service demands one.</param>
    public HookLoad(Func<string, string?>? token = null) => _token = token;

    public IReadOnlyList<HookCallResult> Results => [.. _results];

    /// <summary>Answered (200, read whole) calls so far.</summary>
    public long Answered => Interlocked.Read(ref _answered);

    /// <summary>Marks a moment (e.g. SIGTERM sent); calls sent from now on carry the next <see cref="HookCallResult.Phase"/>.</summary>
    public void Mark() => Interlocked.Increment(ref _phase);

    /// <summary>
    /// Runs <paramref name="workers"/> workers until <paramref name="stop"/> fires or <paramref name="maxCalls"/> calls
    /// were made. With <paramref name="stopWhenRefused"/>, a worker stops after five calls in a row got no answer.
    /// </summary>
    public async Task RunAsync(Uri baseAddress, int workers, int maxCalls, bool stopWhenRefused, CancellationToken stop)
    {
        using var handler = new SocketsHttpHandler { PooledConnectionLifetime = TimeSpan.FromSeconds(30), ConnectTimeout = TimeSpan.FromSeconds(5) };
        using var client = new HttpClient(handler) { BaseAddress = baseAddress, Timeout = TimeSpan.FromSeconds(60) };
        var budget = maxCalls;
        var scenario = ScenarioLibrary.Find("01")!;
        async Task Worker()
        {
            var refusedInARow = 0;
            while (!stop.IsCancellationRequested && Interlocked.Decrement(ref budget) >= 0)
            {
                var result = await CallAsync(client, scenario, stop);
                _results.Enqueue(result);
                refusedInARow = result.Status == 0 && !result.Cut ? refusedInARow + 1 : 0;
                if (stopWhenRefused && refusedInARow >= 5)
                {
                    return;
                }

                if (result.Status == 0)
                {
                    await Task.Delay(20, CancellationToken.None);
                }
            }
        }

        await Task.WhenAll(Enumerable.Range(0, workers).Select(_ => Task.Run(Worker, CancellationToken.None)));
    }

    private async Task<HookCallResult> CallAsync(HttpClient client, Scenario scenario, CancellationToken stop)
    {
        var hookInstance = Guid.NewGuid();
        var after = Volatile.Read(ref _phase);
        const string path = "/cds-services/natremia-chart-review";
        var body = HookRequestBuilder.Build(scenario, "patient-view", TimeSpan.Zero, hookInstance, includePrefetch: true);
        using var request = new HttpRequestMessage(HttpMethod.Post, path) { Content = new StringContent(body.ToJsonString(), Encoding.UTF8, "application/json") };
        if (_token?.Invoke(path) is { } token)
        {
            request.Headers.Authorization = new System.Net.Http.Headers.AuthenticationHeaderValue("Bearer", token);
        }

        HttpResponseMessage response;
        try
        {
            response = await client.SendAsync(request, HttpCompletionOption.ResponseHeadersRead, CancellationToken.None);
        }
        catch (Exception ex) when (ex is HttpRequestException or TaskCanceledException or IOException)
        {
            return new HookCallResult(hookInstance, 0, [], false, after, null);
        }

        using (response)
        {
            var instance = response.Headers.TryGetValues("X-Natremia-Test-Backend", out var values) ? values.FirstOrDefault() : null;
            string text;
            try
            {
                text = await response.Content.ReadAsStringAsync(CancellationToken.None);
            }
            catch (Exception ex) when (ex is HttpRequestException or IOException or TaskCanceledException)
            {
                return new HookCallResult(hookInstance, (int)response.StatusCode, [], true, after, instance);
            }

            if (response.StatusCode != HttpStatusCode.OK)
            {
                return new HookCallResult(hookInstance, (int)response.StatusCode, [], false, after, instance);
            }

            try
            {
                var cards = JsonNode.Parse(text)!["cards"]!.AsArray().Select(c => Guid.Parse((string)c!["uuid"]!)).ToList();
                Interlocked.Increment(ref _answered);
                return new HookCallResult(hookInstance, 200, cards, false, after, instance);
            }
            catch (Exception ex) when (ex is JsonException or NullReferenceException or FormatException or InvalidOperationException)
            {
                return new HookCallResult(hookInstance, 200, [], true, after, instance);
            }
        }
    }
}
