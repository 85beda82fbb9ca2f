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

    [Fact]
    public void Render_TwoRules_OneLinePerRuleWithPointsAtTheirRates()
    {
        var svg = XDocument.Parse(OverrideRateChart.Render(Report(
            new RuleOverrides("drug.thiazide", 4, 0, 2, [], Points((2, 0), (2, 2))),
            new RuleOverrides("sodium.severity", 2, 1, 1, [], Points((1, 1), (1, 0))))));

        Assert.Equal(Svg + "svg", svg.Root!.Name);
        Assert.Equal(2, svg.Descendants(Svg + "path").Count());
        // Plot: top 40, height 300 → rate 0 at y 340, rate 1 at y 40, rate 0.5 at y 190.
        var thiazide = svg.Descendants(Svg + "path").First().Attribute("d")!.Value;
        Assert.Equal("M60 340 L640 40", thiazide);
        Assert.Contains(svg.Descendants(Svg + "text"), t => t.Value == "drug.thiazide (2/4, 50 %)");
    }

    [Fact]
    public void Render_BucketWithNoCards_GapNotZero()
    {
        var svg = XDocument.Parse(OverrideRateChart.Render(Report(
            new RuleOverrides("sodium.severity", 2, 0, 1, [], Points((1, 1), (0, 0), (1, 0))))));

        var d = Assert.Single(svg.Descendants(Svg + "path")).Attribute("d")!.Value;
        Assert.Equal(2, d.Count(c => c == 'M')); // the pen lifts over the empty day
        Assert.DoesNotContain("L", d, StringComparison.Ordinal);
        Assert.Equal(2, svg.Descendants(Svg + "circle").Count());
    }

    [Fact]
    public void Render_RuleIdWithMarkup_Escaped()
    {
        var text = OverrideRateChart.Render(Report(new RuleOverrides("a<b>&\"c", 1, 0, 0, [], Points((1, 0)))));
        Assert.Contains(XDocument.Parse(text).Descendants(Svg + "text"), t => t.Value.StartsWith("a<b>&\"c", StringComparison.Ordinal));
    }

    [Fact]
    public void Write_NoRules_FileSaysNoCards()
    {
        var path = Path.Combine(Path.GetTempPath(), "natremia-chart-tests", Guid.NewGuid().ToString("N"), "overrides.svg");
        try
        {
            OverrideRateChart.Write(Report(), path);
            Assert.Contains(XDocument.Load(path).Descendants(Svg + "text"), t => t.Value == "No cards were issued in this period.");
        }
        finally
        {
            Directory.Delete(Path.GetDirectoryName(path)!, recursive: true);
        }
    }
}
