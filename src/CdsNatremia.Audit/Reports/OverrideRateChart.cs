using System.Globalization;
using System.Security;
using System.Text;

namespace CdsNatremia.Audit.Reports;

/// <summary>
/// Writes the override rate per rule over time as a standalone SVG line chart: x = the report's time buckets,
/// y = overridden ÷ shown (0–100 %), one line per rule, a gap where a bucket showed no card of that rule (a rate of
/// nothing is not 0 %). Numbers are written with the invariant culture; rule ids are XML-escaped.
/// </summary>
public static class OverrideRateChart
{
    private const int Width = 900;
    private const int PlotLeft = 60;
    private const int PlotTop = 40;
    private const int PlotWidth = 580;
    private const int PlotHeight = 300;
    private static readonly string[] Palette = ["#1b6ca8", "#c0392b", "#27ae60", "#8e44ad", "#d35400", "#16a085", "#2c3e50", "#b7950b"];

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
        var height = Math.Max(PlotTop + PlotHeight + 60, PlotTop + 20 + report.Rules.Count * 20);
        var svg = new StringBuilder();
        Line(svg, $"<svg xmlns=\"http://www.w3.org/2000/svg\" width=\"{Width}\" height=\"{height}\" viewBox=\"0 0 {Width} {height}\" font-family=\"sans-serif\" font-size=\"12\">");
        Line(svg, $"<title>Override rate per rule, {Day(report.From)} to {Day(report.To.AddDays(-1))}</title>");
        Line(svg, "<rect width=\"100%\" height=\"100%\" fill=\"white\"/>");
        Line(svg, $"<text x=\"{PlotLeft}\" y=\"22\" font-size=\"15\" font-weight=\"bold\">Override rate per rule (overridden ÷ shown), {Day(report.From)} to {Day(report.To.AddDays(-1))}, {report.BucketDays}-day points</text>");

        for (var percent = 0; percent <= 100; percent += 25)
        {
            var y = Y(percent / 100.0);
            Line(svg, $"<line x1=\"{PlotLeft}\" y1=\"{N(y)}\" x2=\"{PlotLeft + PlotWidth}\" y2=\"{N(y)}\" stroke=\"#dddddd\"/>");
            Line(svg, $"<text x=\"{PlotLeft - 8}\" y=\"{N(y + 4)}\" text-anchor=\"end\">{percent} %</text>");
        }

        Line(svg, $"<line x1=\"{PlotLeft}\" y1=\"{PlotTop + PlotHeight}\" x2=\"{PlotLeft + PlotWidth}\" y2=\"{PlotTop + PlotHeight}\" stroke=\"#333333\"/>");
        Line(svg, $"<line x1=\"{PlotLeft}\" y1=\"{PlotTop}\" x2=\"{PlotLeft}\" y2=\"{PlotTop + PlotHeight}\" stroke=\"#333333\"/>");

        var buckets = report.Rules.Count > 0 ? report.Rules[0].Series.Count : 0;
        var labelEvery = Math.Max(1, (int)Math.Ceiling(buckets / 8.0));
        for (var i = 0; i < buckets; i += labelEvery)
        {
            Line(svg, $"<text x=\"{N(X(i, buckets))}\" y=\"{PlotTop + PlotHeight + 18}\" text-anchor=\"middle\">{Day(report.Rules[0].Series[i].Start)}</text>");
        }

        if (report.Rules.Count == 0)
        {
            Line(svg, $"<text x=\"{PlotLeft + PlotWidth / 2}\" y=\"{PlotTop + PlotHeight / 2}\" text-anchor=\"middle\">No cards were issued in this period.</text>");
        }

        for (var r = 0; r < report.Rules.Count; r++)
        {
            var rule = report.Rules[r];
            var colour = Palette[r % Palette.Length];
            var path = new StringBuilder();
            var penDown = false;
            for (var i = 0; i < rule.Series.Count; i++)
            {
                if (rule.Series[i].OverrideRate is not { } rate)
                {
                    penDown = false;
                    continue;
                }

                path.Append(penDown ? " L" : " M").Append(N(X(i, rule.Series.Count))).Append(' ').Append(N(Y(rate)));
                Line(svg, $"<circle cx=\"{N(X(i, rule.Series.Count))}\" cy=\"{N(Y(rate))}\" r=\"3\" fill=\"{colour}\"><title>{Escape(rule.RuleId)} {Day(rule.Series[i].Start)}: {rule.Series[i].Overridden} of {rule.Series[i].Shown} overridden</title></circle>");
                penDown = true;
            }

            if (path.Length > 0)
            {
                Line(svg, $"<path d=\"{path.ToString().Trim()}\" fill=\"none\" stroke=\"{colour}\" stroke-width=\"2\"/>");
            }

            var legendY = PlotTop + 10 + r * 20;
            var total = rule.OverrideRate is { } all ? $"{N(all * 100)} %" : "no cards";
            Line(svg, $"<rect x=\"{PlotLeft + PlotWidth + 20}\" y=\"{legendY - 9}\" width=\"12\" height=\"12\" fill=\"{colour}\"/>");
            Line(svg, $"<text x=\"{PlotLeft + PlotWidth + 38}\" y=\"{legendY + 1}\">{Escape(rule.RuleId)} ({rule.Overridden}/{rule.Shown}, {total})</text>");
        }

        Line(svg, "</svg>");
        return svg.ToString();
    }

    private static double X(int index, int count) => count <= 1 ? PlotLeft + PlotWidth / 2.0 : PlotLeft + (double)index * PlotWidth / (count - 1);

    private static double Y(double rate) => PlotTop + PlotHeight - rate * PlotHeight;

    private static string N(double value) => value.ToString("0.#", CultureInfo.InvariantCulture);

    private static string Day(DateTimeOffset value) => value.UtcDateTime.ToString("yyyy-MM-dd", CultureInfo.InvariantCulture);

    private static string Escape(string text) => SecurityElement.Escape(text) ?? string.Empty;

    private static void Line(StringBuilder svg, string text) => svg.Append(text).Append('\n');
}
