using System.Globalization;
using System.Net;
using System.Text;
using CdsNatremia.Core;
using CdsNatremia.Core.Course;
using CdsNatremia.Core.Sodium;
using CdsNatremia.Core.Text;
using ScottPlot;

namespace CdsNatremia.Service.Course;

/// <summary>
/// Draws the sodium course with ScottPlot as SVG, server-side (SkiaSharp's SVG canvas; no GPU, no browser script). Two
/// figures share one time axis and the same fixed margins, so a time has the same x in both: the sodium panel (bands,
/// points, bounds, set-aside marks, the envelope from the nadir, orders, now) and the drug panel (one bar per implicated
/// drug). Each figure carries an invisible layer of the same items with their numbers and a title (shown on hover), placed
/// at the pixels ScottPlot computed, for people and for tests.
/// </summary>
public static class CourseChart
{
    /// <summary>Figure width, px.</summary>
    public const int Width = 960;

    /// <summary>Sodium panel height, px.</summary>
    public const int Height = 440;

    /// <summary>Fixed margins (left, right, bottom, top), px: the same in both figures, so their time axes line up.</summary>
    public static readonly PixelPadding Padding = new(150, 30, 50, 20);

    // Colour-blind-safe (Okabe–Ito) colours; shapes and line patterns carry the meaning too, so a grey print still reads.
    internal static readonly Color Blue = Color.FromHex("#0072B2");
    internal static readonly Color Vermillion = Color.FromHex("#D55E00");
    internal static readonly Color ReddishPurple = Color.FromHex("#CC79A7");
    internal static readonly Color BluishGreen = Color.FromHex("#009E73");
    internal static readonly Color SkyBlue = Color.FromHex("#56B4E9");
    internal static readonly Color Orange = Color.FromHex("#E69F00");
    internal static readonly Color Ink = Color.FromHex("#222222");
    internal static readonly Color Grey = Color.FromHex("#6B6B6B");

    /// <summary>A course longer than this gets a second sodium panel around the nadir, where the envelope is readable.</summary>
    public static readonly TimeSpan EpisodePanelAfter = TimeSpan.FromDays(4);

    /// <summary>
    /// The sodium panel, the panel around the nadir (only when there is an envelope and the course is long), and the drug
    /// panel, as inline SVG (XML declaration removed).
    /// </summary>
    public static (string Sodium, string? Episode, string Drugs) Render(CourseModel model, TimeDisplay display)
    {
        ArgumentNullException.ThrowIfNull(model);
        ArgumentNullException.ThrowIfNull(display);
        string? episode = null;
        if (model.Envelope is { } envelope && model.To - model.From > EpisodePanelAfter)
        {
            var from = envelope.Nadir.At.AddHours(-12);
            var last = model.Points.Where(p => p.At >= from).Select(p => p.At).Append(envelope.Lines.Max(l => l.To)).Max();
            episode = SodiumPanel(model with { From = from, To = last.AddHours(CourseModelBuilder.MarginHours) }, display, "episode");
        }

        return (SodiumPanel(model, display, "sodium"), episode, DrugPanel(model, display));
    }

    /// <summary>The x value of an instant: its wall-clock time in the display zone as an OLE date (ScottPlot's date axis).</summary>
    public static double X(DateTimeOffset at, TimeDisplay display)
    {
        ArgumentNullException.ThrowIfNull(display);
        return TimeZoneInfo.ConvertTime(at, display.Zone).DateTime.ToOADate();
    }

    /// <summary>The sodium range drawn: the data and the envelope with room around them, at least 115–145 mmol/L.</summary>
    public static (double Bottom, double Top) SodiumRange(CourseModel model)
    {
        ArgumentNullException.ThrowIfNull(model);
        var values = model.Points.Select(p => p.Value).Concat(model.Bounds.Select(b => b.Value))
            .Concat(model.Envelope?.Lines.Select(l => l.Value) ?? []).ToList();
        var low = values.Count > 0 ? Math.Min(values.Min() - 5, 115) : 115;
        var high = values.Count > 0 ? Math.Max(values.Max() + 3, 145) : 145;
        return (Math.Floor(low), Math.Ceiling(high));
    }

