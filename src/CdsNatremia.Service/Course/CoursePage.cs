using System.Net;
using System.Text;
using CdsNatremia.Core;
using CdsNatremia.Core.Course;
using CdsNatremia.Core.Facts;

namespace CdsNatremia.Service.Course;

/// <summary>
/// The sodium-course page: the two figures, a legend, the data tables that hold the same numbers, and the full report.
/// Every text is HTML-encoded; the page has no script. Served with a stylesheet at /course/course.css, or with the same
/// style inline for the offline file.
/// </summary>
public static class CoursePage
{
    /// <summary>The page's stylesheet (print-readable; colours match the figures).</summary>
    public const string Css = """
        :root { color-scheme: light; }
        body { font-family: "DejaVu Sans", "Segoe UI", Arial, sans-serif; margin: 1.5rem auto; max-width: 68rem; color: #222; line-height: 1.45; padding: 0 1rem; }
        h1 { font-size: 1.5rem; margin-bottom: .2rem; } h2 { font-size: 1.2rem; margin-top: 2rem; border-bottom: 1px solid #ccc; }
        h3 { font-size: 1.05rem; } .meta { color: #555; margin-top: 0; }
        .advisory { border-left: 4px solid #0072B2; padding: .4rem .8rem; background: #f3f7fb; }
        figure { margin: 1rem 0; } .course-figure { width: 100%; height: auto; display: block; }
        figcaption { font-size: .9rem; color: #444; }
        .legend { display: flex; flex-wrap: wrap; gap: .4rem 1.4rem; padding: 0; list-style: none; font-size: .9rem; }
        .sym { font-weight: bold; display: inline-block; min-width: 1.6em; }
        .s-measured, .s-preliminary { color: #0072B2; } .s-bound { color: #D55E00; } .s-set-aside { color: #222; }
        .s-limit { color: #D55E00; } .s-highrisk { color: #CC79A7; } .s-goal { color: #009E73; } .s-fluid { color: #56B4E9; } .s-vaptan { color: #E69F00; }
        table { border-collapse: collapse; width: 100%; margin: .5rem 0 1rem; font-size: .92rem; }
        caption { text-align: left; font-weight: bold; padding: .3rem 0; }
        th, td { border: 1px solid #bbb; padding: .25rem .5rem; text-align: left; vertical-align: top; }
        th { background: #eee; } td.num { text-align: right; font-variant-numeric: tabular-nums; }
        .card { border: 1px solid #bbb; border-radius: 4px; padding: .3rem 1rem; margin: 1rem 0; break-inside: avoid-page; }
        .card-critical { border-left: 6px solid #D55E00; } .card-warning { border-left: 6px solid #E69F00; } .card-info { border-left: 6px solid #0072B2; }
        .indicator { text-transform: uppercase; font-size: .8rem; letter-spacing: .05em; }
        .note { color: #444; }
        @media print { body { margin: 0; max-width: none; } .advisory { background: none; } a { color: inherit; } }
        """;

    /// <summary>The whole page.</summary>
    /// <param name="data">What to show.</param>
    /// <param name="reportHtml">The full report (an HTML fragment from <see cref="CourseReport"/>).</param>
    /// <param name="inlineStyle">True for the offline file (style inline); false when served (stylesheet link, for the CSP).</param>
    public static string Render(CourseData data, string reportHtml, bool inlineStyle)
    {
        ArgumentNullException.ThrowIfNull(data);
        var model = data.Model;
        var display = data.Display;
        var (sodiumSvg, episodeSvg, drugSvg) = CourseChart.Render(model, display);
        var html = new StringBuilder();
        Head(html, "Sodium course", inlineStyle);
        html.Append("<main>");
        html.Append("<h1>Sodium course</h1>");
        html.Append("<p class=\"meta\">As of ").Append(E(display.Time(model.Now))).Append("; times in ").Append(E(display.IsUtc ? "UTC" : display.Zone.Id)).Append(".</p>");
        html.Append("<p class=\"advisory\">Advisory only: a picture of the results the service could read, for a clinician to judge with the patient in front of them. Data set aside is listed below and is not drawn as a value.</p>");

        html.Append("<figure id=\"sodium-figure\">").Append(sodiumSvg);
        html.Append("<figcaption>Sodium over time against the severity bands (").Append(E(model.BandSource)).Append(")");
        if (model.Envelope is { } env)
        {
            html.Append(", with the correction limits drawn from the nadir of ").Append(E(Invariant.Number(env.Nadir.Value))).Append(" mmol/L at ").Append(E(display.Time(env.Nadir.At)))
                .Append(" (").Append(E(env.LimitsName)).Append(")");
        }

        html.Append(".</figcaption></figure>");
        Legend(html, model);
        if (episodeSvg is not null && model.Envelope is { } zoom)
        {
            html.Append("<figure id=\"episode-figure\">").Append(episodeSvg).Append("<figcaption>The same, from 12 h before the nadir (")
                .Append(E(display.Time(zoom.Nadir.At))).Append(") to the end of the 48-h window: where the sodium stands against the limits.</figcaption></figure>");
        }

        if (model.EnvelopeNote is { } note)
        {
            html.Append("<p class=\"note\">").Append(E(note)).Append("</p>");
        }

        if (model.Envelope is { HighRisk: true } risky)
        {
            html.Append("<p class=\"note\"><strong>High risk of osmotic demyelination</strong> (").Append(E(string.Join(", ", risky.HighRiskFactors)))
                .Append("): the stricter limit applies.</p>");
        }

        if (model.Drugs.Count == 0)
        {
            html.Append("<p class=\"note\">No medicine that can lower sodium was found in the records read.</p>");
        }
        else
        {
            html.Append("<figure id=\"drug-figure\">").Append(drugSvg).Append("<figcaption>")
                .Append("Exposure to medicines that can lower sodium, from the recorded start to the stop (or now; dotted edge: start not recorded); shade by what the timing says: dark likely, lighter possible, grey unlikely.")
                .Append("</figcaption></figure>");
        }

        Tables(html, data);
        html.Append("<h2 id=\"report\">Full report</h2>").Append(reportHtml);
        html.Append("</main></body></html>");
        return html.ToString();
    }

