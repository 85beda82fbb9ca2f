using System.ComponentModel;
using System.Globalization;
using System.Net;
using System.Text.Json;
using CdsNatremia.Audit.Reports;
using CdsNatremia.Cli.Hosting;
using Spectre.Console;
using Spectre.Console.Cli;

namespace CdsNatremia.Cli.Commands;

/// <summary>
/// natremia report: the override report of a running service (per rule: cards shown, accepted, overridden, and why),
/// read from its admin endpoint, printed as a table or JSON, and optionally drawn as an SVG chart of the override rate
/// per rule over time.
/// </summary>
internal sealed class ReportCommand : AsyncCommand<ReportCommand.Settings>
{
    internal sealed class Settings : CommandSettings
    {
        [CommandOption("--url <URL>")]
        [Description("Base URL of the service. Default http://127.0.0.1:5080.")]
        public string Url { get; set; } = "http://127.0.0.1:5080";

        [CommandOption("--from <DATE>")]
        [Description("First day of the range (YYYY-MM-DD, UTC, inclusive). Default: 30 days before --to.")]
        public string? From { get; set; }

        [CommandOption("--to <DATE>")]
        [Description("Last day of the range (YYYY-MM-DD, UTC, inclusive). Default: today.")]
        public string? To { get; set; }

        [CommandOption("--service <ID>")]
        [Description("Limit the report to one CDS service id.")]
        public string? Service { get; set; }

        [CommandOption("--admin-key <KEY>")]
        [Description("The service's admin key (Natremia:Audit:AdminApiKey). Default: the NATREMIA_ADMIN_KEY environment variable.")]
        public string? AdminKey { get; set; }

        [CommandOption("--chart <FILE.svg>")]
        [Description("Also write an SVG chart of the override rate per rule over time to this file.")]
        public string? Chart { get; set; }

        [CommandOption("--allow-host <HOST>")]
        [Description("A non-loopback host the tool may call (repeat for several). Without it only loopback hosts are called.")]
        public string[] AllowHosts { get; set; } = [];

        [CommandOption("--include-test")]
        [Description("Count the cards of requests marked as test traffic (the toolkit's own requests) too. Default: left out, and their number shown.")]
        public bool IncludeTest { get; set; }

        [CommandOption("--json")]
        [Description("Print the report as JSON.")]
        public bool Json { get; set; }

        public override ValidationResult Validate()
        {
            if (!Uri.TryCreate(Url, UriKind.Absolute, out var url) || (url.Scheme != Uri.UriSchemeHttp && url.Scheme != Uri.UriSchemeHttps))
            {
                return ValidationResult.Error("--url must be an absolute http(s) URL.");
            }

            foreach (var (name, value) in new[] { ("--from", From), ("--to", To) })
            {
                if (value is not null && !DateOnly.TryParseExact(value, "yyyy-MM-dd", CultureInfo.InvariantCulture, DateTimeStyles.None, out _))
                {
                    return ValidationResult.Error($"{name} must be a date written YYYY-MM-DD.");
                }
            }

            return ValidationResult.Success();
        }
    }

    private static readonly JsonSerializerOptions Web = new(JsonSerializerDefaults.Web);

