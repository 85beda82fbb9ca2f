using CdsNatremia.Core.Assessment;
using CdsNatremia.Core.Cards;
using CdsNatremia.Core.Engine;
using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Findings;

namespace CdsNatremia.Core.CorrectionRate;

/// <summary>
/// On order-select and order-sign, predicts how far a draft order of intravenous sodium chloride (0.9%, 3%, 0.45%) or
/// Ringer's lactate would move the serum sodium (Adrogué–Madias, per litre and for the ordered volume, with total body
/// water from the latest weight, age and sex), and compares the rise with what the correction limits still allow.
/// One card for all such orders. Without a usable weight it says so and shows the per-litre figure only for a labelled
/// example weight; it never uses an invented weight as the patient's. No card when the patient's sodium was never low
/// in the current episode (a routine fluid order for a patient with normal sodium is not this service's business).
/// </summary>
public sealed class InfusionPredictionCardProducer : ICardProducer
{
    /// <summary>Topic code of the card (card-topic CodeSystem).</summary>
    public const string Topic = "infusion-prediction";

    /// <summary>Lightest weight, kg, the prediction uses; below it the weight is taken as an entry error (common practice: a plausibility check).</summary>
    public const double MinimumPlausibleWeightKg = 1;

    /// <summary>Heaviest weight, kg, the prediction uses (common practice: a plausibility check).</summary>
    public const double MaximumPlausibleWeightKg = 400;

    /// <inheritdoc />
    public string RuleId => "sodium.infusion-prediction";

    /// <inheritdoc />
    public IEnumerable<Card> Produce(DecisionContext context)
    {
        Guard.NotNull(context, nameof(context));
        var options = context.Options.Infusion;
        var fluids = context.Knowledge.Find(InfusateRecognizer.FluidSetId);
        var orders = DraftOrders.Considered(context.Request)
            .Select(o => (Order: o, Recognition: InfusateRecognizer.Recognize(o, fluids, options)))
            .Where(x => x.Recognition is not null)
            .Select(x => (x.Order, Recognition: x.Recognition!))
            .ToList();
        var allowance = Allowance.For(context);
        if (orders.Count == 0 || !Allowance.Concerns(context, allowance))
        {
            return [];
        }

        return [Build(context, orders, allowance)];
    }

    private Card Build(DecisionContext context, List<(MedicationFact Order, InfusateRecognition Recognition)> orders, Allowance? allowance)
    {
        var prediction = Decide(context, orders, allowance);
        return new Card
        {
            Content = Content(prediction, context),
            Indicator = prediction.Indicator,
            Topic = Topic,
            RuleIds = [RuleId],
            ResourcesUsed = prediction.Used,
        };
    }