    private static Plot NewPlot(CourseModel model, TimeDisplay display, double bottom, double top)
    {
        var plot = new Plot();
        plot.Font.Set("DejaVu Sans");
        plot.Layout.Fixed(Padding);
        var axis = plot.Axes.DateTimeTicksBottom();
        if (axis.TickGenerator is ScottPlot.TickGenerators.DateTimeAutomatic automatic)
        {
            automatic.LabelFormatter = t => t.TimeOfDay == TimeSpan.Zero
                ? t.ToString("yyyy-MM-dd", CultureInfo.InvariantCulture)
                : t.ToString("MM-dd HH:mm", CultureInfo.InvariantCulture);
        }

        plot.Axes.SetLimits(X(model.From, display), X(model.To, display), bottom, top);
        plot.Grid.MajorLineColor = Color.FromHex("#000000").WithAlpha(0.08);
        plot.Axes.Bottom.Label.Text = "Time (" + ZoneName(display) + ")";
        return plot;
    }

    private static string ZoneName(TimeDisplay display) => display.IsUtc ? "UTC" : display.Zone.Id;

    private static string SodiumPanel(CourseModel model, TimeDisplay display, string figure)
    {
        var (bottom, top) = SodiumRange(model);
        var plot = NewPlot(model, display, bottom, top);
        plot.Axes.Left.Label.Text = "Sodium (mmol/L)";
        var left = X(model.From, display);
        var right = X(model.To, display);

        foreach (var band in model.Bands)
        {
            var (from, to) = (Math.Max(band.From, bottom), Math.Min(band.To, top));
            if (to <= from)
            {
                continue;
            }

            var rect = plot.Add.Rectangle(left, right, from, to);
            rect.FillColor = BandColor(band.Band);
            rect.LineWidth = 0;
            var label = plot.Add.Text(band.Name, left, (from + to) / 2);
            label.LabelFontSize = 11;
            label.LabelFontColor = Grey;
            label.LabelAlignment = Alignment.MiddleLeft;
            label.LabelOffsetX = 6;
        }

        if (model.Envelope is { } envelope)
        {
            foreach (var line in envelope.Lines)
            {
                var drawn = plot.Add.Line(X(line.From, display), line.Value, X(line.To, display), line.Value);
                (drawn.Color, drawn.LineWidth, drawn.LinePattern) = line.Kind switch
                {
                    EnvelopeLineKind.FirstDayLimit or EnvelopeLineKind.TwoDayLimit => (Vermillion, envelope.HighRisk ? 1.5f : 2.5f, envelope.HighRisk ? LinePattern.Dotted : LinePattern.Dashed),
                    EnvelopeLineKind.HighRiskDayLimit or EnvelopeLineKind.HighRiskTwoDayLimit => (ReddishPurple, 3f, LinePattern.Solid),
                    _ => (BluishGreen, 2f, LinePattern.DenselyDashed),
                };
                drawn.MarkerSize = 0;
                drawn.LegendText = string.Empty;
            }

            var nadir = plot.Add.Marker(X(envelope.Nadir.At, display), envelope.Nadir.Value);
            nadir.MarkerShape = MarkerShape.OpenCircle;
            nadir.MarkerSize = 18;
            nadir.Color = Ink;
        }

        foreach (var order in model.Orders.Where(o => o.At is not null))
        {
            var line = plot.Add.VerticalLine(X(order.At!.Value, display));
            line.Color = order.Kind == CourseOrderKind.Vaptan ? Orange : SkyBlue;
            line.LineWidth = 2;
            line.LinePattern = LinePattern.DenselyDashed;
        }

        var now = plot.Add.VerticalLine(X(model.Now, display));
        now.Color = Grey;
        now.LineWidth = 1;
        now.LinePattern = LinePattern.Dashed;
        now.LabelText = "now";

        var measured = model.Points.Where(p => !p.IsPreliminary).ToList();
        if (model.Points.Count > 1)
        {
            var path = plot.Add.ScatterLine(model.Points.Select(p => X(p.At, display)).ToArray(), model.Points.Select(p => p.Value).ToArray());
            path.Color = Blue.WithAlpha(0.6);
            path.LineWidth = 1.5f;
        }

        foreach (var group in new[] { (Points: measured, Shape: MarkerShape.FilledCircle), (Points: model.Points.Where(p => p.IsPreliminary).ToList(), Shape: MarkerShape.OpenCircle) })
        {
            if (group.Points.Count == 0)
            {
                continue;
            }

            var markers = plot.Add.Markers(group.Points.Select(p => X(p.At, display)).ToArray(), group.Points.Select(p => p.Value).ToArray(), group.Shape, 9, Blue);
            markers.MarkerLineWidth = 2;
        }

        foreach (var bound in model.Bounds)
        {
            var marker = plot.Add.Marker(X(bound.At, display), bound.Value, bound.PointsDown ? MarkerShape.FilledTriangleDown : MarkerShape.FilledTriangleUp, 12);
            marker.Color = Vermillion;
            var text = plot.Add.Text(bound.Description, X(bound.At, display), bound.Value);
            text.LabelFontSize = 11;
            text.LabelFontColor = Ink;
            text.LabelAlignment = Alignment.MiddleLeft;
            text.LabelOffsetX = 8;
        }

        var setAsideRow = bottom + 1;
        foreach (var item in model.SetAside.Where(s => s.At is not null))
        {
            var marker = plot.Add.Marker(X(item.At!.Value, display), setAsideRow, MarkerShape.Eks, 10);
            marker.Color = Ink;
            marker.MarkerLineWidth = 2;
        }

        var svg = Svg(plot, Height);
        var layer = new StringBuilder();
        layer.Append("<g class=\"course-layer\" data-figure=\"").Append(figure).Append("\">");
        foreach (var point in model.Points.Where(p => p.At >= model.From && p.At <= model.To))
        {
            var px = plot.GetPixel(new Coordinates(X(point.At, display), point.Value));
            var kind = point.IsPreliminary ? "preliminary" : "measured";
            layer.Append(Circle(px, kind, point.Value, point.At,
                Invariant.Format($"Sodium {Invariant.Number(point.Value)} mmol/L ({point.Band.ToString().ToLowerInvariant()}{(point.IsPreliminary ? ", preliminary" : string.Empty)}) at {display.Time(point.At)}, {point.Reference}")));
        }

        foreach (var bound in model.Bounds)
        {
            var px = plot.GetPixel(new Coordinates(X(bound.At, display), bound.Value));
            layer.Append(Circle(px, "bound", bound.Value, bound.At, $"Sodium {bound.Description} mmol/L (a bound, not a measurement) at {display.Time(bound.At)}, {bound.Reference}"));
        }

        foreach (var item in model.SetAside.Where(s => s.At is not null))
        {
            var px = plot.GetPixel(new Coordinates(X(item.At!.Value, display), setAsideRow));
            layer.Append(Circle(px, "set-aside", null, item.At, $"Set aside: {item.What} at {display.Time(item.At.Value)} ({item.Reference}): {item.Reason}"));
        }

        if (model.Envelope is { } env)
        {
            foreach (var line in env.Lines)
            {
                var a = plot.GetPixel(new Coordinates(X(line.From, display), line.Value));
                var b = plot.GetPixel(new Coordinates(X(line.To, display), line.Value));
                layer.Append(CultureInfo.InvariantCulture, $"<line class=\"course-hit\" data-kind=\"{Kebab(line.Kind.ToString())}\" data-value=\"{Num(line.Value)}\" data-rise=\"{Num(line.Rise)}\" data-governs=\"{(line.Governs ? "true" : "false")}\" x1=\"{Num(a.X)}\" y1=\"{Num(a.Y)}\" x2=\"{Num(b.X)}\" y2=\"{Num(b.Y)}\" stroke=\"transparent\" stroke-width=\"8\">");
                layer.Append("<title>").Append(Html(Invariant.Format($"{line.Label}: nadir {Invariant.Number(env.Nadir.Value)} + {Invariant.Number(line.Rise)} = {Invariant.Number(line.Value)} mmol/L, {display.Time(line.From)} to {display.Time(line.To)}"))).Append("</title></line>");
            }
        }

        layer.Append("</g>");
        return svg.Replace("</svg>", layer + "</svg>", StringComparison.Ordinal);
    }

