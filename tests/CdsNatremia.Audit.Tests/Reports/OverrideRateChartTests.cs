using System.Globalization;
using System.Xml.Linq;
using CdsNatremia.Audit.Reports;
using CdsNatremia.Audit.Tests.Support;

namespace CdsNatremia.Audit.Tests.Reports;

public sealed class OverrideRateChartTests
{
    private static readonly XNamespace Svg = "http://www.w3.org/2000/svg";

    private static OverrideReport Report(params RuleOverrides[] rules) => new(OverrideFixture.From, OverrideFixture.To, null, 1, rules);

    private static IReadOnlyList<OverridePoint> Points(params (int Shown, int Overridden)[] points)
        => points.Select((p, i) => new OverridePoint(OverrideFixture.From.AddDays(i), p.Shown, p.Overridden)).ToList();

    private static double Attr(XElement e, string name) => double.Parse(e.Attribute(name)!.Value, CultureInfo.InvariantCulture);

    private static List<XElement> PointsOf(XDocument svg, string rule)
        => svg.Descendants(Svg + "circle").Where(c => (string?)c.Attribute("data-rule") == rule).ToList();

    [Fact]
    public void Render_TwoRules_PointsAtTheirRatesDrawnByTheLibrary()
    {
        var svg = XDocument.Parse(OverrideRateChart.Render(Report(
            new RuleOverrides("drug.thiazide", 4, 0, 2, [], Points((2, 0), (2, 2))),
            new RuleOverrides("sodium.severity", 2, 1, 1, [], Points((1, 1), (1, 0))))));

        Assert.Equal(Svg + "svg", svg.Root!.Name);
        var thiazide = PointsOf(svg, "drug.thiazide");
        Assert.Equal(["0", "1"], thiazide.Select(c => c.Attribute("data-rate")!.Value));
        var severity = PointsOf(svg, "sodium.severity");
        Assert.Equal(["1", "0"], severity.Select(c => c.Attribute("data-rate")!.Value));
        // 0 % lies below 100 % on the page; the same rate is at the same height for both rules; the same day at the same x.
        Assert.True(Attr(thiazide[0], "cy") > Attr(thiazide[1], "cy"));
        Assert.Equal(Attr(thiazide[0], "cy"), Attr(severity[1], "cy"));
        Assert.Equal(Attr(thiazide[1], "cx"), Attr(severity[1], "cx"));
        // ScottPlot drew a marker at each point.
        var markers = svg.Descendants(Svg + "ellipse").Select(e => (X: Attr(e, "cx"), Y: Attr(e, "cy")))
            .Concat(svg.Descendants(Svg + "rect").Where(e => e.Attribute("fill")?.Value.StartsWith('#') == true && e.Attribute("width")?.Value == "8")
                .Select(e => (X: Attr(e, "x") + 4, Y: Attr(e, "y") + 4)))
            .ToList();
        foreach (var point in thiazide.Concat(severity))
        {
            Assert.Contains(markers, m => Math.Abs(m.X - Attr(point, "cx")) < 0.5 && Math.Abs(m.Y - Attr(point, "cy")) < 0.5);
        }

        Assert.Contains(svg.Descendants(Svg + "text"), t => t.Value.Trim() == "drug.thiazide (2/4, 50 %)");
    }

    [Fact]
    public void Render_BucketWithNoCards_GapNotZero()
    {
        var svg = XDocument.Parse(OverrideRateChart.Render(Report(
            new RuleOverrides("sodium.severity", 2, 0, 1, [], Points((1, 1), (0, 0), (1, 0))))));

        var points = PointsOf(svg, "sodium.severity");
        Assert.Equal(2, points.Count); // nothing is drawn for the empty day
        Assert.Equal(["1", "0"], points.Select(c => c.Attribute("data-rate")!.Value));
        // Two separate runs of one point each: no line of the rule's colour starts at a point (only the legend's sample line).
        var lines = svg.Descendants(Svg + "path").Where(p => (string?)p.Attribute("stroke") == "#0072B2" && ((string?)p.Attribute("d") ?? string.Empty).Contains('L', StringComparison.Ordinal)).ToList();
        Assert.Single(lines);
        var start = double.Parse(lines[0].Attribute("d")!.Value[1..].Split(' ')[0], CultureInfo.InvariantCulture);
        Assert.True(start > points.Max(p => Attr(p, "cx")) + 50, "only the legend sample, right of the plot");
    }

    [Fact]
    public void Render_RuleIdWithMarkup_Escaped()
    {
        var text = OverrideRateChart.Render(Report(new RuleOverrides("a<b>&\"c", 1, 0, 0, [], Points((1, 0)))));
        var svg = XDocument.Parse(text);
        Assert.Contains(svg.Descendants(Svg + "text"), t => t.Value.Trim().StartsWith("a<b>&\"c", StringComparison.Ordinal));
        Assert.Contains(svg.Descendants(Svg + "title"), t => t.Value.StartsWith("a<b>&\"c", StringComparison.Ordinal));
    }

    [Fact]
    public void Write_NoRules_FileSaysNoCards()
    {
        var path = Path.Combine(Path.GetTempPath(), "natremia-chart-tests", Guid.NewGuid().ToString("N"), "overrides.svg");
        try
        {
            OverrideRateChart.Write(Report(), path);
            Assert.Contains(XDocument.Load(path).Descendants(Svg + "text"), t => t.Value.Trim() == "No cards were issued in this period.");
        }
        finally
        {
            Directory.Delete(Path.GetDirectoryName(path)!, recursive: true);
        }
    }
}
