using System.Text.Json.Nodes;
using CdsNatremia.Cli.Replay;
using Spectre.Console;

namespace CdsNatremia.Cli.Tests.Replay;

/// <summary>How replay prints cards and, with -v, the prefetch it sent.</summary>
public class CardPrinterTests
{
    private static (IAnsiConsole Console, StringWriter Writer) Console80()
    {
        var writer = new StringWriter();
        var console = AnsiConsole.Create(new AnsiConsoleSettings { Ansi = AnsiSupport.No, ColorSystem = ColorSystemSupport.NoColors, Out = new AnsiConsoleOutput(writer) });
        console.Profile.Width = 80;
        return (console, writer);
    }

    [Fact]
    public void Print_SummaryLongerThanTheConsole_WrappedWhole()
    {
        const string Summary = "Sodium 124 mmol/L (profound hyponatremia, 10 Mar 07:40 UTC) — assess for severe symptoms now and review the thiazide.";
        var card = new JsonObject { ["summary"] = Summary, ["indicator"] = "critical", ["detail"] = "d", ["source"] = new JsonObject { ["label"] = "x" } };
        var answer = new JsonObject { ["cards"] = new JsonArray(card) };
        var (console, writer) = Console80();

        CardPrinter.Print(console, new ReplayResult("01", "svc", 200, answer, []), verbose: false);

        // Every word of the summary is printed (none cut off at the box's edge).
        var text = string.Join(' ', writer.ToString().Split(['\n', '│', '╭', '╮', '╰', '╯', '─'], StringSplitOptions.RemoveEmptyEntries).Select(l => l.Trim()));
        Assert.Contains("review the thiazide.", text, StringComparison.Ordinal);
    }

    [Fact]
    public void Print_Verbose_PrefetchKeyByKeyWithItsSearchAndResources()
    {
        var prefetch = JsonNode.Parse("""
            {"patient":{"resourceType":"Patient","id":"p1"},
             "sodium":{"resourceType":"Bundle","type":"searchset","entry":[{"resource":{"resourceType":"Observation","id":"na-1"}}]},
             "weight":null}
            """)!.AsObject();
        var result = new ReplayResult("f.json", "svc", 200, JsonNode.Parse("""{"cards":[]}"""), [])
        {
            Prefetch = prefetch,
            PrefetchQueries = new Dictionary<string, string> { ["patient"] = "Patient/p1", ["sodium"] = "Observation?patient=p1&code=http://loinc.org|2951-2", ["weight"] = "Observation?patient=p1&code=http://loinc.org|29463-7" },
        };
        var (console, writer) = Console80();

        CardPrinter.Print(console, result, verbose: true);

        var text = writer.ToString();
        Assert.Contains("Observation/na-1", text, StringComparison.Ordinal);
        Assert.Contains("Patient/p1", text, StringComparison.Ordinal);
        Assert.Contains("null (nothing selected)", text, StringComparison.Ordinal);
        Assert.Contains("2951-2", text, StringComparison.Ordinal);
    }

    [Fact]
    public void Print_VerboseWithFhirServer_EveryRequestTheServiceMade()
    {
        var result = new ReplayResult("01", "svc", 200, JsonNode.Parse("""{"cards":[]}"""), [])
        {
            FhirRequests = ["GET /fhir/Patient/s01-pt → 200", "GET /fhir/Observation?patient=s01-pt → 200"],
        };
        var (console, writer) = Console80();

        CardPrinter.Print(console, result, verbose: true);

        Assert.Contains("GET /fhir/Patient/s01-pt → 200", writer.ToString(), StringComparison.Ordinal);
        Assert.Contains("GET /fhir/Observation?patient=s01-pt → 200", writer.ToString(), StringComparison.Ordinal);
    }

    [Fact]
    public void Print_NotVerbose_NoPrefetch()
    {
        var result = new ReplayResult("01", "svc", 200, JsonNode.Parse("""{"cards":[]}"""), [])
        {
            Prefetch = JsonNode.Parse("""{"patient":{"resourceType":"Patient","id":"p1"}}""")!.AsObject(),
        };
        var (console, writer) = Console80();
        CardPrinter.Print(console, result, verbose: false);
        Assert.DoesNotContain("Patient/p1", writer.ToString(), StringComparison.Ordinal);
    }
}