    private static string DrugPanel(CourseModel model, TimeDisplay display)
    {
        var rows = Math.Max(1, model.Drugs.Count);
        var height = (int)(Padding.Top + Padding.Bottom) + (rows * 34) + 10;
        var plot = NewPlot(model, display, -0.5, rows - 0.5);
        plot.Axes.Left.Label.Text = string.Empty;
        var left = X(model.From, display);
        var right = X(model.To, display);
        var ticks = new List<Tick>();
        for (var i = 0; i < model.Drugs.Count; i++)
        {
            var drug = model.Drugs[i];
            var row = model.Drugs.Count - 1 - i;
            ticks.Add(new Tick(row, drug.Name, isMajor: true));
            var start = drug.Start is { } s ? Math.Max(X(s, display), left) : left;
            var end = drug.End is { } e ? Math.Min(X(e, display), right) : Math.Min(X(model.Now, display), right);
            if (end <= start)
            {
                continue;
            }

            var bar = plot.Add.Rectangle(start, end, row - 0.3, row + 0.3);
            bar.FillColor = drug.Verdict switch
            {
                Core.Drugs.TimingVerdict.Likely => Vermillion.WithAlpha(0.85),
                Core.Drugs.TimingVerdict.Possible => Orange.WithAlpha(0.7),
                _ => Grey.WithAlpha(0.45),
            };
            bar.LineColor = Ink;
            bar.LineWidth = 1;
            if (drug.Start is null)
            {
                bar.LinePattern = LinePattern.Dotted;
            }
        }

        plot.Axes.Left.TickGenerator = new ScottPlot.TickGenerators.NumericManual([.. ticks]);
        plot.Axes.Left.MajorTickStyle.Length = 0;
        plot.Grid.YAxisStyle.IsVisible = false;
        var now = plot.Add.VerticalLine(X(model.Now, display));
        now.Color = Grey;
        now.LineWidth = 1;
        now.LinePattern = LinePattern.Dashed;

        var svg = Svg(plot, height);
        var layer = new StringBuilder("<g class=\"course-layer\" data-figure=\"drugs\">");
        for (var i = 0; i < model.Drugs.Count; i++)
        {
            var drug = model.Drugs[i];
            var row = model.Drugs.Count - 1 - i;
            var startX = drug.Start is { } s ? Math.Max(X(s, display), left) : left;
            var endX = drug.End is { } e ? Math.Min(X(e, display), right) : Math.Min(X(model.Now, display), right);
            var a = plot.GetPixel(new Coordinates(startX, row + 0.3));
            var b = plot.GetPixel(new Coordinates(Math.Max(startX, endX), row - 0.3));
            var start = drug.Start is { } st ? st.ToUniversalTime().ToString("o", CultureInfo.InvariantCulture) : string.Empty;
            var startText = drug.Start is { } known ? display.Time(known) : "start not recorded";
            var endText = drug.End is { } ended ? "stopped " + display.Time(ended) : drug.Ongoing ? "ongoing" : "end not recorded";
            layer.Append(CultureInfo.InvariantCulture, $"<rect class=\"course-hit\" data-kind=\"drug\" data-name=\"{Html(drug.Name)}\" data-start=\"{start}\" x=\"{Num(a.X)}\" y=\"{Num(a.Y)}\" width=\"{Num(Math.Abs(b.X - a.X))}\" height=\"{Num(Math.Abs(b.Y - a.Y))}\" fill=\"transparent\">");
            layer.Append("<title>").Append(Html($"{drug.Name} ({drug.Group}): {startText}, {endText}; {drug.VerdictText} ({drug.Reference})")).Append("</title></rect>");
        }

        layer.Append("</g>");
        return svg.Replace("</svg>", layer + "</svg>", StringComparison.Ordinal);
    }