    public override async Task<int> ExecuteAsync(CommandContext context, Settings settings, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(settings);
        var baseUrl = new Uri(settings.Url.TrimEnd('/') + "/");
        HostPolicy.Require(baseUrl, settings.AllowHosts);
        var key = settings.AdminKey ?? Environment.GetEnvironmentVariable("NATREMIA_ADMIN_KEY");
        if (string.IsNullOrEmpty(key))
        {
            throw new ToolException(ExitCodes.Usage, "The report needs the service's admin key: --admin-key or NATREMIA_ADMIN_KEY.");
        }

        var to = settings.To ?? DateTimeOffset.UtcNow.ToString("yyyy-MM-dd", CultureInfo.InvariantCulture);
        var from = settings.From ?? DateOnly.ParseExact(to, "yyyy-MM-dd", CultureInfo.InvariantCulture).AddDays(-30).ToString("yyyy-MM-dd", CultureInfo.InvariantCulture);
        if (string.CompareOrdinal(from, to) > 0)
        {
            throw new ToolException(ExitCodes.Usage, $"--from {from} is after --to {to}: the range would be empty.");
        }

        var query = $"admin/reports/overrides?from={from}&to={to}"
            + (settings.Service is { } s ? "&service=" + Uri.EscapeDataString(s) : string.Empty)
            + (settings.IncludeTest ? "&includeTest=true" : string.Empty);

        using var http = new HttpClient { BaseAddress = baseUrl, Timeout = TimeSpan.FromSeconds(30) };
        using var request = new HttpRequestMessage(HttpMethod.Get, query);
        request.Headers.Add("X-Natremia-Admin-Key", key);
        using var response = await http.SendAsync(request, cancellationToken).ConfigureAwait(false);
        var body = await response.Content.ReadAsStringAsync(cancellationToken).ConfigureAwait(false);
        if (response.StatusCode is HttpStatusCode.Unauthorized or HttpStatusCode.Forbidden)
        {
            throw new ToolException(ExitCodes.ServiceError, $"The service refused the report (HTTP {(int)response.StatusCode}): check the admin key.");
        }

        if (!response.IsSuccessStatusCode)
        {
            throw new ToolException(ExitCodes.ServiceError, $"The service answered HTTP {(int)response.StatusCode}: {Clip(body)}");
        }

        OverrideReport report;
        try
        {
            report = JsonSerializer.Deserialize<OverrideReport>(body, Web) ?? throw new JsonException("empty");
        }
        catch (JsonException ex)
        {
            throw new ToolException(ExitCodes.ServiceError, $"The service's report could not be read: {ex.Message}");
        }

        if (settings.Chart is { } chart)
        {
            OverrideRateChart.Write(report, chart);
        }

        if (settings.Json)
        {
            Console.Out.WriteLine(body);
            return ExitCodes.Ok;
        }

        Print(report, settings.Chart);
        return ExitCodes.Ok;
    }

    private static void Print(OverrideReport report, string? chart)
    {
        AnsiConsole.MarkupLine(Markup.Escape(string.Create(CultureInfo.InvariantCulture,
            $"Override report {report.From:yyyy-MM-dd} to {report.To.AddDays(-1):yyyy-MM-dd}{(report.ServiceId is { } s ? ", service " + s : string.Empty)}")));
        var table = new Table().AddColumns("rule", "shown", "accepted", "overridden", "override rate", "reasons");
        foreach (var rule in report.Rules)
        {
            var reasons = string.Join("; ", rule.Reasons.Select(r => $"{r.Display ?? r.Code ?? "no reason given"} ×{r.Cards}"));
            table.AddRow(
                Markup.Escape(rule.RuleId),
                rule.Shown.ToString(CultureInfo.InvariantCulture),
                rule.Accepted.ToString(CultureInfo.InvariantCulture),
                rule.Overridden.ToString(CultureInfo.InvariantCulture),
                rule.OverrideRate is { } rate ? rate.ToString("P0", CultureInfo.InvariantCulture) : "-",
                Markup.Escape(reasons));
        }

        AnsiConsole.Write(table);
        AnsiConsole.MarkupLine(report.TestTrafficIncluded
            ? "Cards of requests marked as test traffic are counted (--include-test)."
            : string.Create(CultureInfo.InvariantCulture, $"{report.TestCardsExcluded} card(s) of requests marked as test traffic left out (--include-test counts them)."));
        if (chart is not null)
        {
            AnsiConsole.MarkupLine("Chart written to " + Markup.Escape(chart));
        }
    }

    private static string Clip(string text) => text.Length <= 300 ? text : text[..300] + "…";
}
