using CdsNatremia.Core.Assessment;
using CdsNatremia.Core.Cards;
using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Findings;
using CdsNatremia.Core.Text;

namespace CdsNatremia.Core.Rendering;

/// <summary>
/// The full report behind a card's link, from the same findings as the card: the main finding, the key findings, the
/// reasoning with the data each step used, possible causes, next steps, this patient's cautions, the data set aside with
/// the reason, the data the service could not obtain, integration notes, the standing cautions and the sources.
/// Markdown; times in the display zone.
/// </summary>
public static class ReportRenderer
{
    private const int MaxSetAsideShown = 20;

    /// <summary>The report of one card.</summary>
    public static string Render(CardContent content, RenderContext context)
    {
        Guard.NotNull(content, nameof(content));
        Guard.NotNull(context, nameof(context));
        var phrases = context.Phrases;
        var display = context.Display;
        void Say(System.Text.StringBuilder text, Finding f) => phrases.RenderInto(text, f, display);

        var detail = new DetailWriter(16 * 1024)
            .Paragraph(phrases.Render(Finding.Of("report.opening", Slot.Phrase("headline", content.Headline), Slot.Time("now", display.Now)), display))
            .Bullets(phrases.Text("report.findings"), content.Reasons, Say)
            .Numbered(phrases.Text("report.reasoning"), content.Steps, Say)
            .Bullets(phrases.Text("report.causes"), content.Causes, Say)
            .Bullets(phrases.Text("report.next"), content.NextSteps, Say)
            .Bullets(phrases.Text("report.patient-cautions"), content.Cautions, Say);
        Footer(detail, context, content.Sources);
        return detail.ToString();
    }

    /// <summary>The closing sections: data set aside, data not obtained, data notes, cautions and sources.</summary>
    public static void Footer(DetailWriter detail, RenderContext context, IEnumerable<string> sources)
    {
        Guard.NotNull(detail, nameof(detail));
        Guard.NotNull(context, nameof(context));
        var facts = context.Facts;
        var phrases = context.Phrases;
        var setAside = facts.SetAside.Where(s => s.State != FactState.NotThisPatient).Select(s => Cite.SetAside(s, context.Display)).ToList();
        if (setAside.Count > MaxSetAsideShown)
        {
            var more = setAside.Count - MaxSetAsideShown;
            setAside = [.. setAside.Take(MaxSetAsideShown), phrases.Render(Finding.Of("report.set-aside.more", Slot.Count("count", more)), context.Display)];
        }

        // Another patient's data: a count only, never values, ids or times (privacy), and never a reason for a conclusion.
        if (facts.AboutAnotherPatientCount is var others and > 0)
        {
            setAside.Add(phrases.Render(Finding.Of(others == 1 ? "report.another-patient.one" : "report.another-patient.many", Slot.Count("count", others)), context.Display));
        }

        detail.Bullets(phrases.Text("report.set-aside"), setAside);
        detail.Bullets(
            phrases.Text("report.unavailable"),
            facts.Unavailable.OrderBy(kv => kv.Key, StringComparer.Ordinal).Select(kv => $"{Markdown.Escape(kv.Key)}: {Markdown.Escape(kv.Value)}"));
        detail.Bullets(phrases.Text("report.data-notes"), facts.DataNotes.Select(Markdown.Escape));
        detail.Bullets(SafetyCautions.Heading, SafetyCautions.All);
        detail.Bullets(phrases.Text("report.sources"), sources);
    }
}
