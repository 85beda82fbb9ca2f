using CdsNatremia.Service.Tests.Support;
using Xunit.Abstractions;

namespace CdsNatremia.Service.Tests.Hosting;

/// <summary>
/// The real service process (started from the built DLL on a loopback port) is killed with SIGKILL while eight clients
/// keep calling it, with group commit on (the default). Whatever was in flight is lost, but every call that received a
/// whole answer must find its cards in the SQLite file the process left: an answer leaves only after its record is
/// committed, and a commit survives a crash.
/// </summary>
public sealed class CrashProcessTests(ITestOutputHelper output) : IDisposable
{
    private readonly string _data = Path.Combine(Path.GetTempPath(), "natremia-crash-tests", Guid.NewGuid().ToString("N"));

    [Fact]
    public async Task Sigkill_DuringLoad_EveryAnsweredCallHasItsRecordsInTheFile()
    {
        using var service = ServiceProcess.Start(new Dictionary<string, string?> { ["Natremia:Audit:DataDirectory"] = _data });
        await service.WaitReadyAsync(TimeSpan.FromSeconds(90));

        var load = new HookLoad();
        using var stop = new CancellationTokenSource(TimeSpan.FromMinutes(3)); // a bound, never reached when the kill lands
        var running = load.RunAsync(service.BaseAddress, workers: 8, maxCalls: 100_000, stopWhenRefused: true, stop.Token);
        while (load.Answered < 60 && !running.IsCompleted)
        {
            await Task.Delay(20);
        }

        service.KillNow(); // SIGKILL: no shutdown step runs, the write-ahead log is not checkpointed
        var exited = await service.WaitForExitAsync(TimeSpan.FromSeconds(30)) is not null;
        stop.Cancel();
        await running;

        var results = load.Results;
        var answered = results.Where(r => r.Status == 200 && !r.Cut).ToList();
        var audited = AuditedCalls.CardsByHookInstance(Path.Combine(_data, "audit.db"), replayLog: true);
        output.WriteLine($"calls {results.Count}, answered {answered.Count}, without answer {results.Count(r => r.Status == 0)}, cut {results.Count(r => r.Cut)}, hook calls recorded {audited.Count}");

        Assert.True(exited, "the service did not end after SIGKILL");
        Assert.True(answered.Count >= 60, $"only {answered.Count} calls were answered before the kill");
        AuditedCalls.AssertEachAnsweredCallHasExactlyItsCards(answered, audited, " after the crash");
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
