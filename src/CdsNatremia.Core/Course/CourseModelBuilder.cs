using CdsNatremia.Core.CorrectionRate;
using CdsNatremia.Core.Drugs;
using CdsNatremia.Core.Engine;
using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Knowledge;
using CdsNatremia.Core.Sodium;
using CdsNatremia.Core.Workup;

namespace CdsNatremia.Core.Course;

/// <summary>
/// Builds the <see cref="CourseModel"/> from the same context the rules read: the sodium series, the severity thresholds
/// and correction limits in the options, the drug-cause analysis and the infusate recognition. No rule is run twice for
/// a different answer: the nadir is <see cref="CorrectionEpisode.Find"/>'s, the high-risk factors are
/// <see cref="HighRiskFactors.Find"/>'s, the drugs are <see cref="DrugCauseAnalysis.Find"/>'s. Pure.
/// </summary>
public static class CourseModelBuilder
{
    /// <summary>Hours shown before the first and after the last item on the time axis.</summary>
    public const double MarginHours = 6;

    /// <summary>A drug started more than this many days before the first sodium is drawn from the axis start (its start is in the table).</summary>
    public const double DrugLookBackDays = 60;

    /// <summary>Builds the model.</summary>
    public static CourseModel Build(DecisionContext context)
    {
        Guard.NotNull(context, nameof(context));
        var facts = context.Request.Facts;
        var thresholds = context.Thresholds;
        var points = context.Sodium.Results
            .Select(r => new CoursePoint(r.EffectiveAt, r.Value, r.Reference, r.IsPreliminary, thresholds.Classify(r.Value)))
            .ToList();
        var bounds = facts.BoundedLabs
            .Where(l => l.Analyte == Analyte.Sodium && l.Comparator is not null)
            .OrderBy(l => l.EffectiveAt)
            .ThenBy(l => l.ResourceId, StringComparer.Ordinal)
            .Select(l => new CourseBound(l.EffectiveAt, l.Value, l.Comparator!.Value, l.Reference, Facts.Bounds.Describe(l)))
            .ToList();
        var setAside = facts.SetAside
            .Where(s => s.Analyte == Analyte.Sodium && s.State != FactState.NotThisPatient)
            .OrderBy(s => s.At ?? DateTimeOffset.MaxValue)
            .ThenBy(s => s.Reference, StringComparer.Ordinal)
            .Select(s => new CourseSetAside(s.At, s.What, s.Reason, s.Reference, s.State))
            .ToList();

        var (envelope, note) = Envelope(context);
        var drugs = Drugs(context);
        var orders = Orders(context);

        var times = points.Select(p => p.At)
            .Concat(bounds.Select(b => b.At))
            .Concat(setAside.Select(s => s.At).OfType<DateTimeOffset>())
            .Concat(orders.Select(o => o.At).OfType<DateTimeOffset>())
            .ToList();
        var first = times.Count > 0 ? times.Min() : context.Request.Now.AddDays(-1);
        var earliestDrug = first.AddDays(-DrugLookBackDays);
        times.AddRange(drugs.Select(d => d.Start).OfType<DateTimeOffset>().Where(s => s >= earliestDrug));
        times.AddRange(drugs.Select(d => d.End).OfType<DateTimeOffset>().Where(e => e >= earliestDrug));
        if (envelope is not null)
        {
            times.Add(envelope.Lines.Max(l => l.To));
        }

        var from = (times.Count > 0 ? times.Min() : first).AddHours(-MarginHours);
        var to = (times.Count > 0 ? times.Max() : context.Request.Now).AddHours(MarginHours);
        return new CourseModel
        {
            Points = points,
            Bounds = bounds,
            SetAside = setAside,
            AboutAnotherPatientCount = facts.AboutAnotherPatientCount,
            Bands = Bands(thresholds),
            BandSource = thresholds.Source,
            Envelope = envelope,
            EnvelopeNote = note,
            Drugs = drugs,
            Orders = orders,
            Now = context.Request.Now,
            From = from,
            To = to,
        };
    }

