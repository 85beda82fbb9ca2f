using System.Collections.Concurrent;
using System.Diagnostics;
using System.Net;
using System.Net.Sockets;
using System.Runtime.InteropServices;

namespace CdsNatremia.Service.Tests.Support;

/// <summary>
/// The service as operators run it: a separate process started from the built CdsNatremia.Service.dll
/// (<c>dotnet CdsNatremia.Service.dll --urls http://127.0.0.1:PORT</c>) with its settings in environment variables, on
/// a loopback port, its standard output and error captured. For what only a real process shows: the exit code and what
/// a refused start prints, several instances sharing one database, SIGTERM (as a container runtime sends) and a kill.
/// Without a "Natremia:Audit:DataDirectory" setting the process gets a data folder of its own, deleted on dispose.
/// </summary>
public sealed class ServiceProcess : IDisposable, IAsyncDisposable
{
    private const int SigTerm = 15;
    private readonly Process _process;
    private readonly ConcurrentQueue<(bool Error, string Line)> _lines = new();
    private readonly string? _ownDataDirectory;

    private ServiceProcess(Process process, int port, string dataDirectory, bool ownsData)
    {
        _process = process;
        Port = port;
        DataDirectory = dataDirectory;
        _ownDataDirectory = ownsData ? dataDirectory : null;
    }

    public int Port { get; }

    /// <summary>Where the process listens.</summary>
    public Uri BaseAddress => new($"http://127.0.0.1:{Port}");

    /// <summary>The process's audit data folder.</summary>
    public string DataDirectory { get; }

    public int Id => _process.Id;

    public bool HasExited => _process.HasExited;

    public int ExitCode => _process.ExitCode;

    /// <summary>Everything the process wrote to standard output and error, in order of arrival.</summary>
    public IReadOnlyList<string> Output => [.. _lines.Select(l => l.Line)];

    /// <summary>Everything written to standard error so far.</summary>
    public string StandardError => Text(error: true);

    /// <summary>Everything written to standard output so far.</summary>
    public string StandardOutput => Text(error: false);

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

    /// <summary>The built service: the copy beside the test binaries (a project reference copies it there).</summary>
    public static string ServiceDll()
    {
        var dll = Path.Combine(AppContext.BaseDirectory, "CdsNatremia.Service.dll");
        return File.Exists(dll) ? dll : throw new FileNotFoundException("Build the service first: " + dll);
    }

    /// <summary>A loopback port free right now.</summary>
    public static int FreePort()
    {
        using var listener = new TcpListener(IPAddress.Loopback, 0);
        listener.Start();
        return ((IPEndPoint)listener.LocalEndpoint).Port;
    }

    /// <summary>Starts the service in <paramref name="environment"/> with the given settings (configuration keys such as "Natremia:Audit:PseudonymKey").</summary>
    public static ServiceProcess Start(string environment, IReadOnlyDictionary<string, string?> settings) => Start(settings, port: null, environment);

