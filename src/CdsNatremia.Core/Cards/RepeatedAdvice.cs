using CdsNatremia.Core.Text;

namespace CdsNatremia.Core.Cards;

/// <summary>
/// Advice that is not repeated: a card whose findings a clinician already answered (accepted or overridden) within the
/// quiet period is shown as information that says when it was last reviewed, instead of interrupting again. The host
/// decides whether it was answered (audit store); this only rewrites the card.
/// </summary>
public static class RepeatedAdvice
{
    /// <summary>The card dropped to info, saying when it was last reviewed (display zone, with its age).</summary>
    public static Card Quiet(Card card, DateTimeOffset lastReviewedAt, TimeDisplay display)
    {
        Guard.NotNull(card, nameof(card));
        Guard.NotNull(display, nameof(display));
        var phrases = Rendering.PhraseCatalogue.Default;
        var note = phrases.Render(
            Findings.Finding.Of(Findings.FindingKind.AlreadyReviewed, Findings.Slot.Time("time", lastReviewedAt), Findings.Slot.Time("age", lastReviewedAt, Findings.TimeStyle.Age)),
            display);
        return card with
        {
            Indicator = CardIndicator.Info,
            Summary = Summary.Fit(phrases.Render(
                Findings.Finding.Of(Findings.FindingKind.AlreadyReviewedSummary, Findings.Slot.Time("age", lastReviewedAt, Findings.TimeStyle.Age), Findings.Slot.Verbatim("summary", card.Summary)),
                display)),
            Detail = note + "\n\n" + card.Detail,
            Report = note + "\n\n" + card.Report,
        };
    }
}