    /// <summary>A plain page with a heading and a message (errors, the start of a launch).</summary>
    public static string Message(string title, string message, bool inlineStyle = false)
    {
        var html = new StringBuilder();
        Head(html, title, inlineStyle);
        html.Append("<main><h1>").Append(E(title)).Append("</h1><p>").Append(E(message)).Append("</p></main></body></html>");
        return html.ToString();
    }

    private static void Head(StringBuilder html, string title, bool inlineStyle)
    {
        html.Append("<!DOCTYPE html><html lang=\"en\"><head><meta charset=\"utf-8\"><meta name=\"viewport\" content=\"width=device-width, initial-scale=1\">");
        html.Append("<meta name=\"referrer\" content=\"no-referrer\"><title>").Append(E(title)).Append("</title>");
        html.Append(inlineStyle ? "<style>" + Css + "</style>" : "<link rel=\"stylesheet\" href=\"/course/course.css\">");
        html.Append("</head><body>");
    }

    private static void Legend(StringBuilder html, CourseModel model)
    {
        html.Append("<ul class=\"legend\" aria-label=\"Legend\">");
        Item(html, "s-measured", "●", "sodium result");
        Item(html, "s-preliminary", "○", "preliminary result");
        Item(html, "s-bound", "▼▲", "a bound (value below / above the mark)");
        Item(html, "s-set-aside", "✕", "set aside (not used; reason on hover and in the table)");
        Item(html, "s-set-aside", "◯", "the nadir");
        Item(html, "s-limit", "– –", "correction limit (24 h, then 48 h)");
        if (model.Envelope?.HighRisk == true)
        {
            Item(html, "s-highrisk", "━", "stricter high-risk limit");
        }

        Item(html, "s-goal", "- -", "minimum goal by 24 h");
        Item(html, "s-fluid", "┆", "sodium chloride order");
        Item(html, "s-vaptan", "┆", "vaptan order");
        html.Append("</ul>");
    }

    private static void Item(StringBuilder html, string css, string symbol, string text)
        => html.Append("<li><span class=\"sym ").Append(css).Append("\" aria-hidden=\"true\">").Append(E(symbol)).Append("</span>").Append(E(text)).Append("</li>");