    /// <summary>Starts the service on a loopback port with these settings (configuration keys, e.g. "Natremia:Audit:DataDirectory").</summary>
    public static ServiceProcess Start(IReadOnlyDictionary<string, string?> settings, int? port = null, string environment = "Development")
    {
        ArgumentNullException.ThrowIfNull(settings);
        var chosen = port ?? FreePort();
        var dll = ServiceDll();
        var ownsData = !settings.TryGetValue("Natremia:Audit:DataDirectory", out var configured) || configured is null;
        var data = ownsData ? Path.Combine(Path.GetTempPath(), "natremia-process-tests", Guid.NewGuid().ToString("N")) : configured!;
        var info = new ProcessStartInfo("dotnet")
        {
            WorkingDirectory = Path.GetDirectoryName(dll)!,
            RedirectStandardOutput = true,
            RedirectStandardError = true,
            UseShellExecute = false,
        };
        info.ArgumentList.Add(dll);
        info.ArgumentList.Add("--urls");
        info.ArgumentList.Add($"http://127.0.0.1:{chosen}");
        info.Environment["ASPNETCORE_ENVIRONMENT"] = environment;
        info.Environment["DOTNET_ENVIRONMENT"] = environment;
        info.Environment["DOTNET_NOLOGO"] = "1";
        info.Environment["Logging__Console__FormatterName"] = "simple";
        info.Environment["Logging__Console__FormatterOptions__SingleLine"] = "true";
        info.Environment["Natremia__Audit__DataDirectory"] = data;
        foreach (var (key, value) in settings)
        {
            info.Environment[key.Replace(":", "__", StringComparison.Ordinal)] = value;
        }

        var process = new Process { StartInfo = info, EnableRaisingEvents = true };
        var service = new ServiceProcess(process, chosen, data, ownsData);
        process.OutputDataReceived += (_, e) => { if (e.Data is not null) service._lines.Enqueue((false, e.Data)); };
        process.ErrorDataReceived += (_, e) => { if (e.Data is not null) service._lines.Enqueue((true, e.Data)); };
        process.Start();
        process.BeginOutputReadLine();
        process.BeginErrorReadLine();
        return service;
    }

    /// <summary>Waits until /readyz answers 200; false if the process ended or the wait ran out first.</summary>
    public async Task<bool> WaitUntilReadyAsync(TimeSpan within)
    {
        using var client = new HttpClient { BaseAddress = BaseAddress, Timeout = TimeSpan.FromSeconds(5) };
        var deadline = Stopwatch.StartNew();
        while (deadline.Elapsed < within)
        {
            if (_process.HasExited)
            {
                return false;
            }

            try
            {
                if ((await client.GetAsync(new Uri("/readyz", UriKind.Relative))).StatusCode == HttpStatusCode.OK)
                {
                    return true;
                }
            }
            catch (Exception ex) when (ex is HttpRequestException or TaskCanceledException)
            {
                // Not listening yet, or a slow machine.
            }

            await Task.Delay(100);
        }

        return false;
    }

    /// <summary>Waits until /readyz answers 200; throws with the last output lines if the process ends or the wait runs out.</summary>
    public async Task WaitReadyAsync(TimeSpan within)
    {
        if (!await WaitUntilReadyAsync(within))
        {
            var state = _process.HasExited ? $"exited with {_process.ExitCode}" : $"was not ready within {within}";
            throw new InvalidOperationException($"The service on port {Port} {state}:\n{string.Join('\n', Output.TakeLast(30))}");
        }
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

    /// <summary>Waits for the process to end and returns its exit code; null if it is still running after the wait.</summary>
    public async Task<int?> WaitForExitAsync(TimeSpan within)
    {
        using var timeout = new CancellationTokenSource(within);
        try
        {
            await _process.WaitForExitAsync(timeout.Token);
        }
        catch (OperationCanceledException)
        {
            return null;
        }

        _process.WaitForExit(); // drains the redirected streams
        return _process.ExitCode;
    }

    public void Dispose()
    {
        if (!_process.HasExited)
        {
            _process.Kill(entireProcessTree: true);
            _process.WaitForExit(10_000);
        }

        _process.Dispose();
        DeleteOwnData();
    }

    public ValueTask DisposeAsync()
    {
        Dispose();
        return ValueTask.CompletedTask;
    }

    private string Text(bool error) => string.Join('\n', _lines.Where(l => l.Error == error).Select(l => l.Line));

    private void DeleteOwnData()
    {
        try
        {
            if (_ownDataDirectory is not null && Directory.Exists(_ownDataDirectory))
            {
                Directory.Delete(_ownDataDirectory, recursive: true);
            }
        }
        catch (IOException)
        {
            // best effort
        }
    }

    [DllImport("libc", EntryPoint = "kill", SetLastError = true)]
    [DefaultDllImportSearchPaths(DllImportSearchPath.SafeDirectories)]
    private static extern int Kill(int pid, int signal);
}
