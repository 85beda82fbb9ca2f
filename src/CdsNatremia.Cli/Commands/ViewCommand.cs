using System.ComponentModel;
using System.Text.Json;
using System.Text.Json.Nodes;
using CdsNatremia.Cli.Hosting;
using CdsNatremia.Cli.Replay;
using CdsNatremia.Scenarios;
using CdsNatremia.Service.Configuration;
using CdsNatremia.Service.Course;
using Microsoft.AspNetCore.Builder;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.DependencyInjection.Extensions;
using Microsoft.Extensions.Hosting;
using Microsoft.Extensions.Logging;
using Spectre.Console;
using Spectre.Console.Cli;

namespace CdsNatremia.Cli.Commands;

/// <summary>
/// natremia view: the sodium-course page of a scenario or a Bundle file, written as one self-contained HTML file (the
/// same page the service shows after a SMART launch, with its style inline), for integration work and review meetings.
/// </summary>
internal sealed class ViewCommand : AsyncCommand<ViewCommand.Settings>
{
    internal sealed class Settings : CommandSettings
    {
        [CommandArgument(0, "<BUNDLE-OR-SCENARIO>")]
        [Description("A scenario id or number (see 'scenarios list'), or a FHIR R4 Bundle file of one patient.")]
        public string Input { get; set; } = string.Empty;

        [CommandOption("--out <FILE>")]
        [Description("The HTML file to write. Default course.html.")]
        public string Out { get; set; } = "course.html";

        [CommandOption("--patient <ID>")]
        [Description("For a Bundle: the patient's id (default: the Bundle's only Patient).")]
        public string? Patient { get; set; }

        [CommandOption("--as-of <WHEN>")]
        [Description("Draw the course as of: 'now', 'anchor' or an ISO 8601 instant. Default: a scenario at its anchor (as written), a file now.")]
        public string? AsOf { get; set; }

        [CommandOption("--time-zone <IANA>")]
        [Description("Show times in this IANA time zone (the service's Natremia:Display:TimeZone). Default UTC.")]
        public string TimeZone { get; set; } = "UTC";
    }

    public override async Task<int> ExecuteAsync(CommandContext context, Settings settings, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(settings);
        ReplayInput input;
        DateTimeOffset asOf;
        if (!File.Exists(settings.Input) && ScenarioLibrary.Find(settings.Input) is { } scenario)
        {
            asOf = CommandSupport.AsOf(settings.AsOf ?? "anchor", TimeProvider.System);
            input = ReplayInput.FromScenario(scenario, asOf - ScenarioLibrary.Anchor);
        }
        else
        {
            asOf = CommandSupport.AsOf(settings.AsOf ?? "now", TimeProvider.System);
            input = ReplayInput.FromBundle(Path.GetFileName(settings.Input), CommandSupport.ReadFile(settings.Input), settings.Patient, null, [], [], TimeSpan.Zero);
        }

        try
        {
            TimeZoneInfo.FindSystemTimeZoneById(settings.TimeZone);
        }
        catch (Exception ex) when (ex is TimeZoneNotFoundException or InvalidTimeZoneException)
        {
            throw new ToolException(ExitCodes.Usage, $"--time-zone '{settings.TimeZone}' is not a known IANA time-zone id (e.g. UTC, Europe/Berlin).");
        }

        var html = await RenderAsync(input, asOf, settings.TimeZone, cancellationToken).ConfigureAwait(false);
        var folder = Path.GetDirectoryName(Path.GetFullPath(settings.Out));
        if (folder is not null)
        {
            Directory.CreateDirectory(folder);
        }

        await File.WriteAllTextAsync(settings.Out, html, cancellationToken).ConfigureAwait(false);
        AnsiConsole.MarkupLine("Wrote the sodium course of [bold]" + Markup.Escape(input.Name) + "[/] to " + Markup.Escape(settings.Out));
        return ExitCodes.Ok;
    }

    /// <summary>The page, from the service's own loader and renderer, with its clock at <paramref name="asOf"/>.</summary>
    internal static async Task<string> RenderAsync(ReplayInput input, DateTimeOffset asOf, string timeZone, CancellationToken cancellationToken)
    {
        var builder = WebApplication.CreateBuilder(new WebApplicationOptions
        {
            EnvironmentName = "Development",
            ContentRootPath = AppContext.BaseDirectory,
            Args = [],
        });
        builder.Logging.ClearProviders();
        builder.Configuration["Natremia:Display:TimeZone"] = timeZone;
        builder.Configuration["Natremia:Audit:DataDirectory"] = Path.Combine(Path.GetTempPath(), "natremia-view", Guid.NewGuid().ToString("N"));
        builder.AddNatremia();
        builder.Services.RemoveAll<TimeProvider>();
        builder.Services.AddSingleton<TimeProvider>(new FixedTimeProvider(asOf));
        await using var app = builder.Build();
        var body = new JsonObject
        {
            ["hookInstance"] = Guid.NewGuid().ToString(),
            ["hook"] = "patient-view",
            ["context"] = new JsonObject { ["userId"] = ReplayInput.DefaultUserId, ["patientId"] = input.PatientId },
            ["prefetch"] = HookRequestBuilder.Prefetch(input.Resources),
        };
        using var document = JsonDocument.Parse(body.ToJsonString());
        var loaded = await app.Services.GetRequiredService<CourseLoader>().LoadAsync(document.RootElement, cancellationToken).ConfigureAwait(false);
        if (loaded.Data is not { } data)
        {
            throw new ToolException(ExitCodes.Failure, "The course could not be drawn: " + string.Join("; ", loaded.Unavailable!.Reasons));
        }

        var report = app.Services.GetRequiredService<CourseReport>().Render(data.Cards);
        return CoursePage.Render(data, report, inlineStyle: true);
    }
}