    private static void Tables(StringBuilder html, CourseData data)
    {
        var model = data.Model;
        var display = data.Display;
        html.Append("<h2 id=\"data\">The numbers in the picture</h2>");
        html.Append("<table id=\"sodium-table\"><caption>Sodium results</caption><thead><tr><th scope=\"col\">Time</th><th scope=\"col\">Sodium (mmol/L)</th><th scope=\"col\">Shown as</th><th scope=\"col\">Band or reason</th><th scope=\"col\">Record</th></tr></thead><tbody>");
        var rows = model.Points.Select(p => (At: (DateTimeOffset?)p.At, Row: Row(display.Time(p.At), Invariant.Number(p.Value), p.IsPreliminary ? "preliminary result" : "result", Band(model, p), p.Reference, p.IsPreliminary ? "preliminary" : "measured", p.Value)))
            .Concat(model.Bounds.Select(b => (At: (DateTimeOffset?)b.At, Row: Row(display.Time(b.At), b.Description, "bound", "a bound is not a measurement: never used for a rate", b.Reference, "bound", b.Value))))
            .Concat(model.SetAside.Select(s => (s.At, Row: Row(s.At is { } at ? display.Time(at) : "time not known", "—", "set aside", s.What + ": " + s.Reason, s.Reference, "set-aside", null))))
            .OrderBy(r => r.At ?? DateTimeOffset.MaxValue)
            .Select(r => r.Row);
        foreach (var row in rows)
        {
            html.Append(row);
        }

        html.Append("</tbody></table>");
        if (model.AboutAnotherPatientCount > 0)
        {
            html.Append("<p class=\"note\">").Append(E(Invariant.Format($"{model.AboutAnotherPatientCount} item(s) received were about another patient: counted, never shown or used."))).Append("</p>");
        }

        if (model.Envelope is { } env)
        {
            html.Append("<table id=\"envelope-table\"><caption>Correction limits from the nadir (").Append(E(env.Source)).Append(")</caption><thead><tr><th scope=\"col\">Line</th><th scope=\"col\">From</th><th scope=\"col\">To</th><th scope=\"col\">Rise (mmol/L)</th><th scope=\"col\">Sodium (mmol/L)</th><th scope=\"col\">Applies to this patient</th></tr></thead><tbody>");
            foreach (var line in env.Lines)
            {
                html.Append("<tr data-kind=\"").Append(E(line.Kind.ToString())).Append("\"><td>").Append(E(line.Label)).Append("</td><td>").Append(E(display.Time(line.From))).Append("</td><td>").Append(E(display.Time(line.To)))
                    .Append("</td><td class=\"num\">").Append(E(Invariant.Number(line.Rise))).Append("</td><td class=\"num\">").Append(E(Invariant.Number(line.Value)))
                    .Append("</td><td>").Append(line.Governs ? "yes" : "no (the stricter high-risk limit applies)").Append("</td></tr>");
            }

            html.Append("</tbody></table>");
        }

        if (model.Drugs.Count > 0)
        {
            html.Append("<table id=\"drug-table\"><caption>Medicines that can lower sodium</caption><thead><tr><th scope=\"col\">Medicine</th><th scope=\"col\">Group</th><th scope=\"col\">Started</th><th scope=\"col\">Stopped</th><th scope=\"col\">Timing says</th><th scope=\"col\">Record</th></tr></thead><tbody>");
            foreach (var drug in model.Drugs)
            {
                html.Append("<tr><td>").Append(E(drug.Name)).Append("</td><td>").Append(E(drug.Group)).Append("</td><td>").Append(E(drug.Start is { } s ? display.Time(s) : "not recorded"))
                    .Append("</td><td>").Append(E(drug.End is { } e ? display.Time(e) : drug.Ongoing ? "ongoing" : "not recorded")).Append("</td><td>").Append(E(drug.VerdictText))
                    .Append("</td><td>").Append(E(drug.Reference)).Append("</td></tr>");
            }

            html.Append("</tbody></table>");
        }

        if (model.Orders.Count > 0)
        {
            html.Append("<table id=\"order-table\"><caption>Sodium chloride and vaptan orders</caption><thead><tr><th scope=\"col\">Order</th><th scope=\"col\">Kind</th><th scope=\"col\">Starts</th><th scope=\"col\">Predicted effect</th><th scope=\"col\">Record</th></tr></thead><tbody>");
            foreach (var order in model.Orders)
            {
                html.Append("<tr><td>").Append(E(order.Name)).Append("</td><td>").Append(order.Kind == CourseOrderKind.Vaptan ? "vaptan" : "fluid").Append("</td><td>")
                    .Append(E(order.At is { } at ? display.Time(at) : "not recorded")).Append("</td><td>").Append(E(order.Effect)).Append("</td><td>").Append(E(order.Reference)).Append("</td></tr>");
            }

            html.Append("</tbody></table>");
        }

        if (data.Notes.Count > 0)
        {
            html.Append("<h3>About the data</h3><ul>");
            foreach (var note in data.Notes)
            {
                html.Append("<li>").Append(E(note)).Append("</li>");
            }

            html.Append("</ul>");
        }
    }

    private static string Band(CourseModel model, CoursePoint point)
        => model.Bands.FirstOrDefault(b => b.Band == point.Band)?.Name ?? (point.Band == Core.Sodium.SeverityBand.AboveRange ? "above the normal range" : point.Band.ToString().ToLowerInvariant());

    private static string Row(string time, string value, string shownAs, string bandOrReason, string reference, string kind, double? number)
    {
        var data = number is { } n ? " data-value=\"" + CourseChart.Num(n) + "\"" : string.Empty;
        return $"<tr data-kind=\"{kind}\"{data}><td>{E(time)}</td><td class=\"num\">{E(value)}</td><td>{E(shownAs)}</td><td>{E(bandOrReason)}</td><td>{E(reference)}</td></tr>";
    }

    private static string E(string? text) => WebUtility.HtmlEncode(text ?? string.Empty);
}
