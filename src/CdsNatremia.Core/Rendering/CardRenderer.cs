using System.Text;
using CdsNatremia.Core.Cards;
using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Findings;

namespace CdsNatremia.Core.Rendering;

/// <summary>
/// The short card a busy prescriber reads in seconds: the summary (under 140 characters) and a detail of at most
/// <see cref="DetailBudget"/> characters: the main finding; the patient-specific reasons (at most three, by weight); the
/// next step; the patient-specific cautions; a line on data that could not be used; one line of standing cautions.
/// Everything else (reasoning, data used, data set aside, sources) is in the full report behind the card's link.
/// When the parts do not fit, the reasons with the lowest weight go first; cautions and the standing line never go.
/// </summary>
public static class CardRenderer
{
    /// <summary>The most characters a card detail may have.</summary>
    public const int DetailBudget = 700;

    /// <summary>The most reasons a short card shows.</summary>
    public const int MaxReasons = 3;

    /// <summary>The summary of <paramref name="content"/>.</summary>
    public static string Summary(CardContent content, RenderContext context)
        => Cards.Summary.Fit(Guard.NotNull(context, nameof(context)).Phrases.Render(Guard.NotNull(content, nameof(content)).Summary, context.Display));

    /// <summary>The short detail of <paramref name="content"/>.</summary>
    public static string Detail(CardContent content, RenderContext context)
    {
        Guard.NotNull(content, nameof(content));
        Guard.NotNull(context, nameof(context));
        var phrases = context.Phrases;
        string Say(Finding f) => phrases.Render(f, context.Display);

        var reasons = content.Reasons
            .Select((f, i) => (Finding: f, Index: i))
            .OrderByDescending(x => x.Finding.Weight)
            .ThenBy(x => x.Index)
            .Take(MaxReasons)
            .ToList();
        var next = content.NextSteps.Count > 0 ? Say(content.NextSteps[0]) : null;
        var cautions = content.Cautions.Select(Say).ToList();
        var notUsed = NotUsedLine(context);
        var standing = phrases.Text("card.standing");

        while (true)
        {
            var text = Compose(Say(content.Headline), reasons.OrderBy(x => x.Index).Select(x => Say(x.Finding)), next, cautions, notUsed, standing, phrases);
            if (text.Length <= DetailBudget || reasons.Count == 0)
            {
                return text;
            }

            // Drop the least weighty reason and try again.
            var least = reasons.OrderBy(x => x.Finding.Weight).ThenByDescending(x => x.Index).First();
            reasons.Remove(least);
        }
    }

    private static string Compose(string headline, IEnumerable<string> reasons, string? next, IReadOnlyList<string> cautions, string? notUsed, string standing, PhraseCatalogue phrases)
    {
        var text = new StringBuilder();
        text.Append("**").Append(headline).Append("**\n");
        var list = reasons.ToList();
        if (list.Count > 0)
        {
            text.Append('\n');
            foreach (var reason in list)
            {
                text.Append("- ").Append(reason).Append('\n');
            }
        }

        if (next is not null)
        {
            text.Append('\n').Append(phrases.Text("card.next")).Append(' ').Append(next).Append('\n');
        }

        foreach (var caution in cautions)
        {
            text.Append('\n').Append(phrases.Text("card.caution")).Append(' ').Append(caution).Append('\n');
        }

        if (notUsed is not null)
        {
            text.Append('\n').Append(notUsed).Append('\n');
        }

        text.Append('\n').Append('_').Append(standing).Append("_\n");
        return text.ToString();
    }

    /// <summary>
    /// One line on what could not be used: the counts only (the items and their reasons are in the report). Another
    /// patient's data is counted apart and never described.
    /// </summary>
    private static string? NotUsedLine(RenderContext context)
    {
        var facts = context.Facts;
        var own = facts.SetAside.Where(s => s.State != FactState.NotThisPatient).ToList();
        var others = facts.AboutAnotherPatientCount;
        var unavailable = facts.Unavailable.Count;
        if (own.Count == 0 && others == 0 && unavailable == 0)
        {
            return null;
        }

        string Say(Finding f) => context.Phrases.Render(f, context.Display);
        var parts = new List<string>();

        // This patient's items are named (what and why, briefly); the reasons in full are in the report.
        foreach (var item in own.Take(MaxNamedNotUsed))
        {
            var why = item.State switch
            {
                FactState.Superseded => "card.not-used.why.superseded",
                FactState.Absent => "card.not-used.why.absent",
                _ => "card.not-used.why.unreadable",
            };
            parts.Add(Say(Finding.Of("card.not-used.item", Slot.Text("what", Shorten(item.What)), Slot.Phrase("why", Finding.Of(why)))));
        }

        if (own.Count > MaxNamedNotUsed)
        {
            parts.Add(Say(Finding.Of("card.not-used.more", Slot.Count("count", own.Count - MaxNamedNotUsed))));
        }

        if (unavailable > 0)
        {
            parts.Add(Say(Finding.Of("card.not-used.unavailable", Slot.Count("count", unavailable))));
        }

        // Another patient's data: a count only, never what it was.
        if (others > 0)
        {
            parts.Add(Say(Finding.Of("card.not-used.another-patient", Slot.Count("count", others))));
        }

        return Say(Finding.Of("card.not-used", Slot.Verbatim("parts", string.Join("; ", parts))));
    }

    /// <summary>The most items of this patient the card names as not used (the rest are counted).</summary>
    private const int MaxNamedNotUsed = 2;

    private static string Shorten(string what) => what.Length <= 48 ? what : what[..47].TrimEnd() + "…";
}