    /// <summary>What the prediction says about the orders before any wording: the numbers, the verdict and the indicator.</summary>
    private static Prediction Decide(DecisionContext context, List<(MedicationFact Order, InfusateRecognition Recognition)> orders, Allowance? allowance)
    {
        var facts = context.Request.Facts;
        var options = context.Options.Infusion;
        var weight = facts.Latest(Analyte.BodyWeight);
        LabResult? implausible = null;
        if (weight is not null && !(weight.Value >= MinimumPlausibleWeightKg && weight.Value <= MaximumPlausibleWeightKg))
        {
            implausible = weight;
            weight = null;
        }

        var age = facts.AgeAt(context.Request.Now);
        var serum = allowance?.Episode.Latest;
        var water = weight is null ? null : BodyWater.Estimate(weight.Value, facts.Sex, age, options);
        var used = new List<string>();
        if (weight is not null)
        {
            used.Add(weight.Reference);
        }

        if (serum is not null)
        {
            used.Add(serum.Reference);
        }

        var predictions = new List<OrderPrediction>();
        foreach (var (order, recognition) in orders)
        {
            used.Add(order.Reference);
            var millilitres = order.VolumeMilliliters is { } v && v > 0 && double.IsFinite(v) ? v : (double?)null;
            var prediction = new OrderPrediction(order, recognition, millilitres);
            if (recognition.Infusate is { } infusate && serum is not null)
            {
                if (water is null)
                {
                    var example = BodyWater.Estimate(options.ExampleWeightKg, facts.Sex, age, options);
                    prediction = prediction with { Example = example, PerLitre = AdrogueMadias.ChangePerLitre(infusate.Sodium, infusate.Potassium, serum.Value, example.Litres) };
                }
                else
                {
                    var perLitre = AdrogueMadias.ChangePerLitre(infusate.Sodium, infusate.Potassium, serum.Value, water.Litres);
                    prediction = prediction with
                    {
                        PerLitre = perLitre,
                        Change = millilitres is { } ordered ? AdrogueMadias.ChangeForVolume(perLitre, ordered) : null,
                    };
                }
            }

            predictions.Add(prediction);
        }

        var total = predictions.Sum(p => p.Change ?? 0);
        var predictedAny = predictions.Any(p => p.Change is not null);
        var unknownVolume = predictions.Any(p => p.PerLitre is not null && p.Example is null && p.Change is null);

        // Urine against each fluid (desalination): when the urine is more concentrated, the predicted rise does not hold.
        var urine = UrineVersusInfusate.Find(context, serum?.EffectiveAt ?? context.Request.Now);
        var comparisons = new List<UrineComparison>();
        if (urine.HasData)
        {
            used.AddRange(new[] { urine.Osmolality, urine.Sodium, urine.Potassium }.OfType<LabResult>().Select(r => r.Reference));
            foreach (var infusate in orders.Select(o => o.Recognition.Infusate).OfType<Infusate>().DistinctBy(i => i.Kind))
            {
                var (fall, lines) = urine.Compare(infusate);
                comparisons.Add(new UrineComparison(infusate, fall, lines));
            }
        }

        var mayFall = comparisons.Any(c => c.MayFall);
        var indicator = CardIndicator.Info;
        Verdict verdict;
        var remaining = allowance is null ? 0 : Math.Max(0, allowance.Remaining);
        if (allowance is not null && predictedAny)
        {
            if (allowance.Binding.Status == RateStatus.AtOrPast)
            {
                indicator = CardIndicator.Critical;
                verdict = Verdict.LimitReached;
            }
            else if (total > remaining)
            {
                indicator = CardIndicator.Critical;
                verdict = Verdict.WouldExceed;
            }
            else if (total < 0)
            {
                // A fluid whose sodium plus potassium is below the serum sodium lowers sodium further (Adrogué–Madias numerator).
                indicator = CardIndicator.Warning;
                verdict = Verdict.Lowers;
            }
            else if (total > 0 && total >= remaining - options.ApproachingWithinMmolPerL)
            {
                indicator = CardIndicator.Warning;
                verdict = Verdict.Close;
            }
            else
            {
                verdict = Verdict.Within;
            }
        }
        else
        {
            verdict = weight is null ? Verdict.NoWeight : unknownVolume ? Verdict.PerLitreOnly : Verdict.NoPrediction;
        }

        if (indicator == CardIndicator.Info
            && (orders.Any(o => o.Recognition.Infusate?.Kind == InfusateKind.Saline3) || allowance?.Binding.Status == RateStatus.Approaching))
        {
            indicator = CardIndicator.Warning;
        }

        var stale = serum is not null && context.Sodium.LatestIsStale;
        if (indicator == CardIndicator.Critical && context.Sodium.LatestIsStale)
        {
            // A stale sodium calls for a recheck first: at most a warning, never a critical interruption (the stale caution is on the card).
            indicator = CardIndicator.Warning;
        }

        // Desalination (Steele et al. 1997): the prediction's sign cannot be trusted, so its verdict is not given.
        var mayFallShown = mayFall && indicator != CardIndicator.Critical;
        if (mayFallShown)
        {
            indicator = CardIndicator.Warning;
        }

        return new Prediction(weight, implausible, water, serum, stale, predictions, total, predictedAny, comparisons, urine.HasData, mayFallShown, verdict, remaining, indicator, allowance)
        {
            Used = used.Distinct(StringComparer.Ordinal).ToList(),
        };
    }

