using CdsNatremia.Service.Configuration;
using CdsNatremia.Service.Hosting;
using CdsNatremia.Service.Telemetry;

var builder = WebApplication.CreateBuilder(args);
builder.AddNatremia();
builder.AddNatremiaTelemetry();
builder.AddNatremiaGracefulShutdown();

var app = builder.Build();
app.UseNatremiaGracefulShutdown();
app.UseNatremiaTelemetry();
app.UseNatremia();
app.Run();

/// <summary>The entry point; public so integration tests can host it.</summary>
public partial class Program;
