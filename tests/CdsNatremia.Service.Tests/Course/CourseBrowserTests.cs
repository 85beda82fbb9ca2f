using System.Globalization;
using System.Net.Http.Json;
using System.Text.Json;
using System.Text.Json.Nodes;
using System.Text.RegularExpressions;
using CdsNatremia.Scenarios;
using CdsNatremia.Service.Tests.Support;
using OpenQA.Selenium;
using OpenQA.Selenium.Chrome;

namespace CdsNatremia.Service.Tests.Course;

/// <summary>
/// The whole path in a real browser: a chart-opening request for an invented patient gives a card with the "smart"
/// link; the test then opens that link as an EHR would (with the loopback test EHR's iss and a launch id), Chromium
/// follows the redirects (authorization, callback, view) with real cookies, and the page's picture and table are
/// checked against the scenario's numbers. Chromium and chromedriver come from Debian's packages (.ci/browser.sh);
/// outside CI the test is skipped when they are missing, in CI it fails.
/// </summary>
public sealed class CourseBrowserTests
{
    private const string Chromium = "/usr/bin/chromium";
    private const string ChromeDriverPath = "/usr/bin/chromedriver";

    [SkippableFact]
    public async Task LaunchFromCard_ScenarioOne_ChartTableAndDrugBarMatchTheScenario()
    {
        var installed = File.Exists(Chromium) && File.Exists(ChromeDriverPath);
        if (!installed && string.IsNullOrEmpty(Environment.GetEnvironmentVariable("CI")))
        {
            throw new SkipException("chromium and chromium-driver are not installed (bash .ci/browser.sh installs them)");
        }

        Assert.True(installed, "chromium and chromium-driver must be installed in CI (.ci/browser.sh)");
        var scenario = ScenarioLibrary.Find("01")!;
        var port = ServiceProcess.FreePort();
        var origin = $"http://127.0.0.1:{port.ToString(CultureInfo.InvariantCulture)}";
        await using var service = ServiceProcess.Start(new Dictionary<string, string?> { ["Natremia:Course:LaunchUrl"] = origin + "/course/launch" }, port);
        await service.WaitReadyAsync(TimeSpan.FromSeconds(60));

        // The EHR asks for cards (dates of the scenario moved to now, as replay does) and finds the link on the assessment card.
        using var http = new HttpClient { BaseAddress = service.BaseAddress };
        var shiftForRequest = DateTimeOffset.UtcNow - ScenarioLibrary.Anchor;
        var body = HookRequestBuilder.Build(scenario, "patient-view", shiftForRequest, Guid.NewGuid());
        using var answer = await http.PostAsJsonAsync(new Uri("/cds-services/natremia-chart-review", UriKind.Relative), body);
        answer.EnsureSuccessStatusCode();
        var cards = JsonNode.Parse(await answer.Content.ReadAsStringAsync())!["cards"]!.AsArray();
        var assessment = cards.Single(c => (string?)c!["source"]!["topic"]!["code"] == "sodium-assessment")!;
        var link = assessment["links"]!.AsArray().Single(l => (string?)l!["type"] == "smart")!;
        Assert.Equal("smart", (string?)link["type"]);
        Assert.Equal("Open the sodium course", (string?)link["label"]);
        Assert.Contains((string)assessment["uuid"]!, (string)link["appContext"]!, StringComparison.Ordinal);
        Assert.DoesNotContain(scenario.PatientId, (string)link["appContext"]!, StringComparison.Ordinal);

        var iss = origin + "/dev-ehr/fhir";
        var launchUrl = (string)link["url"]! + "?iss=" + Uri.EscapeDataString(iss) + "&launch=01";
        using var driver = StartChromium();
        driver.Navigate().GoToUrl(launchUrl);
        Assert.Equal(origin + "/course", driver.Url);
        Assert.Equal("Sodium course", driver.Title);

        var screenshots = Path.Combine(AppContext.BaseDirectory, "screenshots");
        Directory.CreateDirectory(screenshots);
        ((ITakesScreenshot)driver).GetScreenshot().SaveAsFile(Path.Combine(screenshots, "sodium-course-01.png"));

        // The scenario's sodium results (LOINC 2951-2), as written in its Bundle.
        var bundle = JsonNode.Parse(scenario.BundleJson)!["entry"]!.AsArray().Select(e => e!["resource"]!).ToList();
        var sodium = bundle
            .Where(r => (string?)r["resourceType"] == "Observation" && r["code"]!["coding"]!.AsArray().Any(c => (string?)c!["code"] == "2951-2"))
            .Select(r => (Value: (double)r["valueQuantity"]!["value"]!, At: DateTimeOffset.Parse((string)r["effectiveDateTime"]!, CultureInfo.InvariantCulture)))
            .OrderBy(r => r.At)
            .ToList();

        // The invisible layer gives each point's value and time at the pixel ScottPlot computed; the library drew a marker there.
        var figure = driver.FindElement(By.CssSelector("#sodium-figure svg"));
        var svg = figure.GetAttribute("outerHTML")!;
        var points = figure.FindElements(By.CssSelector("g[data-figure='sodium'] circle[data-kind='measured']"))
            .Select(c => (Value: Number(c.GetAttribute("data-value")), At: DateTimeOffset.Parse(c.GetAttribute("data-time")!, CultureInfo.InvariantCulture), X: Number(c.GetAttribute("cx")), Y: Number(c.GetAttribute("cy"))))
            .OrderBy(p => p.At)
            .ToList();
        Assert.Equal(sodium.Select(s => s.Value), points.Select(p => p.Value));
        var markers = Regex.Matches(svg, "<ellipse fill=\"#0072B2\" cx=\"([0-9.]+)\" cy=\"([0-9.]+)\"").Select(m => (X: Number(m.Groups[1].Value), Y: Number(m.Groups[2].Value))).ToList();
        foreach (var point in points)
        {
            Assert.Contains(markers, m => Math.Abs(m.X - point.X) < 0.5 && Math.Abs(m.Y - point.Y) < 0.5);
        }

        // Value → pixel from the library's own two markers (138 and 124); the first-24-h limit is drawn at nadir + 10
        // (2014 European guideline, Spasovski et al. 2014; reference sheet, secondary): 124 + 10 = 134.
        var (high, low) = (points.MaxBy(p => p.Value), points.MinBy(p => p.Value));
        double YOf(double value) => low.Y + ((value - low.Value) * (high.Y - low.Y) / (high.Value - low.Value));
        var limit = figure.FindElement(By.CssSelector("g[data-figure='sodium'] line[data-kind='first-day-limit']"));
        Assert.Equal(134, Number(limit.GetAttribute("data-value")));
        var dashes = Regex.Matches(svg, "<path fill=\"#D55E00\" d=\"M([0-9.]+) ([0-9.]+)L[0-9.]+ [0-9.]+L[0-9.]+ ([0-9.]+)")
            .Select(m => (Number(m.Groups[2].Value) + Number(m.Groups[3].Value)) / 2)
            .ToList();
        Assert.Contains(dashes, y => Math.Abs(y - YOf(134)) < 1);

        // The drug bar starts at the statement's start (moved by the same shift as the results).
        var shift = points[^1].At - sodium[^1].At;
        var statement = bundle.Single(r => (string?)r["resourceType"] == "MedicationStatement");
        var start = DateTimeOffset.Parse((string)statement["effectivePeriod"]!["start"]!, CultureInfo.InvariantCulture) + shift;
        var bar = driver.FindElement(By.CssSelector("#drug-figure rect[data-kind='drug']"));
        Assert.Equal("hydrochlorothiazide", bar.GetAttribute("data-name"));
        Assert.True(Math.Abs((DateTimeOffset.Parse(bar.GetAttribute("data-start")!, CultureInfo.InvariantCulture) - start).TotalSeconds) <= 2);
        double XOf(DateTimeOffset at) => points[0].X + ((at - points[0].At).TotalSeconds * (points[^1].X - points[0].X) / (points[^1].At - points[0].At).TotalSeconds);
        var drugSvg = driver.FindElement(By.CssSelector("#drug-figure svg")).GetAttribute("outerHTML")!;
        var drawn = Regex.Matches(drugSvg, "<rect fill=\"#D55E00\"[^>]* x=\"([0-9.]+)\"").Select(m => Number(m.Groups[1].Value)).ToList();
        Assert.Contains(drawn, x => Math.Abs(x - XOf(start)) < 1);

        // The table holds the same numbers.
        var rows = driver.FindElements(By.CssSelector("#sodium-table tbody tr[data-kind='measured']"));
        Assert.Equal(sodium.Select(s => s.Value), rows.Select(r => Number(r.GetAttribute("data-value"))));
        Assert.Equal(["138", "124"], rows.Select(r => r.FindElements(By.TagName("td"))[1].Text));
        Assert.Contains("134", driver.FindElement(By.Id("envelope-table")).Text, StringComparison.Ordinal);
        Assert.Contains("hydrochlorothiazide", driver.FindElement(By.Id("report")).FindElement(By.XPath("following-sibling::article")).Text, StringComparison.OrdinalIgnoreCase);

        // No URL the browser saw names the patient, and the service's log holds neither the patient nor the launch's secrets.
        Assert.DoesNotContain(scenario.PatientId, driver.Url, StringComparison.Ordinal);
        Assert.DoesNotContain(service.Output, line => line.Contains(scenario.PatientId, StringComparison.Ordinal));
        Assert.DoesNotContain(service.Output, line => line.Contains("code=", StringComparison.Ordinal) || line.Contains("access_token", StringComparison.Ordinal));
    }

    private static ChromeDriver StartChromium()
    {
        // Nothing is downloaded: the driver and the browser are Debian's, and Selenium Manager is told to stay offline.
        Environment.SetEnvironmentVariable("SE_OFFLINE", "true");
        var driverService = ChromeDriverService.CreateDefaultService(Path.GetDirectoryName(ChromeDriverPath)!, Path.GetFileName(ChromeDriverPath));
        driverService.SuppressInitialDiagnosticInformation = true;
        var options = new ChromeOptions { BinaryLocation = Chromium };
        options.AddArguments("--headless=new", "--no-sandbox", "--disable-gpu", "--disable-dev-shm-usage", "--window-size=1200,1800");
        var driver = new ChromeDriver(driverService, options, TimeSpan.FromSeconds(60));
        driver.Manage().Timeouts().PageLoad = TimeSpan.FromSeconds(60);
        return driver;
    }

    private static double Number(string? text) => double.Parse(text!, CultureInfo.InvariantCulture);
}