    /// <summary>The findings of a prediction (the numbers as slots); the engine words them.</summary>
    private static CardContent Content(Prediction p, DecisionContext context)
    {
        var options = context.Options.Infusion;
        var reasons = new List<Finding>();
        var steps = new List<Finding>();
        var cautions = new List<Finding>();
        if (p.Water is { } water)
        {
            var weight = p.Weight!;
            steps.Add(Finding.Of(
                FindingKind.RateInfusionStepWater,
                Slot.Number("weight", weight.Value),
                Slot.Text("ref", weight.Reference),
                Slot.Time("time", weight.EffectiveAt),
                Slot.Number("fraction", water.Fraction),
                Slot.Phrase("why", water.Why),
                Slot.Number("litres", water.Litres)).RestingOn(weight.Reference));
        }
        else
        {
            reasons.Add(Finding.Of(FindingKind.RateInfusionNoWeight).Weighted(Weights.DataGap));
            if (p.ImplausibleWeight is { } bad)
            {
                reasons.Add(Finding.Of(
                    FindingKind.RateInfusionWeightImplausible,
                    Slot.Number("weight", bad.Value),
                    Slot.Text("ref", bad.Reference),
                    Slot.Number("min", MinimumPlausibleWeightKg),
                    Slot.Number("max", MaximumPlausibleWeightKg)).RestingOn(bad.Reference).Weighted(Weights.DataGap));
            }
        }

        if (p.Serum is { } serum)
        {
            reasons.Add(RateText.Cited(FindingKind.RateInfusionSerum, serum).Weighted(Weights.Context));
            if (p.Stale)
            {
                Slot[] ages = [RateText.Hours("age", context.Sodium.LatestAgeHours ?? 0), RateText.Hours("stale", context.Sodium.StaleAfterHours)];
                cautions.Add(Finding.Of(FindingKind.RateInfusionSerumStale, ages).RestingOn(serum.Reference));
                steps.Add(Finding.Of(FindingKind.RateInfusionSerumStaleStep, ages).RestingOn(serum.Reference));
            }
        }
        else
        {
            reasons.Add(Finding.Of(FindingKind.RateInfusionNoSerum).Weighted(Weights.DataGap));
        }

        steps.AddRange(p.Orders.Select(o => OrderStep(o, p, options)));

        if (p.Allowance is { } allowance && p.PredictedAny)
        {
            reasons.Add(Finding.Of(
                p.Orders.Count > 1 ? FindingKind.RateInfusionPredictedMany : FindingKind.RateInfusionPredictedOne,
                RateText.Signed("change", p.Total),
                Slot.Number("remaining", p.Remaining),
                Slot.Phrase("label", allowance.Binding.LimitLabel)).Weighted(Weights.Culprit));
        }

        if (!p.UrineChecked)
        {
            reasons.Add(Finding.Of(FindingKind.RateInfusionUrineNone).Weighted(Weights.Missing));
        }

        foreach (var comparison in p.Urine)
        {
            var compared = Slot.List("compared", comparison.Lines.Select(l => (SlotValue)new PhraseValue(l)), "; ");
            var name = Slot.Phrase("fluid", comparison.Infusate.Name);
            if (comparison.MayFall)
            {
                reasons.Add(Finding.Of(FindingKind.RateInfusionUrineMayFall, name, compared).Weighted(Weights.Urgent));
                steps.Add(Finding.Of(FindingKind.RateInfusionUrineMayFallWhy, name));
            }
            else
            {
                reasons.Add(Finding.Of(FindingKind.RateInfusionUrineHolds, name, compared).Weighted(Weights.Cause));
            }
        }

        if (p.Allowance is { } a)
        {
            steps.AddRange(a.Describe(context.Options.CorrectionRate));
            if (RateText.HighRiskCaution(a.Factors, a.Limits) is { } highRisk)
            {
                cautions.Add(highRisk);
            }
        }

        var fluid = Slot.Phrase("fluid", p.Orders[0].Recognition.Infusate?.NameAtStart ?? Finding.Of(FindingKind.RateInfusateUnreadStart));
        var change = RateText.Signed("change", p.Total);
        var verdict = Slot.Phrase("verdict", VerdictOf(p));
        var (summary, headline) = p.MayFall
            ? (Finding.Of(p.PredictedAny ? FindingKind.RateInfusionSummaryMayFallPredicted : FindingKind.RateInfusionSummaryMayFall, fluid, change),
               Finding.Of(FindingKind.RateInfusionHeadlineMayFall, fluid))
            : p.PredictedAny
                ? (Finding.Of(FindingKind.RateInfusionSummaryPredicted, fluid, change, verdict), Finding.Of(FindingKind.RateInfusionHeadlinePredicted, fluid, change, verdict))
                : (Finding.Of(FindingKind.RateInfusionSummaryUnpredicted, fluid, verdict), Finding.Of(FindingKind.RateInfusionHeadlineUnpredicted, fluid, verdict));

        var next = new List<Finding>();
        if (p.Water is null)
        {
            next.Add(Finding.Of(FindingKind.RateInfusionNextWeight));
        }

        // Near or above the allowance, the fit with the limits comes first; otherwise the recheck.
        var fit = Finding.Of(FindingKind.RateInfusionNextFit);
        var recheck = Finding.Of(FindingKind.RateInfusionNextRecheck);
        next.AddRange(p.Verdict is Verdict.LimitReached or Verdict.WouldExceed or Verdict.Close ? [fit, recheck] : [recheck, fit]);
        next.Add(Finding.Of(FindingKind.RateInfusionNextUrine));

        return new CardContent
        {
            Summary = summary,
            Headline = headline.RestingOn([.. p.Orders.Select(o => o.Order.Reference)]),
            Reasons = reasons,
            Steps = steps,
            NextSteps = next,
            Cautions = cautions,
            Sources =
            [
                AdrogueMadiasSource,
                DesalinationSource + UrineVersusInfusate.Source + ".",
                .. p.Allowance is null ? [] : RateText.Sources(p.Allowance.Limits),
            ],
        };
    }

