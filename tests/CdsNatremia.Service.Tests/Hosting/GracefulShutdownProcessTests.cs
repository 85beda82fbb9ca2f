using System.Net;
using CdsNatremia.Service.Tests.Support;
using Xunit.Abstractions;

namespace CdsNatremia.Service.Tests.Hosting;

/// <summary>
/// The real service process (started from the built DLL on a loopback port) is sent SIGTERM while six clients keep
/// calling it. Readiness must turn to "draining" first, every answer must arrive whole, every answered call must have
/// its audit records (exactly its cards, once each), and the process must exit 0.
/// </summary>
public sealed class GracefulShutdownProcessTests(ITestOutputHelper output) : IDisposable
{
    private readonly string _data = Path.Combine(Path.GetTempPath(), "natremia-shutdown-tests", Guid.NewGuid().ToString("N"));

    [Fact]
    public async Task Sigterm_DuringLoad_ReadinessDrainsFirstNoAnswerCutEveryAnswerAuditedExitZero()
    {
        using var service = ServiceProcess.Start(new Dictionary<string, string?>
        {
            ["Natremia:Audit:DataDirectory"] = _data,
            ["Natremia:Shutdown:ReadinessDelay"] = "00:00:02",
            ["Natremia:Shutdown:DrainTimeout"] = "00:00:30",
        });
        await service.WaitReadyAsync(TimeSpan.FromSeconds(90));

        var load = new HookLoad();
        using var stop = new CancellationTokenSource(TimeSpan.FromMinutes(3)); // a bound, never reached when the service stops
        var running = load.RunAsync(service.BaseAddress, workers: 6, maxCalls: 100_000, stopWhenRefused: true, stop.Token);
        while (load.Answered < 30 && !running.IsCompleted)
        {
            await Task.Delay(20);
        }

        load.Mark();
        service.Terminate();
        var readiness = await PollReadinessAsync(service);
        var exited = await service.WaitForExitAsync(TimeSpan.FromSeconds(60)) is not null;
        stop.Cancel();
        await running;
        foreach (var line in service.Output.Where(l => l.Contains("Shutdown", StringComparison.Ordinal)))
        {
            output.WriteLine(line);
        }

        var results = load.Results;
        var answered = results.Where(r => r.Status == 200 && !r.Cut).ToList();
        output.WriteLine($"calls {results.Count}, answered {answered.Count} ({answered.Count(r => r.StartedAfter)} sent after SIGTERM), refused before any answer {results.Count(r => r.Status == 0)}, cut {results.Count(r => r.Cut)}, readiness seen {string.Join(", ", readiness)}");

        Assert.True(exited, "the service did not exit after SIGTERM");
        Assert.Equal(0, service.ExitCode);
        Assert.Contains("draining", readiness); // readiness went false while the server still answered
        Assert.DoesNotContain(results, r => r.Cut);
        Assert.DoesNotContain(results, r => r.Status is not (0 or 200)); // no 5xx on the way down
        Assert.Contains(answered, r => r.StartedAfter); // the shutdown really happened under load

        var audited = AuditedCalls.CardsByHookInstance(Path.Combine(_data, "audit.db"), replayLog: false);
        AuditedCalls.AssertEachAnsweredCallHasExactlyItsCards(answered, audited, string.Empty);
        Assert.Contains(service.Output, l => l.Contains("audit trail (sqlite) flushed", StringComparison.Ordinal));
    }

    /// <summary>Polls /readyz after the signal until the server stops answering; returns the statuses seen.</summary>
    private static async Task<List<string>> PollReadinessAsync(ServiceProcess service)
    {
        using var client = new HttpClient { BaseAddress = service.BaseAddress, Timeout = TimeSpan.FromSeconds(5) };
        var seen = new List<string>();
        var failures = 0;
        while (failures < 3 && !service.HasExited)
        {
            try
            {
                using var response = await client.GetAsync(new Uri("/readyz", UriKind.Relative));
                var body = await response.Content.ReadAsStringAsync();
                var status = response.StatusCode == HttpStatusCode.OK ? "ready" : body.Contains("draining", StringComparison.Ordinal) ? "draining" : ((int)response.StatusCode).ToString(System.Globalization.CultureInfo.InvariantCulture);
                if (seen.Count == 0 || seen[^1] != status)
                {
                    seen.Add(status);
                }

                failures = 0;
            }
            catch (Exception ex) when (ex is HttpRequestException or TaskCanceledException)
            {
                failures++;
            }

            await Task.Delay(50);
        }

        return seen;
    }

    public void Dispose()
    {
        try
        {
            Directory.Delete(_data, recursive: true);
        }
        catch (IOException)
        {
            // A temp folder left behind is harmless.
        }
    }
}
