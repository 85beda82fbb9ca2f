using System.Globalization;
using System.Security;
using System.Text;
using ScottPlot;

namespace CdsNatremia.Audit.Reports;

/// <summary>
/// Writes the override rate per rule over time as a standalone SVG chart, drawn by ScottPlot (server-side, no GPU): x =
/// the report's time buckets, y = overridden ÷ shown (0–100 %), one line per rule in a colour-blind-safe colour and its
/// own marker shape, a gap where a bucket showed no card of that rule (a rate of nothing is not 0 %). Each point also
/// sits in a layer of circles with a title ("rule day: n of m overridden", shown on hover) at the pixel ScottPlot
/// computed. Rule ids are XML-escaped.
/// </summary>
public static class OverrideRateChart
{
    /// <summary>Chart width, px.</summary>
    public const int Width = 900;

    /// <summary>Chart height, px.</summary>
    public const int Height = 420;

    // Okabe–Ito colours (colour-blind safe) with a marker shape each, so a grey print still tells the rules apart.
    private static readonly (string Colour, MarkerShape Shape)[] Styles =
    [
        ("#0072B2", MarkerShape.FilledCircle), ("#D55E00", MarkerShape.FilledSquare), ("#009E73", MarkerShape.FilledTriangleUp),
        ("#CC79A7", MarkerShape.FilledDiamond), ("#E69F00", MarkerShape.OpenCircle), ("#56B4E9", MarkerShape.OpenSquare),
        ("#000000", MarkerShape.FilledTriangleDown), ("#999999", MarkerShape.OpenTriangleUp),
    ];

    /// <summary>Writes the chart to a file (the folder is created when missing).</summary>
    public static void Write(OverrideReport report, string path)
    {
        ArgumentException.ThrowIfNullOrEmpty(path);
        var folder = Path.GetDirectoryName(Path.GetFullPath(path));
        if (folder is not null)
        {
            Directory.CreateDirectory(folder);
        }

        File.WriteAllText(path, Render(report), new UTF8Encoding(false));
    }

    /// <summary>The chart as SVG text.</summary>
    public static string Render(OverrideReport report)
    {
        ArgumentNullException.ThrowIfNull(report);
        var plot = new Plot();
        plot.Font.Set("DejaVu Sans");
        plot.Layout.Fixed(new PixelPadding(60, 290, 50, 40));
        plot.Title(string.Create(CultureInfo.InvariantCulture, $"Override rate per rule (overridden ÷ shown), {Day(report.From)} to {Day(report.To.AddDays(-1))}, {report.BucketDays}-day points"), size: 14);
        plot.Axes.Left.Label.Text = "Overridden (%)";
        var buckets = report.Rules.Count > 0 ? report.Rules[0].Series.Count : 0;
        plot.Axes.SetLimits(-0.5, Math.Max(0.5, buckets - 0.5), -5, 105);
        plot.Axes.Left.TickGenerator = new ScottPlot.TickGenerators.NumericManual([.. new[] { 0, 25, 50, 75, 100 }.Select(p => new Tick(p, p.ToString(CultureInfo.InvariantCulture) + " %", isMajor: true))]);
        var labelEvery = Math.Max(1, (int)Math.Ceiling(buckets / 8.0));
        plot.Axes.Bottom.TickGenerator = new ScottPlot.TickGenerators.NumericManual([.. Enumerable.Range(0, buckets)
            .Where(i => i % labelEvery == 0)
            .Select(i => new Tick(i, Day(report.Rules[0].Series[i].Start), isMajor: true))]);
        if (report.Rules.Count == 0)
        {
            var empty = plot.Add.Text("No cards were issued in this period.", 0, 50);
            empty.LabelAlignment = Alignment.MiddleCenter;
            empty.LabelFontSize = 14;
        }

        for (var r = 0; r < report.Rules.Count; r++)
        {
            var rule = report.Rules[r];
            var (colour, shape) = Styles[r % Styles.Length];
            var total = rule.OverrideRate is { } all ? N(all * 100) + " %" : "no cards";
            var legend = string.Create(CultureInfo.InvariantCulture, $"{rule.RuleId} ({rule.Overridden}/{rule.Shown}, {total})");
            var first = true;
            foreach (var segment in Segments(rule))
            {
                var line = plot.Add.Scatter(segment.Select(p => (double)p.Index).ToArray(), segment.Select(p => p.Rate * 100).ToArray());
                line.Color = Color.FromHex(colour);
                line.LineWidth = 2;
                line.MarkerShape = shape;
                line.MarkerSize = 8;
                line.LegendText = first ? legend : string.Empty;
                first = false;
            }

            if (first)
            {
                // No bucket showed a card of this rule: still named in the legend.
                var none = plot.Add.Scatter(Array.Empty<double>(), Array.Empty<double>());
                none.Color = Color.FromHex(colour);
                none.LegendText = legend;
            }
        }

        if (report.Rules.Count > 0)
        {
            plot.ShowLegend(Edge.Right);
        }

        var xml = plot.GetSvgXml(Width, Height);
        var svgStart = xml.IndexOf("<svg", StringComparison.Ordinal);
        xml = svgStart > 0 ? xml[svgStart..] : xml;
        var layer = new StringBuilder("<g class=\"report-points\">");
        foreach (var rule in report.Rules)
        {
            foreach (var (index, rate, point) in rule.Series.Select((p, i) => (i, p.OverrideRate, p)).Where(t => t.OverrideRate is not null))
            {
                var px = plot.GetPixel(new Coordinates(index, rate!.Value * 100));
                layer.Append(CultureInfo.InvariantCulture, $"<circle cx=\"{N(px.X)}\" cy=\"{N(px.Y)}\" r=\"6\" fill=\"transparent\" data-rule=\"{Escape(rule.RuleId)}\" data-rate=\"{N(rate.Value)}\">");
                layer.Append("<title>").Append(Escape(string.Create(CultureInfo.InvariantCulture, $"{rule.RuleId} {Day(point.Start)}: {point.Overridden} of {point.Shown} overridden"))).Append("</title></circle>");
            }
        }

        layer.Append("</g>");
        return xml.Replace("</svg>", layer + "</svg>", StringComparison.Ordinal);
    }

    /// <summary>Runs of consecutive buckets that showed cards of the rule; an empty bucket ends a run (a gap, not 0 %).</summary>
    private static List<List<(int Index, double Rate)>> Segments(RuleOverrides rule)
    {
        var segments = new List<List<(int Index, double Rate)>>();
        List<(int Index, double Rate)>? current = null;
        for (var i = 0; i < rule.Series.Count; i++)
        {
            if (rule.Series[i].OverrideRate is not { } rate)
            {
                current = null;
                continue;
            }

            if (current is null)
            {
                current = [];
                segments.Add(current);
            }

            current.Add((i, rate));
        }

        return segments;
    }

    private static string N(double value) => Math.Round(value, 3).ToString("0.###", CultureInfo.InvariantCulture);

    private static string Day(DateTimeOffset value) => value.UtcDateTime.ToString("yyyy-MM-dd", CultureInfo.InvariantCulture);

    private static string Escape(string text) => SecurityElement.Escape(text) ?? string.Empty;
}