    /// <summary>The Adrogué–Madias citation (source data).</summary>
    private const string AdrogueMadiasSource = "Adrogué–Madias formula (Adrogué & Madias, N Engl J Med 2000;342:1581); total body water fractions and infusate sodium as on the project reference sheet (secondary sources).";

    /// <summary>The desalination citation's lead (source data).</summary>
    private const string DesalinationSource = "Sodium falling on near-isotonic saline when the urine is more concentrated than the fluid (desalination): ";

    private static Finding VerdictOf(Prediction p) => p.Verdict switch
    {
        Verdict.LimitReached => Finding.Of(FindingKind.RateInfusionVerdictLimitReached),
        Verdict.WouldExceed => Finding.Of(FindingKind.RateInfusionVerdictExceed, Slot.Number("remaining", p.Remaining)),
        Verdict.Lowers => Finding.Of(FindingKind.RateInfusionVerdictLowers, RateText.Signed("change", p.Total)),
        Verdict.Close => Finding.Of(FindingKind.RateInfusionVerdictClose, Slot.Number("remaining", p.Remaining)),
        Verdict.Within => Finding.Of(FindingKind.RateInfusionVerdictWithin, Slot.Number("remaining", p.Remaining)),
        Verdict.NoWeight => Finding.Of(FindingKind.RateInfusionVerdictNoWeight),
        Verdict.PerLitreOnly => Finding.Of(FindingKind.RateInfusionVerdictPerLitre),
        _ => Finding.Of(FindingKind.RateInfusionVerdictNone),
    };

