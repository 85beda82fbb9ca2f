using CdsNatremia.Core.Assessment;
using CdsNatremia.Core.Cards;
using CdsNatremia.Core.Drugs;
using CdsNatremia.Core.Engine;
using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Knowledge;
using CdsNatremia.Core.Sodium;
using CdsNatremia.Core.Text;

namespace CdsNatremia.Core.CorrectionRate;

/// <summary>
/// On order-select and order-sign, a draft order for a vasopressin-receptor antagonist or for desmopressin, when the sodium
/// of the current episode was low (or could not be used).
/// <para>
/// A <b>vaptan</b> raises sodium: the card gives the rate caution with where the correction stands, the liver caution of its
/// prescribing information (from memory: avoid in liver disease, limit the duration of treatment), naming liver disease
/// when the record holds it, and the 2014 European guideline's recommendation against vaptans in moderate or profound
/// hyponatraemia, naming the patient's band when it is one of those.
/// </para>
/// <para>
/// <b>Desmopressin</b> lowers sodium while it acts: it is never called a drug that raises sodium. One order gets one card:
/// when the prescribing warning (<see cref="DrugOrderWarningProducer"/>) speaks for it, this producer does not. When the
/// chart shows the correction passed its limit, the card says that deliberate re-lowering with desmopressin is a
/// recognised strategy under senior care.
/// </para>
/// </summary>
public sealed class RateCautionOrderCardProducer : ICardProducer
{
    /// <summary>Topic code of the card (card-topic CodeSystem).</summary>
    public const string Topic = "rate-caution-order";

    /// <summary>The 2014 European guideline on vaptans (Spasovski et al. 2014, its recommendations; reference sheet names the guideline).</summary>
    public const string EuropeanOnVaptans = "2014 European clinical practice guideline on hyponatraemia (Spasovski et al., Eur J Endocrinol 2014;170:G1): recommends against vasopressin-receptor antagonists in moderate or profound hyponatraemia";

    /// <summary>The liver caution's source.</summary>
    public const string VaptanLabel = "Tolvaptan prescribing information (from memory: liver injury; avoid in liver disease; limited duration of treatment)";

    private const string VaptanRate =
        "A vasopressin-receptor antagonist causes a water diuresis that can raise sodium faster than the correction limits allow, especially with other sodium-raising treatment or when the cause resolves at the same time.";

    private const string VaptanLiver =
        "**Liver**: a vasopressin-receptor antagonist (tolvaptan) can injure the liver; its prescribing information (from memory) advises avoiding it in liver disease, including cirrhosis, and limiting the duration of treatment.";

    private const string DesmopressinLowers =
        "Desmopressin makes the kidney retain water, so while it acts it **lowers** sodium (it does not raise it); when it wears off or is stopped, a water diuresis can follow and the sodium can then rise quickly.";

    /// <inheritdoc />
    public string RuleId => "sodium.rate-caution-order";

    /// <summary>The sentence for a chart that shows over-correction, naming the window and its peak.</summary>
    public static string ReloweringText(RateWindow window, TimeDisplay display)
    {
        Guard.NotNull(window, nameof(window));
        Guard.NotNull(display, nameof(display));
        var peak = window.PassedAt ?? window.Latest;
        return Invariant.Format(
            $"**The chart shows over-correction**: {Cite.Result(peak, display)} is {RateText.Mmol(peak.Value - window.Baseline.Value)} above {Invariant.Number(window.Baseline.Value)} mmol/L ({Markdown.Escape(window.Baseline.Reference)}), at or past the {RateText.Mmol(window.Limit)} limit ({window.LimitLabel}). Giving desmopressin deliberately to slow or re-lower the sodium after over-correction is a **recognised strategy under senior care** (local protocol), with sodium checked often.");
    }

