using System.Diagnostics;
using System.Net;
using System.Net.Sockets;
using System.Text;

namespace CdsNatremia.Service.Tests.Support;

/// <summary>
/// The real service as its own process (<c>dotnet CdsNatremia.Service.dll</c>, the copy beside the test binaries),
/// configured through environment variables, with its standard output and error captured. For what only a real
/// process shows: the exit code and what a refused start prints, and several instances sharing one database.
/// </summary>
public sealed class ServiceProcess : IAsyncDisposable
{
    private readonly Process _process;
    private readonly StringBuilder _stdout = new();
    private readonly StringBuilder _stderr = new();
    private readonly Lock _gate = new();

    private ServiceProcess(Process process, Uri baseAddress, string dataDirectory)
    {
        _process = process;
        BaseAddress = baseAddress;
        DataDirectory = dataDirectory;
    }

    /// <summary>Where the process listens (a free loopback port chosen at start).</summary>
    public Uri BaseAddress { get; }

    /// <summary>The process's own audit data folder (deleted on dispose).</summary>
    public string DataDirectory { get; }

    /// <summary>Everything written to standard error so far.</summary>
    public string StandardError
    {
        get
        {
            lock (_gate)
            {
                return _stderr.ToString();
            }
        }
    }

    /// <summary>Everything written to standard output so far.</summary>
    public string StandardOutput
    {
        get
        {
            lock (_gate)
            {
                return _stdout.ToString();
            }
        }
    }

    /// <summary>
    /// Starts the service in <paramref name="environment"/> with the given settings (configuration keys such as
    /// "Natremia:Audit:PseudonymKey"; written as environment variables with "__").
    /// </summary>
    public static ServiceProcess Start(string environment, IReadOnlyDictionary<string, string?> settings)
    {
        ArgumentNullException.ThrowIfNull(settings);
        var binaries = AppContext.BaseDirectory;
        var port = FreePort();
        var data = Path.Combine(Path.GetTempPath(), "natremia-process-tests", Guid.NewGuid().ToString("N"));
        var start = new ProcessStartInfo("dotnet", [Path.Combine(binaries, "CdsNatremia.Service.dll")])
        {
            WorkingDirectory = binaries,
            RedirectStandardOutput = true,
            RedirectStandardError = true,
            UseShellExecute = false,
        };
        start.Environment["ASPNETCORE_ENVIRONMENT"] = environment;
        start.Environment["DOTNET_ENVIRONMENT"] = environment;
        start.Environment["ASPNETCORE_URLS"] = $"http://127.0.0.1:{port}";
        start.Environment["Urls"] = $"http://127.0.0.1:{port}"; // appsettings.json sets Urls; the environment wins over it
        start.Environment["Natremia__Audit__DataDirectory"] = data;
        start.Environment["DOTNET_NOLOGO"] = "1";
        foreach (var (key, value) in settings)
        {
            start.Environment[key.Replace(":", "__", StringComparison.Ordinal)] = value;
        }

        var process = new Process { StartInfo = start, EnableRaisingEvents = true };
        var service = new ServiceProcess(process, new Uri($"http://127.0.0.1:{port}"), data);
        process.OutputDataReceived += (_, e) => service.Append(service._stdout, e.Data);
        process.ErrorDataReceived += (_, e) => service.Append(service._stderr, e.Data);
        process.Start();
        process.BeginOutputReadLine();
        process.BeginErrorReadLine();
        return service;
    }

    /// <summary>Waits for the process to end (a refused start) and returns its exit code; null if it is still running after the wait.</summary>
    public async Task<int?> WaitForExitAsync(TimeSpan wait)
    {
        using var timeout = new CancellationTokenSource(wait);
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

    /// <summary>Waits until /readyz answers 200; false if the process ended or the wait ran out first.</summary>
    public async Task<bool> WaitUntilReadyAsync(TimeSpan wait)
    {
        using var client = new HttpClient { BaseAddress = BaseAddress, Timeout = TimeSpan.FromSeconds(5) };
        var deadline = Stopwatch.StartNew();
        while (deadline.Elapsed < wait)
        {
            if (_process.HasExited)
            {
                return false;
            }

            try
            {
                if ((await client.GetAsync("/readyz")).StatusCode == HttpStatusCode.OK)
                {
                    return true;
                }
            }
            catch (HttpRequestException)
            {
                // not listening yet
            }
            catch (TaskCanceledException)
            {
                // slow machine
            }

            await Task.Delay(200);
        }

        return false;
    }

    public async ValueTask DisposeAsync()
    {
        if (!_process.HasExited)
        {
            _process.Kill(entireProcessTree: true);
            await _process.WaitForExitAsync();
        }

        _process.Dispose();
        try
        {
            if (Directory.Exists(DataDirectory))
            {
                Directory.Delete(DataDirectory, recursive: true);
            }
        }
        catch (IOException)
        {
            // best effort
        }
    }

    private void Append(StringBuilder target, string? line)
    {
        if (line is null)
        {
            return;
        }

        lock (_gate)
        {
            target.AppendLine(line);
        }
    }

    private static int FreePort()
    {
        using var listener = new TcpListener(IPAddress.Loopback, 0);
        listener.Start();
        return ((IPEndPoint)listener.LocalEndpoint).Port;
    }
}
