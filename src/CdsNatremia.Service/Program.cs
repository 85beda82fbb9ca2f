using CdsNatremia.Service.Configuration;

var builder = WebApplication.CreateBuilder(args);
builder.AddNatremia();

var app = builder.Build();
app.UseNatremia();
app.Run();

/// <summary>The entry point; public so integration tests can host it.</summary>
public partial class Program;