    /// <summary>The bands lowest first; the lowest band is drawn from 100 mmol/L (the chart's floor).</summary>
    public static IReadOnlyList<CourseBand> Bands(SeverityThresholds thresholds)
    {
        Guard.NotNull(thresholds, nameof(thresholds));
        const double Floor = 100;
        return
        [
            new(SeverityBand.Profound, thresholds.NameOf(SeverityBand.Profound), Math.Min(Floor, thresholds.ModerateFrom), thresholds.ModerateFrom, thresholds.RangeOf(SeverityBand.Profound)),
            new(SeverityBand.Moderate, thresholds.NameOf(SeverityBand.Moderate), thresholds.ModerateFrom, thresholds.MildFrom, thresholds.RangeOf(SeverityBand.Moderate)),
            new(SeverityBand.Mild, thresholds.NameOf(SeverityBand.Mild), thresholds.MildFrom, thresholds.NormalFrom, thresholds.RangeOf(SeverityBand.Mild)),
            new(SeverityBand.Normal, thresholds.NameOf(SeverityBand.Normal), thresholds.NormalFrom, thresholds.NormalTo, thresholds.RangeOf(SeverityBand.Normal)),
        ];
    }

    /// <summary>
    /// The envelope from the episode's nadir: the first-24-h and 48-h limits, the high-risk limits when a high-risk
    /// factor is found, and the minimum goal by 24 h, each a line at nadir + rise. None when there is no usable sodium,
    /// when the nadir is not low, or when the low sodium is not hypotonic (the limits do not apply, as on the cards).
    /// </summary>
    public static (CorrectionEnvelope? Envelope, string? Note) Envelope(DecisionContext context)
    {
        Guard.NotNull(context, nameof(context));
        var options = context.Options.CorrectionRate;
        if (CorrectionEpisode.Find(context.Sodium, options) is not { } episode)
        {
            return (null, "No usable sodium result, so there is no nadir to draw correction limits from.");
        }

        var nadir = episode.Nadir;
        if (nadir.Value >= context.Thresholds.NormalFrom)
        {
            return (null, "The lowest recent sodium is not low, so no correction limits are drawn.");
        }

        if (TonicityAssessment.From(context).Band is Tonicity.Isotonic or Tonicity.Hypertonic)
        {
            return (null, "The low sodium is not hypotonic, so correction limits do not apply.");
        }

        var limits = options.Resolve();
        var lowest = HighRiskFactors.LowestOfLowStretch(context.Sodium, nadir, context.Thresholds.NormalFrom);
        var factors = HighRiskFactors.Find(context.Request.Facts, lowest, context.Knowledge, options);
        var highRisk = factors.Count > 0;
        var start = nadir.EffectiveAt;
        var day = start.AddHours(24);
        var twoDays = start.AddHours(48);
        var lines = new List<EnvelopeLine>
        {
            Line(EnvelopeLineKind.FirstDayLimit, start, day, nadir.Value, limits.FirstDay, !highRisk, "limit for the first 24 h"),
            Line(EnvelopeLineKind.TwoDayLimit, day, twoDays, nadir.Value, limits.TwoDays, !highRisk, "limit for the first 48 h"),
        };
        if (highRisk)
        {
            lines.Add(Line(EnvelopeLineKind.HighRiskDayLimit, start, day, nadir.Value, limits.HighRiskDay, true, "high-risk limit for 24 h"));
            lines.Add(Line(EnvelopeLineKind.HighRiskTwoDayLimit, day, twoDays, nadir.Value, limits.HighRiskTwoDays, true, "high-risk limit for 48 h"));
        }

        lines.Add(Line(EnvelopeLineKind.MinimumGoal, start, day, nadir.Value, limits.MinimumGoal(highRisk), true, "minimum goal by 24 h"));
        var nadirPoint = new CoursePoint(nadir.EffectiveAt, nadir.Value, nadir.Reference, nadir.IsPreliminary, context.Thresholds.Classify(nadir.Value));
        return (new CorrectionEnvelope(nadirPoint, highRisk, factors.Select(f => FactorWords(f.Kind)).Distinct(StringComparer.Ordinal).ToList(), lines, limits.Name, limits.Source), null);
    }

    private static EnvelopeLine Line(EnvelopeLineKind kind, DateTimeOffset from, DateTimeOffset to, double nadir, double rise, bool governs, string label)
        => new(kind, from, to, rise, nadir + rise, governs, label);

    private static string FactorWords(string kind) => kind switch
    {
        "nadir" => "very low sodium in this low stretch",
        "potassium" => "low potassium",
        "alcohol" => "alcohol use disorder",
        "malnutrition" => "malnutrition",
        "liver" => "advanced liver disease",
        _ => kind,
    };

