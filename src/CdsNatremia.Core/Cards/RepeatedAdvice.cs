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
        var note = Invariant.Format(
            $"**Already reviewed**: a clinician answered this card for the same findings, last reviewed {display.Time(lastReviewedAt)} ({display.Age(lastReviewedAt)}). Nothing new since (same newest sodium, same band, same medicines), so it is shown as information; it interrupts again when something new appears.");
        return card with
        {
            Indicator = CardIndicator.Info,
            Summary = Summary.Fit("Last reviewed " + display.Age(lastReviewedAt) + ": " + card.Summary),
            Detail = note + "\n\n" + card.Detail,
        };
    }
}
