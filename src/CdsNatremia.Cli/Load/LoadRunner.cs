using System.Collections.Concurrent;
using System.Diagnostics;
using System.Globalization;
using System.Net.Sockets;
using System.Text;
using System.Text.Json.Nodes;

namespace CdsNatremia.Cli.Load;

/// <summary>
/// Sends prepared requests round-robin from a fixed number of workers until the duration or the request count is
/// reached, timing each; classifies failures by kind. The caller decides which hosts may be targeted (see HostPolicy).
/// </summary>
internal static class LoadRunner
{
    /// <summary>Runs the plan; <paramref name="progress"/> is reported about every 250 ms.</summary>
    public static async Task<LoadReport> RunAsync(HttpClient client, IReadOnlyList<LoadRequest> requests, LoadPlan plan, IProgress<LoadProgress>? progress, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(client);
        ArgumentNullException.ThrowIfNull(requests);
        ArgumentNullException.ThrowIfNull(plan);
        plan.Validate();
        if (requests.Count == 0)
        {
            throw new ToolException(ExitCodes.Usage, "No requests to send.");
        }

        using var stop = CancellationTokenSource.CreateLinkedTokenSource(cancellationToken);
        stop.CancelAfter(plan.Duration);
        var latencies = new ConcurrentBag<double>();
        var errors = new ConcurrentDictionary<string, long>(StringComparer.Ordinal);
        var indicators = new ConcurrentDictionary<string, long>(StringComparer.Ordinal);
        long issued = -1;
        long completed = 0;
        long failed = 0;
        var clock = Stopwatch.StartNew();

        async Task WorkerAsync()
        {
            while (!stop.IsCancellationRequested)
            {
                var n = Interlocked.Increment(ref issued);
                if (plan.Requests is { } max && n >= max)
                {
                    return;
                }

                var request = requests[(int)(n % requests.Count)];
                var started = Stopwatch.GetTimestamp();
                var kind = await SendAsync(client, request, indicators, stop.Token).ConfigureAwait(false);
                if (kind == "cancelled")
                {
                    return;
                }

                latencies.Add(Stopwatch.GetElapsedTime(started).TotalMilliseconds);
                Interlocked.Increment(ref completed);
                if (kind is not null)
                {
                    Interlocked.Increment(ref failed);
                    errors.AddOrUpdate(kind, 1, (_, c) => c + 1);
                }
            }
        }

        var workers = Enumerable.Range(0, plan.Concurrency).Select(_ => Task.Run(WorkerAsync, CancellationToken.None)).ToArray();
        var all = Task.WhenAll(workers);
        while (!all.IsCompleted)
        {
            await Task.WhenAny(all, Task.Delay(250, CancellationToken.None)).ConfigureAwait(false);
            progress?.Report(new LoadProgress(Interlocked.Read(ref completed), Interlocked.Read(ref failed), clock.Elapsed));
        }

        await all.ConfigureAwait(false);
        var elapsed = clock.Elapsed.TotalSeconds;
        var done = Interlocked.Read(ref completed);
        return new LoadReport
        {
            Target = client.BaseAddress?.ToString() ?? "(in memory)",
            Concurrency = plan.Concurrency,
            ElapsedSeconds = Math.Round(elapsed, 3),
            Requests = done,
            Succeeded = done - Interlocked.Read(ref failed),
            Errors = Interlocked.Read(ref failed),
            ErrorsByKind = new SortedDictionary<string, long>(errors, StringComparer.Ordinal),
            ThroughputPerSecond = elapsed > 0 ? Math.Round(done / elapsed, 1) : 0,
            Latency = LatencySummary.Of(latencies.ToList()),
            CardsByIndicator = new SortedDictionary<string, long>(indicators, StringComparer.Ordinal),
        };
    }

    /// <summary>Sends one request; null on success, else the error kind ("cancelled" when the run ended mid-request).</summary>
    private static async Task<string?> SendAsync(HttpClient client, LoadRequest request, ConcurrentDictionary<string, long> indicators, CancellationToken stop)
    {
        try
        {
            using var content = new StringContent(request.Body, Encoding.UTF8, "application/json");
            using var response = await client.PostAsync(new Uri("cds-services/" + request.ServiceId, UriKind.Relative), content, stop).ConfigureAwait(false);
            var text = await response.Content.ReadAsStringAsync(stop).ConfigureAwait(false);
            if (!response.IsSuccessStatusCode)
            {
                return "http-" + ((int)response.StatusCode).ToString(CultureInfo.InvariantCulture);
            }

            if (JsonNode.Parse(text)?["cards"] is not JsonArray cards)
            {
                return "not-json";
            }

            foreach (var card in cards)
            {
                indicators.AddOrUpdate((string?)card?["indicator"] ?? "(none)", 1, (_, c) => c + 1);
            }

            return null;
        }
        catch (OperationCanceledException) when (stop.IsCancellationRequested)
        {
            return "cancelled";
        }
        catch (TaskCanceledException)
        {
            return "timeout";
        }
        catch (HttpRequestException ex) when (ex.InnerException is SocketException || ex.HttpRequestError == HttpRequestError.ConnectionError)
        {
            return "connection";
        }
        catch (HttpRequestException)
        {
            return "http-protocol";
        }
        catch (System.Text.Json.JsonException)
        {
            return "not-json";
        }
    }
}
