using System.Net;
using System.Text;
using CdsNatremia.Core.Cards;
using Markdig;

namespace CdsNatremia.Service.Course;

/// <summary>
/// The full report below the chart: each card's summary and its full report, rendered by the core from the same findings
/// as the card (<see cref="Card.Report"/>: findings, reasoning with the data each step used, data set aside, sources,
/// cautions), turned into HTML with Markdig; raw HTML in the Markdown is never passed through (it is shown as text), so
/// text that came from the EHR cannot inject markup.
/// </summary>
public sealed class CourseReport
{
    private static readonly MarkdownPipeline Pipeline = new MarkdownPipelineBuilder()
        .DisableHtml()
        .UsePipeTables()
        .UseEmphasisExtras()
        .Build();

    /// <summary>The report as an HTML fragment.</summary>
    public string Render(IReadOnlyList<Card> cards)
    {
        ArgumentNullException.ThrowIfNull(cards);
        var html = new StringBuilder();
        if (cards.Count == 0)
        {
            html.Append("<p>The service would show no card for this patient now (for example, the latest sodium is normal).</p>");
            return html.ToString();
        }

        foreach (var card in cards)
        {
            var indicator = card.Indicator.ToString().ToLowerInvariant();
            html.Append("<article class=\"card card-").Append(indicator).Append("\">");
            html.Append("<h3><span class=\"indicator\">").Append(WebUtility.HtmlEncode(indicator)).Append("</span> ")
                .Append(WebUtility.HtmlEncode(card.Summary)).Append("</h3>");
            html.Append(ToHtml(card.Report.Length > 0 ? card.Report : card.Detail));
            html.Append("</article>");
        }

        return html.ToString();
    }

    /// <summary>Markdown to HTML with raw HTML disabled.</summary>
    public static string ToHtml(string markdown) => Markdown.ToHtml(markdown ?? string.Empty, Pipeline);
}