    /// <summary>The implicated drugs (statements, orders and recently stopped records), as the drug-cause rule finds them.</summary>
    public static IReadOnlyList<DrugExposure> Drugs(DecisionContext context)
    {
        Guard.NotNull(context, nameof(context));
        var facts = context.Request.Facts;
        var implicated = DrugCauseAnalysis.Find(
            DrugCauseSets.Causes(context.Knowledge),
            facts.Medications.Concat(facts.StoppedMedications),
            DrugCauseAnalysis.Fall(context));
        return implicated.Select(d =>
        {
            var m = d.Medication;
            var stopped = m.Use == MedicationUse.Stopped;
            return new DrugExposure(
                d.Match.Ingredient,
                d.Match.Set.Label,
                d.Timing.Verdict,
                Rendering.PhraseCatalogue.Default.Render(d.Timing.VerdictFinding, context.Display),
                m.StartedAt,
                stopped ? m.EndedAt ?? m.LastRecordedAt : null,
                !stopped,
                m.Reference);
        }).ToList();
    }

    /// <summary>Intravenous sodium chloride and vaptan orders (active, intended or draft), with the Adrogué–Madias prediction.</summary>
    public static IReadOnlyList<CourseOrder> Orders(DecisionContext context)
    {
        Guard.NotNull(context, nameof(context));
        var facts = context.Request.Facts;
        var fluids = context.Knowledge.Find(InfusateRecognizer.FluidSetId);
        var vaptans = context.Knowledge.Find(DrugCauseSets.Vaptans);
        var weight = facts.Latest(Analyte.BodyWeight);
        if (weight is not null && !(weight.Value >= InfusionPredictionCardProducer.MinimumPlausibleWeightKg && weight.Value <= InfusionPredictionCardProducer.MaximumPlausibleWeightKg))
        {
            weight = null;
        }

        var serum = context.Sodium.Latest;
        var orders = new List<CourseOrder>();
        foreach (var order in facts.Medications.Concat(context.Request.DraftOrders)
                     .DistinctBy(o => o.Reference, StringComparer.Ordinal)
                     .OrderBy(o => o.StartedAt ?? DateTimeOffset.MaxValue)
                     .ThenBy(o => o.Reference, StringComparer.Ordinal))
        {
            if (vaptans is not null && MedicationMatching.Match(vaptans, order) is { } vaptan)
            {
                orders.Add(new CourseOrder(CourseOrderKind.Vaptan, vaptan.Ingredient, order.StartedAt, order.Reference, null, null,
                    "raises sodium by a water diuresis; its size cannot be predicted by formula, so check sodium often"));
                continue;
            }

            if (InfusateRecognizer.Recognize(order, fluids, context.Options.Infusion) is not { } recognition)
            {
                continue;
            }

            if (recognition.Infusate is not { } infusate)
            {
                orders.Add(new CourseOrder(CourseOrderKind.Fluid, order.Text ?? "sodium chloride (concentration not read)", order.StartedAt, order.Reference, null, null,
                    "concentration could not be read, so no prediction is made"));
                continue;
            }

            if (weight is null || serum is null)
            {
                orders.Add(new CourseOrder(CourseOrderKind.Fluid, Rendering.PhraseCatalogue.Default.Render(infusate.Name, context.Display), order.StartedAt, order.Reference, null, null,
                    weight is null ? "no usable body weight, so the effect is not predicted" : "no usable sodium, so the effect is not predicted"));
                continue;
            }

            var water = BodyWater.Estimate(weight.Value, facts.Sex, facts.AgeAt(context.Request.Now), context.Options.Infusion);
            var perLitre = Math.Round(AdrogueMadias.ChangePerLitre(infusate.Sodium, infusate.Potassium, serum.Value, water.Litres), 1, MidpointRounding.AwayFromZero);
            double? forVolume = order.VolumeMilliliters is { } ml && ml > 0 && double.IsFinite(ml)
                ? Math.Round(AdrogueMadias.ChangeForVolume(perLitre, ml), 1, MidpointRounding.AwayFromZero)
                : null;
            var effect = Invariant.Format($"predicted {Signed(perLitre)} mmol/L per litre (Adrogué–Madias, total body water {Invariant.Number(Math.Round(water.Litres, 1, MidpointRounding.AwayFromZero))} L)")
                + (forVolume is { } v ? Invariant.Format($"; {Signed(v)} mmol/L for {Invariant.Number(order.VolumeMilliliters!.Value)} mL") : string.Empty);
            orders.Add(new CourseOrder(CourseOrderKind.Fluid, Rendering.PhraseCatalogue.Default.Render(infusate.Name, context.Display), order.StartedAt, order.Reference, perLitre, forVolume, effect));
        }

        return orders;
    }

    private static string Signed(double value) => (value > 0 ? "+" : string.Empty) + Invariant.Number(value);
}