    /// <inheritdoc />
    public IEnumerable<Card> Produce(DecisionContext context)
    {
        Guard.NotNull(context, nameof(context));
        var vaptans = new List<(MedicationFact Order, MedicationMatch Match)>();
        var desmopressin = new List<(MedicationFact Order, MedicationMatch Match)>();
        var vaptanSet = context.Knowledge.Find(DrugCauseSets.Vaptans);
        var desmopressinSet = context.Knowledge.Find(DrugOrderWarningProducer.DesmopressinSetId);
        foreach (var order in DraftOrders.Considered(context.Request))
        {
            if (vaptanSet is not null && MedicationMatching.Match(vaptanSet, order) is { } vaptan)
            {
                vaptans.Add((order, vaptan));
            }

            // One order, one card: the prescribing warning speaks for desmopressin when the sodium gives it a reason.
            if (desmopressinSet is not null && MedicationMatching.Match(desmopressinSet, order) is { } dm && !DrugOrderWarningProducer.Warns(context, order))
            {
                desmopressin.Add((order, dm));
            }
        }

        var allowance = Allowance.For(context);
        if ((vaptans.Count == 0 && desmopressin.Count == 0) || !Allowance.Concerns(context, allowance))
        {
            return [];
        }

        var cards = new List<Card>();
        if (vaptans.Count > 0)
        {
            cards.Add(VaptanCard(context, vaptans, allowance));
        }

        if (desmopressin.Count > 0)
        {
            cards.Add(DesmopressinCard(context, desmopressin, allowance));
        }

        return cards;
    }

    private Card VaptanCard(DecisionContext context, List<(MedicationFact Order, MedicationMatch Match)> matches, Allowance? allowance)
    {
        var names = Names(matches);
        var findings = Describe(matches, VaptanRate);
        var used = matches.Select(m => m.Order.Reference).ToList();
        findings.Add(VaptanLiver);
        var liver = LiverDisease(context);
        if (liver is not null)
        {
            used.Add(liver.Reference);
            var text = string.IsNullOrWhiteSpace(liver.Text) ? string.Empty : ", \"" + Markdown.Escape(liver.Text) + "\"";
            findings.Add($"**The record shows liver disease** ({Markdown.Escape(liver.Reference)}{text}): the prescribing information advises avoiding the drug here (from memory).");
        }

        SeverityBand? band = allowance is null ? null : context.Thresholds.Classify(allowance.Episode.Latest.Value);
        var advisedAgainst = band is SeverityBand.Moderate or SeverityBand.Profound;
        if (allowance is not null)
        {
            used.Add(allowance.Episode.Latest.Reference);
            findings.Add("Latest sodium: " + Cite.Result(allowance.Episode.Latest, context.Display));
        }
        else
        {
            findings.Add("No usable sodium result was found; the correction cannot be placed against the limits.");
        }

        findings.Add(advisedAgainst
            ? Invariant.Format($"**The 2014 European guideline recommends against vasopressin-receptor antagonists in moderate or profound hyponatraemia**, and this patient's latest sodium is {context.Thresholds.NameOf(band!.Value)} ({context.Thresholds.RangeOf(band.Value)}).")
            : "The 2014 European guideline recommends against vasopressin-receptor antagonists in moderate or profound hyponatraemia; the latest usable sodium is not in those bands.");

        var detail = new DetailWriter()
            .Paragraph(Invariant.Format($"**A vasopressin-receptor antagonist is being ordered** as of {context.Display.Time(context.Request.Now)}. Advisory only."))
            .Bullets("Findings", findings)
            .Bullets("Where the correction stands (limits)", allowance?.Describe(context.Options.CorrectionRate, context.Display) ?? [])
            .Bullets("Points clinicians usually weigh (under local protocol; not orders)",
            [
                "Whether a vaptan is the right treatment at all here (guideline, liver, duration), decided with a senior clinician.",
                "If it is given: checking sodium often after the first dose, at the interval local protocol sets, stopping other sodium-raising treatment if the rise approaches the limit, and not restricting fluid at the same time (common practice).",
            ]);
        CardFooter.Write(detail, context, [EuropeanOnVaptans, VaptanLabel, .. allowance is null ? [] : RateText.Sources(allowance.Limits)]);

        var summary = advisedAgainst
            ? Invariant.Format($"{names} ordered at sodium {Invariant.Number(allowance!.Episode.Latest.Value)} mmol/L: 2014 European guideline advises against vaptans here; fast rise, liver risk.")
            : Invariant.Format($"{names} ordered: can raise sodium too fast; avoid in liver disease; check sodium often and keep within the limits.");
        return new Card
        {
            Summary = Summary.Fit(summary),
            // A stale sodium calls for a recheck first: at most a warning.
            Indicator = allowance?.Binding.Status == RateStatus.AtOrPast && !context.Sodium.LatestIsStale ? CardIndicator.Critical : CardIndicator.Warning,
            Detail = detail.ToString(),
            Topic = Topic,
            RuleIds = [RuleId, RuleId + ".vaptan"],
            ResourcesUsed = used.Distinct(StringComparer.Ordinal).ToList(),
        };
    }

