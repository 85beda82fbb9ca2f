using CdsNatremia.Service.Configuration;
using CdsNatremia.Service.Hosting;
using CdsNatremia.Service.Telemetry;

try
{
    var builder = WebApplication.CreateBuilder(args);
    builder.AddNatremia();
    builder.AddNatremiaTelemetry();
    builder.AddNatremiaGracefulShutdown();

    var app = builder.Build();

    // Every ValidateOnStart check runs here, so a bad setting stops the start before anything listens.
    StartupRefusal.ValidateNow(app.Services);
    app.UseNatremiaGracefulShutdown();
    app.UseNatremiaTelemetry();
    app.UseNatremia();
    app.Run();
    return 0;
}
catch (Exception ex) when (StartupRefusal.IsProcessEntry && StartupRefusal.Describe(ex) is { } reason)
{
    // One line naming the setting and the fix, and a non-zero exit code; no stack trace for a configuration problem.
    Console.Error.WriteLine(StartupRefusal.LogLine(reason));
    return StartupRefusal.ExitCode;
}

/// <summary>The entry point; public so integration tests can host it.</summary>
public partial class Program;
