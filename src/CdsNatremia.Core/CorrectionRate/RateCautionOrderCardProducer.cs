using CdsNatremia.Core.Assessment;
using CdsNatremia.Core.Cards;
using CdsNatremia.Core.Drugs;
using CdsNatremia.Core.Engine;
using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Findings;
using CdsNatremia.Core.Knowledge;
using CdsNatremia.Core.Rendering;
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

    /// <inheritdoc />
    public string RuleId => "sodium.rate-caution-order";

    /// <summary>The finding for a chart that shows over-correction, naming the window and its peak.</summary>
    public static Finding Relowering(RateWindow window)
    {
        Guard.NotNull(window, nameof(window));
        var peak = window.PassedAt ?? window.Latest;
        return Finding.Of(
            FindingKind.RateDesmopressinRelowering,
            Slot.Result("peak", peak),
            Slot.Number("rise", peak.Value - window.Baseline.Value),
            Slot.Number("baseline", window.Baseline.Value),
            Slot.Text("baselineRef", window.Baseline.Reference),
            Slot.Number("limit", window.Limit),
            Slot.Phrase("label", window.LimitLabel)).RestingOn(peak.Reference, window.Baseline.Reference);
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
        var reasons = Describe(matches, FindingKind.RateVaptanRate, Weights.Pace);
        var used = matches.Select(m => m.Order.Reference).ToList();
        reasons.Add(Finding.Of(FindingKind.RateVaptanLiver).Weighted(Weights.Cause));
        if (LiverDisease(context) is { } liver)
        {
            used.Add(liver.Reference);
            reasons.Add((string.IsNullOrWhiteSpace(liver.Text)
                ? Finding.Of(FindingKind.RateVaptanLiverDiseaseUntitled, Slot.Text("ref", liver.Reference))
                : Finding.Of(FindingKind.RateVaptanLiverDisease, Slot.Text("ref", liver.Reference), Slot.Text("text", liver.Text))).RestingOn(liver.Reference).Weighted(Weights.Urgent));
        }

        SeverityBand? band = allowance is null ? null : context.Thresholds.Classify(allowance.Episode.Latest.Value);
        var advisedAgainst = band is SeverityBand.Moderate or SeverityBand.Profound;
        reasons.Add(LatestSodium(allowance, used));
        reasons.Add(advisedAgainst
            ? Finding.Of(FindingKind.RateVaptanGuidelineBand, Slot.Text("band", context.Thresholds.NameOf(band!.Value)), Slot.Text("range", context.Thresholds.RangeOf(band.Value))).Weighted(Weights.Culprit)
            : Finding.Of(FindingKind.RateVaptanGuideline).Weighted(Weights.Stated));

        var nameSlot = Slot.Text("names", names);
        var content = new CardContent
        {
            Summary = advisedAgainst
                ? Finding.Of(FindingKind.RateVaptanSummaryAdvisedAgainst, nameSlot, Slot.Number("sodium", allowance!.Episode.Latest.Value))
                : Finding.Of(FindingKind.RateVaptanSummary, nameSlot),
            Headline = Finding.Of(FindingKind.RateVaptanHeadline, nameSlot).RestingOn([.. matches.Select(m => m.Order.Reference)]),
            Reasons = reasons,
            Steps = allowance?.Describe(context.Options.CorrectionRate) ?? [],
            NextSteps = [Finding.Of(FindingKind.RateVaptanNextWhether), Finding.Of(FindingKind.RateVaptanNextIfGiven)],
            Cautions = Cautions(context, allowance),
            Sources = [EuropeanOnVaptans, VaptanLabel, .. allowance is null ? [] : RateText.Sources(allowance.Limits)],
        };
        return new Card
        {
            Content = content,
            // A stale sodium calls for a recheck first: at most a warning.
            Indicator = allowance?.Binding.Status == RateStatus.AtOrPast && !context.Sodium.LatestIsStale ? CardIndicator.Critical : CardIndicator.Warning,
            Topic = Topic,
            RuleIds = [RuleId, RuleId + ".vaptan"],
            ResourcesUsed = used.Distinct(StringComparer.Ordinal).ToList(),
        };
    }

    private Card DesmopressinCard(DecisionContext context, List<(MedicationFact Order, MedicationMatch Match)> matches, Allowance? allowance)
    {
        var names = Names(matches);
        var reasons = Describe(matches, FindingKind.RateDesmopressinLowers, Weights.Pace);
        var used = matches.Select(m => m.Order.Reference).ToList();
        var overcorrected = allowance?.Overcorrected;
        reasons.Add(LatestSodium(allowance, used));
        if (overcorrected is not null)
        {
            reasons.Add(Relowering(overcorrected).Weighted(Weights.Culprit));
        }

        var nameSlot = Slot.Text("names", names);
        var content = new CardContent
        {
            Summary = Finding.Of(overcorrected is not null ? FindingKind.RateDesmopressinSummaryRelowering : FindingKind.RateDesmopressinSummary, nameSlot),
            Headline = Finding.Of(overcorrected is not null ? FindingKind.RateDesmopressinHeadlineRelowering : FindingKind.RateDesmopressinHeadline, nameSlot).RestingOn([.. matches.Select(m => m.Order.Reference)]),
            Reasons = reasons,
            Steps = allowance?.Describe(context.Options.CorrectionRate) ?? [],
            NextSteps = [Finding.Of(FindingKind.RateDesmopressinNextCheck), Finding.Of(FindingKind.RateDesmopressinNextSenior)],
            Cautions = Cautions(context, allowance),
            Sources = allowance is null ? [] : RateText.Sources(allowance.Limits),
        };
        return new Card
        {
            Content = content,
            Indicator = CardIndicator.Warning,
            Topic = Topic,
            RuleIds = [RuleId, RuleId + ".desmopressin"],
            ResourcesUsed = used.Distinct(StringComparer.Ordinal).ToList(),
        };
    }

    /// <summary>The latest sodium the card placed against the limits, or that none could be used.</summary>
    private static Finding LatestSodium(Allowance? allowance, List<string> used)
    {
        if (allowance is null)
        {
            return Finding.Of(FindingKind.RateOrderNoSodium).Weighted(Weights.DataGap);
        }

        used.Add(allowance.Episode.Latest.Reference);
        return RateText.Cited(FindingKind.RateOrderLatest, allowance.Episode.Latest).Weighted(Weights.Context);
    }

    /// <summary>The patient-specific cautions of an order card: a stale sodium, high risk.</summary>
    internal static IReadOnlyList<Finding> Cautions(DecisionContext context, Allowance? allowance)
    {
        var cautions = new List<Finding>();
        if (allowance is not null && context.Sodium.LatestIsStale)
        {
            cautions.Add(RateText.Stale(context.Sodium.StaleAfterHours));
        }

        if (allowance is not null && RateText.HighRiskCaution(allowance.Factors, allowance.Limits) is { } highRisk)
        {
            cautions.Add(highRisk);
        }

        return cautions;
    }

    private static string Names(List<(MedicationFact Order, MedicationMatch Match)> matches)
    {
        var names = string.Join(", ", matches.Select(m => m.Match.Ingredient).Distinct(StringComparer.OrdinalIgnoreCase));
        return names.Length == 0 ? names : char.ToUpperInvariant(names[0]) + names[1..];
    }

    private static List<Finding> Describe(List<(MedicationFact Order, MedicationMatch Match)> matches, string whyKind, int weight)
        => matches
            .Select(m => Finding.Of(
                FindingKind.RateOrderDrug,
                Slot.Text("ingredient", m.Match.Ingredient),
                Slot.Text("ref", m.Order.Reference),
                Slot.Text("by", m.Match.By),
                Slot.Text("set", m.Match.Set.Label),
                Slot.Phrase("why", Finding.Of(whyKind))).RestingOn(m.Order.Reference).Weighted(weight))
            .ToList();

    private static ConditionFact? LiverDisease(DecisionContext context)
    {
        if (context.Knowledge.Find("condition-cirrhosis") is not { } set)
        {
            return null;
        }

        return context.Request.Facts.Conditions
            .OrderBy(c => c.ResourceId, StringComparer.Ordinal)
            .FirstOrDefault(c => set.MatchesAny(c.Codes) || set.MatchName(c.Text) is not null);
    }
}
