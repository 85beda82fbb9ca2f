using System.Diagnostics;
using System.Globalization;
using System.Net.Sockets;
using System.Text;

namespace CdsNatremia.Service.Tests.Support;

/// <summary>
/// HAProxy (the Debian package) in front of service instances on loopback: round robin, health checks on /readyz
/// every 300 ms (down after 2 failures), failed connections retried on another instance, and the answering
/// instance's name in an X-Natremia-Test-Backend response header. Its runtime socket reports each server's state.
/// </summary>
public sealed class HaproxyProcess : IDisposable
{
    private readonly Process _process;
    private readonly string _folder;

    private HaproxyProcess(Process process, string folder, int port)
    {
        _process = process;
        _folder = folder;
        Port = port;
    }

    public int Port { get; }

    public Uri BaseAddress => new($"http://127.0.0.1:{Port}");

    private string Socket => Path.Combine(_folder, "admin.sock");

    /// <summary>The haproxy executable, or null when not installed.</summary>
    public static string? Executable()
        => new[] { "/usr/sbin/haproxy", "/usr/bin/haproxy", "/usr/local/sbin/haproxy" }.FirstOrDefault(File.Exists);

    public static HaproxyProcess Start(IReadOnlyList<(string Name, int Port)> servers)
    {
        ArgumentNullException.ThrowIfNull(servers);
        var folder = Path.Combine(Path.GetTempPath(), "natremia-haproxy", Guid.NewGuid().ToString("N"));
        Directory.CreateDirectory(folder);
        var port = ServiceProcess.FreePort();
        var config = new StringBuilder();
        config.AppendLine(CultureInfo.InvariantCulture, $"""
            global
                maxconn 512
                stats socket {Path.Combine(folder, "admin.sock")} mode 600 level admin

            defaults
                mode http
                timeout connect 2s
                timeout client 60s
                timeout server 60s
                retries 3
                option redispatch
                option http-server-close

            frontend cds
                bind 127.0.0.1:{port}
                default_backend instances

            backend instances
                balance roundrobin
                option httpchk GET /readyz
                http-check expect status 200
                default-server inter 300ms fastinter 200ms downinter 500ms fall 2 rise 2
                http-response set-header X-Natremia-Test-Backend %s
            """);
        foreach (var (name, serverPort) in servers)
        {
            config.AppendLine(CultureInfo.InvariantCulture, $"    server {name} 127.0.0.1:{serverPort} check");
        }

        var file = Path.Combine(folder, "haproxy.cfg");
        File.WriteAllText(file, config.ToString());
        var info = new ProcessStartInfo(Executable() ?? "haproxy") { UseShellExecute = false, RedirectStandardOutput = true, RedirectStandardError = true };
        info.ArgumentList.Add("-db");
        info.ArgumentList.Add("-f");
        info.ArgumentList.Add(file);
        var process = Process.Start(info)!;
        process.OutputDataReceived += (_, _) => { };
        process.ErrorDataReceived += (_, _) => { };
        process.BeginOutputReadLine();
        process.BeginErrorReadLine();
        return new HaproxyProcess(process, folder, port);
    }

    /// <summary>Each server's state as HAProxy's health checks see it ("UP", "DOWN", …), from "show stat".</summary>
    public async Task<Dictionary<string, string>> ServerStatesAsync()
    {
        using var socket = new Socket(AddressFamily.Unix, SocketType.Stream, ProtocolType.Unspecified);
        await socket.ConnectAsync(new UnixDomainSocketEndPoint(Socket));
        await socket.SendAsync(Encoding.ASCII.GetBytes("show stat\n"), SocketFlags.None);
        var text = new StringBuilder();
        var buffer = new byte[8192];
        int read;
        while ((read = await socket.ReceiveAsync(buffer, SocketFlags.None)) > 0)
        {
            text.Append(Encoding.ASCII.GetString(buffer, 0, read));
        }

        var lines = text.ToString().Split('\n', StringSplitOptions.RemoveEmptyEntries);
        var header = lines[0].TrimStart('#', ' ').Split(',');
        int Column(string name) => Array.IndexOf(header, name);
        return lines.Skip(1).Select(l => l.Split(','))
            .Where(f => f.Length > Column("status") && f[Column("pxname")] == "instances" && f[Column("svname")] is not ("FRONTEND" or "BACKEND"))
            .ToDictionary(f => f[Column("svname")], f => f[Column("status")], StringComparer.Ordinal);
    }

    /// <summary>Waits until the named servers are in the given state (bounded); returns whether they got there.</summary>
    public async Task<bool> WaitForAsync(Func<Dictionary<string, string>, bool> condition, TimeSpan within)
    {
        var watch = Stopwatch.StartNew();
        while (watch.Elapsed < within)
        {
            try
            {
                if (condition(await ServerStatesAsync()))
                {
                    return true;
                }
            }
            catch (SocketException)
            {
                // Socket not there yet.
            }

            await Task.Delay(100);
        }

        return false;
    }

    public void Dispose()
    {
        if (!_process.HasExited)
        {
            _process.Kill();
            _process.WaitForExit(5_000);
        }

        _process.Dispose();
        try
        {
            Directory.Delete(_folder, recursive: true);
        }
        catch (IOException)
        {
            // Left in /tmp: harmless.
        }
    }
}