    /// <summary>One order's computation step, with its inputs.</summary>
    private static Finding OrderStep(OrderPrediction o, Prediction p, InfusionOptions options)
    {
        var order = o.Order;
        var name = Slot.Text("name", order.Text ?? order.Ingredients.Select(i => i.Text).FirstOrDefault(t => t is not null) ?? order.Reference);
        var route = o.Recognition.RouteStated ? Slot.Text("route", order.Route ?? string.Empty) : Slot.Phrase("route", Finding.Of(FindingKind.RateInfusionRouteNotStated));
        var volume = Slot.Phrase("volume", o.Millilitres is { } ml ? Finding.Of(FindingKind.RateInfusionVolume, Slot.Number("ml", ml))
            : order.VolumeMilliliters is { } bad ? Finding.Of(FindingKind.RateInfusionVolumeUnusable, Slot.Number("ml", bad))
            : Finding.Of(FindingKind.RateInfusionVolumeNone));
        var reference = Slot.Text("ref", order.Reference);
        if (o.Recognition.Infusate is not { } infusate)
        {
            return Finding.Of(FindingKind.RateInfusionStepUnread, name, reference, route, volume, Slot.Phrase("how", o.Recognition.How)).RestingOn(order.Reference);
        }

        Slot[] content = [Slot.Number("sodium", infusate.Sodium), Slot.Number("potassium", infusate.Potassium)];
        Finding tail;
        if (p.Serum is not { } serum || o.PerLitre is not { } perLitre)
        {
            tail = Finding.Of(FindingKind.RateInfusionPredictionNoSerum);
        }
        else if (o.Example is { } example)
        {
            tail = Finding.Of(
                FindingKind.RateInfusionPredictionExample,
                [.. content, Slot.Number("weight", options.ExampleWeightKg), Slot.Number("fraction", example.Fraction), Slot.Number("litres", example.Litres), Slot.Number("serum", serum.Value), RateText.Signed("perLitre", perLitre)]);
        }
        else
        {
            Slot[] formula = [.. content, Slot.Number("serum", serum.Value), Slot.Number("litres", p.Water!.Litres), RateText.Signed("perLitre", perLitre)];
            tail = o.Change is { } change && o.Millilitres is { } ordered
                ? Finding.Of(FindingKind.RateInfusionPredictionVolume, [.. formula, Slot.Number("ml", ordered), RateText.Signed("change", change)])
                : Finding.Of(FindingKind.RateInfusionPredictionPerLitre, formula);
        }

        return Finding.Of(
            FindingKind.RateInfusionStepOrder,
            [name, reference, route, volume, Slot.Phrase("fluid", infusate.Name), Slot.Phrase("how", o.Recognition.How), .. content, Slot.Phrase("prediction", tail)]).RestingOn(order.Reference);
    }

    /// <summary>An order's prediction: per litre (for the patient's water, or for an example weight), and for its volume.</summary>
    private sealed record OrderPrediction(MedicationFact Order, InfusateRecognition Recognition, double? Millilitres)
    {
        public double? PerLitre { get; init; }

        public double? Change { get; init; }

        public BodyWater? Example { get; init; }
    }

    /// <summary>The urine compared with one fluid.</summary>
    private sealed record UrineComparison(Infusate Infusate, bool MayFall, IReadOnlyList<Finding> Lines);

    private enum Verdict
    {
        LimitReached,
        WouldExceed,
        Lowers,
        Close,
        Within,
        NoWeight,
        PerLitreOnly,
        NoPrediction,
    }

    /// <summary>Everything the card decided, before wording.</summary>
    private sealed record Prediction(
        LabResult? Weight,
        LabResult? ImplausibleWeight,
        BodyWater? Water,
        LabResult? Serum,
        bool Stale,
        IReadOnlyList<OrderPrediction> Orders,
        double Total,
        bool PredictedAny,
        IReadOnlyList<UrineComparison> Urine,
        bool UrineChecked,
        bool MayFall,
        Verdict Verdict,
        double Remaining,
        CardIndicator Indicator,
        Allowance? Allowance)
    {
        public IReadOnlyList<string> Used { get; init; } = [];
    }
}