    private Card DesmopressinCard(DecisionContext context, List<(MedicationFact Order, MedicationMatch Match)> matches, Allowance? allowance)
    {
        var names = Names(matches);
        var findings = Describe(matches, DesmopressinLowers);
        var used = matches.Select(m => m.Order.Reference).ToList();
        var overcorrected = allowance?.Overcorrected;
        if (allowance is not null)
        {
            used.Add(allowance.Episode.Latest.Reference);
            findings.Add("Latest sodium: " + Cite.Result(allowance.Episode.Latest, context.Display));
        }
        else
        {
            findings.Add("No usable sodium result was found; the correction cannot be placed against the limits.");
        }

        if (overcorrected is not null)
        {
            findings.Add(ReloweringText(overcorrected, context.Display));
        }

        var detail = new DetailWriter()
            .Paragraph(Invariant.Format($"**Desmopressin is being ordered** as of {context.Display.Time(context.Request.Now)}: it lowers sodium. Advisory only."))
            .Bullets("Findings", findings)
            .Bullets("Where the correction stands (limits)", allowance?.Describe(context.Options.CorrectionRate, context.Display) ?? [])
            .Bullets("Points clinicians usually weigh (under local protocol; not orders)",
            [
                "Checking sodium often while desmopressin acts and after it is stopped, at the interval local protocol sets, and matching fluid intake to the plan.",
                "Discussing the plan with a senior clinician, above all when the patient is at high risk of osmotic demyelination.",
            ]);
        CardFooter.Write(detail, context, allowance is null ? [] : RateText.Sources(allowance.Limits));

        var summary = overcorrected is not null
            ? Invariant.Format($"{names} ordered after over-correction: it lowers sodium; deliberate re-lowering is a recognised strategy under senior care.")
            : Invariant.Format($"{names} ordered: it lowers sodium while it acts; check sodium often.");
        return new Card
        {
            Summary = Summary.Fit(summary),
            Indicator = CardIndicator.Warning,
            Detail = detail.ToString(),
            Topic = Topic,
            RuleIds = [RuleId, RuleId + ".desmopressin"],
            ResourcesUsed = used.Distinct(StringComparer.Ordinal).ToList(),
        };
    }

    private static string Names(List<(MedicationFact Order, MedicationMatch Match)> matches)
    {
        var names = string.Join(", ", matches.Select(m => m.Match.Ingredient).Distinct(StringComparer.OrdinalIgnoreCase));
        return names.Length == 0 ? names : char.ToUpperInvariant(names[0]) + names[1..];
    }

    private static List<string> Describe(List<(MedicationFact Order, MedicationMatch Match)> matches, string why)
        => matches
            .Select(m => Invariant.Format($"**{Markdown.Escape(m.Match.Ingredient)}** ({Markdown.Escape(m.Order.Reference)}; matched by {Markdown.Escape(m.Match.By)}; {Markdown.Escape(m.Match.Set.Label)}). {why}"))
            .ToList();

    private static ConditionFact? LiverDisease(DecisionContext context)
    {
        if (context.Knowledge.Find("condition-cirrhosis") is not { } set)
        {
            return null;
        }

        return context.Request.Facts.Conditions
            .OrderBy(c => c.ResourceId, StringComparer.Ordinal)
            .FirstOrDefault(c => c.Codes.Any(set.Matches) || set.MatchName(c.Text) is not null);
    }
}
