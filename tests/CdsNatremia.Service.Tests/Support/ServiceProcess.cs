using System.Collections.Concurrent;
using System.Diagnostics;
using System.Net;
using System.Net.Sockets;
using System.Runtime.InteropServices;

namespace CdsNatremia.Service.Tests.Support;

/// <summary>
/// The service as operators run it: a separate process started from the built CdsNatremia.Service.dll
/// (<c>dotnet CdsNatremia.Service.dll --urls http://127.0.0.1:PORT</c>) with its settings in environment variables,
/// on a loopback port. It can be sent SIGTERM (as a container runtime does) or killed outright.
/// </summary>
public sealed class ServiceProcess : IDisposable
{
    private const int SigTerm = 15;
    private readonly Process _process;
    private readonly ConcurrentQueue<string> _output = new();

    private ServiceProcess(Process process, int port)
    {
        _process = process;
        Port = port;
    }

    public int Port { get; }

    public Uri BaseAddress => new($"http://127.0.0.1:{Port}");

    public int Id => _process.Id;

    public bool HasExited => _process.HasExited;

    public int ExitCode => _process.ExitCode;

    /// <summary>Everything the process wrote to standard output and error, in order.</summary>
    public IReadOnlyList<string> Output => [.. _output];

    /// <summary>The repository root (the folder holding CdsNatremia.sln) above the test's binaries.</summary>
    public static string RepositoryRoot()
    {
        var folder = new DirectoryInfo(AppContext.BaseDirectory);
        while (folder is not null && !File.Exists(Path.Combine(folder.FullName, "CdsNatremia.sln")))
        {
            folder = folder.Parent;
        }

        return folder?.FullName ?? throw new InvalidOperationException("CdsNatremia.sln not found above " + AppContext.BaseDirectory);
    }

    /// <summary>The built service DLL of the same configuration as the tests (Debug or Release).</summary>
    public static string ServiceDll()
    {
        var configuration = new DirectoryInfo(AppContext.BaseDirectory.TrimEnd(Path.DirectorySeparatorChar)).Parent!.Name; // …/bin/<configuration>/net10.0/
        var dll = Path.Combine(RepositoryRoot(), "src", "CdsNatremia.Service", "bin", configuration, "net10.0", "CdsNatremia.Service.dll");
        return File.Exists(dll) ? dll : throw new FileNotFoundException("Build the service first: " + dll);
    }

    /// <summary>A loopback port free right now.</summary>
    public static int FreePort()
    {
        using var listener = new TcpListener(IPAddress.Loopback, 0);
        listener.Start();
        return ((IPEndPoint)listener.LocalEndpoint).Port;
    }

    /// <summary>Starts the service on a loopback port with these settings (configuration keys, e.g. "Natremia:Audit:DataDirectory").</summary>
    public static ServiceProcess Start(IReadOnlyDictionary<string, string?> settings, int? port = null, string environment = "Development")
    {
        ArgumentNullException.ThrowIfNull(settings);
        var chosen = port ?? FreePort();
        var dll = ServiceDll();
        var info = new ProcessStartInfo("dotnet")
        {
            WorkingDirectory = Path.GetDirectoryName(dll)!,
            RedirectStandardOutput = true,
            RedirectStandardError = true,
            RedirectStandardInput = false,
            UseShellExecute = false,
        };
        info.ArgumentList.Add(dll);
        info.ArgumentList.Add("--urls");
        info.ArgumentList.Add($"http://127.0.0.1:{chosen}");
        info.Environment["ASPNETCORE_ENVIRONMENT"] = environment;
        info.Environment["DOTNET_ENVIRONMENT"] = environment;
        info.Environment["Logging__Console__FormatterName"] = "simple";
        info.Environment["Logging__Console__FormatterOptions__SingleLine"] = "true";
        foreach (var (key, value) in settings)
        {
            info.Environment[key.Replace(":", "__", StringComparison.Ordinal)] = value;
        }

        var process = new Process { StartInfo = info, EnableRaisingEvents = true };
        var service = new ServiceProcess(process, chosen);
        process.OutputDataReceived += (_, e) => { if (e.Data is not null) service._output.Enqueue(e.Data); };
        process.ErrorDataReceived += (_, e) => { if (e.Data is not null) service._output.Enqueue(e.Data); };
        process.Start();
        process.BeginOutputReadLine();
        process.BeginErrorReadLine();
        return service;
    }

    /// <summary>Waits until /readyz answers 200 (or the process exits, or the wait runs out).</summary>
    public async Task WaitReadyAsync(TimeSpan within)
    {
        using var client = new HttpClient { BaseAddress = BaseAddress, Timeout = TimeSpan.FromSeconds(5) };
        var deadline = Stopwatch.StartNew();
        while (deadline.Elapsed < within)
        {
            if (_process.HasExited)
            {
                throw new InvalidOperationException($"The service exited with {_process.ExitCode} before it was ready:\n{string.Join('\n', Output.TakeLast(30))}");
            }

            try
            {
                if ((await client.GetAsync(new Uri("/readyz", UriKind.Relative))).StatusCode == HttpStatusCode.OK)
                {
                    return;
                }
            }
            catch (Exception ex) when (ex is HttpRequestException or TaskCanceledException)
            {
                // Not listening yet.
            }

            await Task.Delay(100);
        }

        throw new TimeoutException($"The service on port {Port} was not ready within {within}:\n{string.Join('\n', Output.TakeLast(30))}");
    }

    /// <summary>Sends SIGTERM, as a container runtime or Kubernetes does to stop a pod.</summary>
    public void Terminate()
    {
        if (Kill(_process.Id, SigTerm) != 0)
        {
            throw new InvalidOperationException($"kill({_process.Id}, SIGTERM) failed: errno {Marshal.GetLastPInvokeError()}");
        }
    }

    /// <summary>Kills the process at once (SIGKILL): a crash, a pulled plug.</summary>
    public void KillNow() => _process.Kill(entireProcessTree: true);

    public async Task<bool> WaitForExitAsync(TimeSpan within)
    {
        using var timeout = new CancellationTokenSource(within);
        try
        {
            await _process.WaitForExitAsync(timeout.Token);
            return true;
        }
        catch (OperationCanceledException)
        {
            return false;
        }
    }

    public void Dispose()
    {
        if (!_process.HasExited)
        {
            _process.Kill(entireProcessTree: true);
            _process.WaitForExit(10_000);
        }

        _process.Dispose();
    }

    [DllImport("libc", EntryPoint = "kill", SetLastError = true)]
    [DefaultDllImportSearchPaths(DllImportSearchPath.SafeDirectories)]
    private static extern int Kill(int pid, int signal);
}
