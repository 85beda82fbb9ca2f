using CdsNatremia.Core.Assessment;
using CdsNatremia.Core.Cards;
using CdsNatremia.Core.Engine;
using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Text;

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
        var facts = context.Request.Facts;
        var options = context.Options.Infusion;
        var rateOptions = context.Options.CorrectionRate;
        var weight = facts.Latest(Analyte.BodyWeight);
        string? weightProblem = null;
        if (weight is not null && !(weight.Value >= MinimumPlausibleWeightKg && weight.Value <= MaximumPlausibleWeightKg))
        {
            weightProblem = Invariant.Format(
                $"The latest weight, {Invariant.Number(weight.Value)} kg ({Markdown.Escape(weight.Reference)}), is outside {Invariant.Number(MinimumPlausibleWeightKg)}–{Invariant.Number(MaximumPlausibleWeightKg)} kg and was not used.");
            weight = null;
        }

        var age = facts.AgeAt(context.Request.Now);
        var serum = allowance?.Episode.Latest;

        var steps = new List<string>();
        var findings = new List<string>();
        var used = new List<string>();
        BodyWater? water = null;
        if (weight is not null)
        {
            water = BodyWater.Estimate(weight.Value, facts.Sex, age, options);
            used.Add(weight.Reference);
            steps.Add(Invariant.Format(
                $"**Total body water** = weight {Invariant.Number(weight.Value)} kg ({Markdown.Escape(weight.Reference)}, {context.Display.Time(weight.EffectiveAt)}) × {Invariant.Number(water.Fraction)} ({water.Why}) = **{Invariant.Number(water.Litres)} L**."));
        }
        else
        {
            findings.Add("**No usable body weight** was found, so the effect of the ordered volume on this patient is not predicted. Record a weight to get it.");
            if (weightProblem is not null)
            {
                findings.Add(weightProblem);
            }
        }

        if (serum is not null)
        {
            used.Add(serum.Reference);
            findings.Add("Serum sodium used: " + Cite.Result(serum, context.Display));
            if (context.Sodium.LatestIsStale)
            {
                findings.Add(Invariant.Format(
                    $"This sodium is {RateText.Hours(context.Sodium.LatestAgeHours ?? 0)} h old (older than {RateText.Hours(context.Sodium.StaleAfterHours)} h): the prediction starts from it, so a fresh sodium gives a truer figure."));
            }
        }
        else
        {
            findings.Add("**No usable sodium result** was found, so no prediction is made.");
        }

        double total = 0;
        var predictedAny = false;
        var unknownVolume = false;
        foreach (var (order, recognition) in orders)
        {
            used.Add(order.Reference);
            var name = Markdown.Escape(order.Text ?? order.Ingredients.Select(i => i.Text).FirstOrDefault(t => t is not null) ?? order.Reference);
            var route = recognition.RouteStated ? Markdown.Escape(order.Route) : "route not stated (intravenous assumed)";
            var millilitres = order.VolumeMilliliters is { } v && v > 0 && double.IsFinite(v) ? v : (double?)null;
            var volume = millilitres is { } ml ? Invariant.Format($"{Invariant.Number(ml)} mL")
                : order.VolumeMilliliters is { } bad ? Invariant.Format($"volume {Invariant.Number(bad)} mL not usable") : "volume not stated";
            if (recognition.Infusate is not { } infusate)
            {
                steps.Add($"**{name}** ({Markdown.Escape(order.Reference)}; {route}; {volume}): recognised as an intravenous sodium chloride fluid ({Markdown.Escape(recognition.How)}) but its concentration could not be read, so no prediction is made for it.");
                continue;
            }

            var head = Invariant.Format($"**{name}** ({Markdown.Escape(order.Reference)}; {route}; {volume}) read as {infusate.Name} ({Markdown.Escape(recognition.How)}): infusate sodium {Invariant.Number(infusate.Sodium)} + potassium {Invariant.Number(infusate.Potassium)} mmol/L");
            if (serum is null)
            {
                steps.Add(head + "; no prediction without a usable sodium.");
                continue;
            }

            if (water is null)
            {
                var example = BodyWater.Estimate(options.ExampleWeightKg, facts.Sex, age, options);
                var examplePerLitre = AdrogueMadias.ChangePerLitre(infusate.Sodium, infusate.Potassium, serum.Value, example.Litres);
                steps.Add(head + Invariant.Format(
                    $". *Example only, not this patient's weight*: for an example weight of {Invariant.Number(options.ExampleWeightKg)} kg (water {Invariant.Number(example.Fraction)} × {Invariant.Number(options.ExampleWeightKg)} = {Invariant.Number(example.Litres)} L), one litre would change sodium by ({Invariant.Number(infusate.Sodium)} + {Invariant.Number(infusate.Potassium)} − {Invariant.Number(serum.Value)}) / ({Invariant.Number(example.Litres)} + 1) = {Signed(examplePerLitre)} mmol/L. A lighter patient would change more."));
                continue;
            }

            var perLitre = AdrogueMadias.ChangePerLitre(infusate.Sodium, infusate.Potassium, serum.Value, water.Litres);
            var text = head + Invariant.Format(
                $". **Per litre** = ({Invariant.Number(infusate.Sodium)} + {Invariant.Number(infusate.Potassium)} − {Invariant.Number(serum.Value)}) / ({Invariant.Number(water.Litres)} + 1) = **{Signed(perLitre)} mmol/L**");
            if (millilitres is { } ordered)
            {
                var change = AdrogueMadias.ChangeForVolume(perLitre, ordered);
                total += change;
                predictedAny = true;
                text += Invariant.Format($"; **for {Invariant.Number(ordered)} mL** = {Signed(perLitre)} × {Invariant.Number(ordered)} / 1000 = **{Signed(change)} mmol/L**");
            }
            else
            {
                unknownVolume = true;
                text += "; the order states no usable volume, so only the per-litre figure is given";
            }

            steps.Add(text + ".");
        }

        var mayFall = CompareUrine(context, orders, serum, findings, used);
        var indicator = CardIndicator.Info;
        string verdict;
        if (allowance is not null && predictedAny)
        {
            var remaining = Math.Max(0, allowance.Remaining);
            findings.Add(Invariant.Format(
                $"Predicted change from {(orders.Count > 1 ? "these orders together" : "this order")}: **{Signed(total)} mmol/L**; allowance left now: **{RateText.Mmol(remaining)}** ({allowance.Binding.LimitLabel})."));
            if (allowance.Binding.Status == RateStatus.AtOrPast)
            {
                indicator = CardIndicator.Critical;
                verdict = "limit already reached";
            }
            else if (total > remaining)
            {
                indicator = CardIndicator.Critical;
                verdict = Invariant.Format($"would exceed the {RateText.Mmol(remaining)} left");
            }
            else if (total < 0)
            {
                // A fluid whose sodium plus potassium is below the serum sodium lowers sodium further (Adrogué–Madias numerator).
                indicator = CardIndicator.Warning;
                verdict = Invariant.Format($"predicted to lower sodium further ({Signed(total)} mmol/L)");
            }
            else if (total > 0 && total >= remaining - options.ApproachingWithinMmolPerL)
            {
                indicator = CardIndicator.Warning;
                verdict = Invariant.Format($"close to the {RateText.Mmol(remaining)} left");
            }
            else
            {
                verdict = Invariant.Format($"within the {RateText.Mmol(remaining)} left");
            }
        }
        else
        {
            verdict = weight is null ? "no weight, no prediction for the volume" : unknownVolume ? "per litre only" : "no prediction";
        }

        if (indicator == CardIndicator.Info
            && (orders.Any(o => o.Recognition.Infusate?.Kind == InfusateKind.Saline3) || allowance?.Binding.Status == RateStatus.Approaching))
        {
            indicator = CardIndicator.Warning;
        }

        if (indicator == CardIndicator.Critical && context.Sodium.LatestIsStale)
        {
            // A stale sodium calls for a recheck first: at most a warning, never a critical interruption (the stale note is in the findings).
            indicator = CardIndicator.Warning;
        }

        if (mayFall && indicator != CardIndicator.Critical)
        {
            // Desalination (Steele et al. 1997): the prediction's sign cannot be trusted, so its verdict is not given.
            indicator = CardIndicator.Warning;
            verdict = "urine more concentrated than the fluid: sodium may fall";
        }

        var first = orders[0].Recognition.Infusate?.Name ?? "sodium chloride";
        var summary = Summary.Fit(mayFall && indicator != CardIndicator.Critical
            ? predictedAny
                ? Invariant.Format($"{Capital(first)} order: urine more concentrated than the fluid, so sodium may fall; the predicted {Signed(total)} mmol/L does not hold.")
                : Invariant.Format($"{Capital(first)} order: urine more concentrated than the fluid, so sodium may fall (see detail).")
            : predictedAny
                ? Invariant.Format($"{Capital(first)} order: predicted sodium change {Signed(total)} mmol/L; {verdict}.")
                : Invariant.Format($"{Capital(first)} order: {verdict} (see detail)."));

        var detail = new DetailWriter()
            .Paragraph(Invariant.Format($"**Infusion effect prediction** as of {context.Display.Time(context.Request.Now)} (Adrogué–Madias formula). Advisory only."))
            .Bullets("Findings", findings)
            .Numbered("Computation (with its inputs)", steps)
            .Bullets("Where the correction stands (limits)", allowance?.Describe(rateOptions, context.Display) ?? [])
            .Bullets("Points clinicians usually weigh (under local protocol; not orders)",
            [
                "The formula assumes no other gain or loss of water or salt: urine output, especially a large dilute urine output once the cause is removed, can make the real rise larger than predicted.",
                "Checking sodium after the infusion, or during it for hypertonic saline, at the interval local protocol sets.",
                "Whether the ordered volume and rate fit the correction limits; discuss with a senior clinician when the prediction is near or above the allowance.",
            ]);
        CardFooter.Write(detail, context,
        [
            "Adrogué–Madias formula (Adrogué & Madias, N Engl J Med 2000;342:1581); total body water fractions and infusate sodium as on the project reference sheet (secondary sources).",
            "Sodium falling on near-isotonic saline when the urine is more concentrated than the fluid (desalination): " + UrineVersusInfusate.Source + ".",
            .. allowance is null ? [] : RateText.Sources(allowance.Limits),
        ]);

        return new Card
        {
            Summary = summary,
            Indicator = indicator,
            Detail = detail.ToString(),
            Topic = Topic,
            RuleIds = [RuleId],
            ResourcesUsed = used.Distinct(StringComparer.Ordinal).ToList(),
        };
    }

    /// <summary>
    /// Compares the urine with each ordered fluid (<see cref="UrineVersusInfusate"/>) and adds what it found; true when for
    /// some fluid the urine is more concentrated, so the predicted rise does not hold and sodium may fall. Without urine data
    /// the card says that the prediction assumes no urine losses.
    /// </summary>
    private static bool CompareUrine(DecisionContext context, List<(MedicationFact Order, InfusateRecognition Recognition)> orders, LabResult? serum, List<string> findings, List<string> used)
    {
        var urine = UrineVersusInfusate.Find(context, serum?.EffectiveAt ?? context.Request.Now);
        if (!urine.HasData)
        {
            findings.Add("**The prediction assumes no urine losses.** No recent urine osmolality or urine sodium was found to check it: if the urine is more concentrated than the fluid (urine osmolality above the fluid's, or urine sodium + potassium above the fluid's sodium + potassium), sodium can fall instead of rising (desalination, Steele et al. 1997). Urine osmolality, sodium and potassium settle it.");
            return false;
        }

        used.AddRange(new[] { urine.Osmolality, urine.Sodium, urine.Potassium }.OfType<LabResult>().Select(r => r.Reference));
        var mayFall = false;
        foreach (var infusate in orders.Select(o => o.Recognition.Infusate).OfType<Infusate>().DistinctBy(i => i.Kind))
        {
            var (fall, lines) = urine.Compare(infusate, context.Display);
            mayFall |= fall;
            var compared = string.Join("; ", lines);
            findings.Add(fall
                ? Invariant.Format($"**The prediction does not hold for {infusate.Name}: sodium may fall.** The urine is more concentrated than the fluid: {compared}. The kidney excretes the fluid's salt in less water than came with it and keeps the rest as free water (desalination, Steele et al. 1997).")
                : Invariant.Format($"Urine compared with {infusate.Name}: {compared}. The urine is not more concentrated than the fluid, so the predicted direction holds; urine losses still change the size of the change."));
        }

        return mayFall;
    }

    private static string Signed(double value)
    {
        var rounded = Math.Round(value, 1);
        return rounded > 0 ? "+" + Invariant.Number(rounded) : Invariant.Number(rounded);
    }

    private static string Capital(string text) => text.Length == 0 ? text : char.ToUpperInvariant(text[0]) + text[1..];
}