    private static string Svg(Plot plot, int height)
    {
        var xml = plot.GetSvgXml(Width, height);
        var start = xml.IndexOf("<svg", StringComparison.Ordinal);
        var svg = start >= 0 ? xml[start..] : xml;
        // A viewBox lets the figure scale with the page (and in print) while keeping its coordinates.
        var size = Invariant.Format($"width=\"{Width}\" height=\"{height}\"");
        var at = svg.IndexOf(size, StringComparison.Ordinal);
        return at < 0 ? svg : string.Concat(
            svg.AsSpan(0, at),
            Invariant.Format($"viewBox=\"0 0 {Width} {height}\" {size} role=\"img\" class=\"course-figure\""),
            svg.AsSpan(at + size.Length));
    }

    private static string Circle(Pixel px, string kind, double? value, DateTimeOffset? at, string title)
    {
        var valueAttr = value is { } v ? " data-value=\"" + Num(v) + "\"" : string.Empty;
        var timeAttr = at is { } t ? " data-time=\"" + t.ToUniversalTime().ToString("o", CultureInfo.InvariantCulture) + "\"" : string.Empty;
        return $"<circle class=\"course-hit\" data-kind=\"{kind}\"{valueAttr}{timeAttr} cx=\"{Num(px.X)}\" cy=\"{Num(px.Y)}\" r=\"8\" fill=\"transparent\"><title>{Html(title)}</title></circle>";
    }

    private static Color BandColor(SeverityBand band) => band switch
    {
        SeverityBand.Profound => Vermillion.WithAlpha(0.16),
        SeverityBand.Moderate => Orange.WithAlpha(0.16),
        SeverityBand.Mild => Color.FromHex("#F0E442").WithAlpha(0.22),
        _ => BluishGreen.WithAlpha(0.10),
    };

    internal static string Num(double value) => Math.Round(value, 3).ToString("0.###", CultureInfo.InvariantCulture);

    internal static string Html(string text) => WebUtility.HtmlEncode(text);

    private static string Kebab(string name)
    {
        var sb = new StringBuilder();
        foreach (var c in name)
        {
            if (char.IsUpper(c) && sb.Length > 0)
            {
                sb.Append('-');
            }

            sb.Append(char.ToLowerInvariant(c));
        }

        return sb.ToString();
    }
}
