using CdsNatremia.Core.Assessment;
using CdsNatremia.Core.Engine;
using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Text;

namespace CdsNatremia.Core.Workup;

/// <summary>
/// Step 6 of the work-up: the SIADH essential criteria (as commonly listed after Schwartz–Bartter and Janicic &amp; Verbalis;
/// reference sheet), each met, not met or unknown with the data behind it; euvolaemia is always left to the clinician.
/// The checklist is shown for hypotonic or not-yet-known tonicity only.
/// </summary>
public sealed class SiadhChecklistRule : IAssessmentRule
{
    /// <inheritdoc />
    public string RuleId => "workup.siadh";

    /// <inheritdoc />
    public void Apply(DecisionContext context, AssessmentBuilder card)
    {
        Guard.NotNull(context, nameof(context));
        Guard.NotNull(card, nameof(card));
        var tonicity = TonicityAssessment.From(context);
        if (tonicity.Band is Tonicity.Isotonic or Tonicity.Hypertonic)
        {
            return;
        }

        var criteria = Evaluate(context, tonicity, UrineStudies.From(context));
        card.RuleIds.Add(RuleId);
        card.Sources.Add(WorkupSources.Siadh);
        foreach (var used in new[] { Recent(context, Analyte.Thyrotropin, context.Options.Workup), Recent(context, Analyte.Cortisol, context.Options.Workup) }.OfType<LabResult>())
        {
            card.ResourcesUsed.Add(used.Reference);
        }

        var met = criteria.Count(c => c.Status == CriterionStatus.Met);
        var notMet = criteria.Count(c => c.Status == CriterionStatus.NotMet);
        var unknown = criteria.Count(c => c.Status is CriterionStatus.Unknown or CriterionStatus.CouldNotBeRead);
        var verdict = notMet > 0
            ? "SIADH cannot be diagnosed on these data while a criterion is not met"
            : unknown > 0
                ? "SIADH is neither shown nor excluded: some criteria lack data"
                : "the data are **consistent with SIADH** if the clinician finds the patient euvolaemic";
        var lines = string.Join(" ", criteria.Select((c, i) => Invariant.Format($"({i + 1}) {c.Name}: **{c.StatusText}**: {c.DataText}.")));
        card.Steps.Add(Invariant.Format(
            $"**SIADH essential criteria**: {met} met, {notMet} not met, {unknown} unknown, euvolaemia for the clinician; {verdict}. {lines}"));
        if (notMet == 0 && unknown == 0)
        {
            card.Findings.Add("SIADH essential criteria met on the data (euvolaemia to be confirmed by the clinician).");
            card.NextSteps.Add("If SIADH is confirmed, " + FurstRatio.RestrictionClause(context) + "; look for its cause (drugs, lung or intracranial disease, cancer, pain, nausea) and keep the correction within the limits.");
        }
    }

    /// <summary>The essential criteria in the usual order.</summary>
    public static IReadOnlyList<SiadhCriterion> Evaluate(DecisionContext context, TonicityAssessment tonicity, UrineStudies urine)
    {
        Guard.NotNull(context, nameof(context));
        Guard.NotNull(tonicity, nameof(tonicity));
        Guard.NotNull(urine, nameof(urine));
        var options = context.Options.Workup;
        var list = new List<SiadhCriterion>();

        var hypo = Invariant.Format($"Effective serum osmolality < {Invariant.Number(options.HypotonicBelow)} mOsm/kg");
        list.Add(tonicity.Effective is { } effective
            ? new SiadhCriterion(hypo, effective < options.HypotonicBelow ? CriterionStatus.Met : CriterionStatus.NotMet,
                Invariant.Format($"{Invariant.Number(effective)} mOsm/kg ({(tonicity.Method == OsmolalityMethod.Measured ? "from " + Cite.Result(tonicity.Measured!, context.Display) : "calculated")})"))
            : context.Request.Facts.Observe(Analyte.SerumOsmolality).CouldNotBeReadText is { } unreadOsm
                ? new SiadhCriterion(hypo, CriterionStatus.CouldNotBeRead, unreadOsm)
                : new SiadhCriterion(hypo, CriterionStatus.Unknown, "no serum osmolality"));

        var uosmName = Invariant.Format($"Urine osmolality > {Invariant.Number(options.DiluteUrineAtOrBelow)} mOsm/kg");
        var urineFrom = context.Sodium.Latest is { } assessed ? assessed.EffectiveAt.AddHours(-options.UrineUsableBeforeSodiumHours) : (DateTimeOffset?)null;
        list.Add(urine.Osmolality is { } uosm
            ? new SiadhCriterion(uosmName, uosm.Value > options.DiluteUrineAtOrBelow ? CriterionStatus.Met : CriterionStatus.NotMet, Cite.Result(uosm, context.Display))
            : Urine(context, uosmName, Analyte.UrineOsmolality, urineFrom, options.DiluteUrineAtOrBelow, "no urine osmolality"));

        var unaName = Invariant.Format($"Urine sodium > {Invariant.Number(options.LowUrineSodiumAtOrBelow)} mmol/L on normal salt and water intake");
        list.Add(urine.Sodium is { } una
            ? new SiadhCriterion(unaName, una.Value > options.LowUrineSodiumAtOrBelow ? CriterionStatus.Met : CriterionStatus.NotMet, Cite.Result(una, context.Display))
            : Urine(context, unaName, Analyte.UrineSodium, urineFrom, options.LowUrineSodiumAtOrBelow, "no urine sodium"));

        list.Add(new SiadhCriterion("Clinical euvolaemia", CriterionStatus.ClinicianToAssess, "the service cannot examine the patient (see the volume clues)"));
        list.Add(Thyroid(context, options));
        list.Add(Adrenal(context, options));
        list.Add(Diuretics(context, urine));
        return list;
    }

    private static SiadhCriterion Thyroid(DecisionContext context, WorkupOptions options)
    {
        const string name = "Normal thyroid function";
        var tsh = Recent(context, Analyte.Thyrotropin, options);
        if (tsh is null)
        {
            return NotMeasured(context, name, Analyte.Thyrotropin, Invariant.Format($"no TSH within {Invariant.Number(options.EndocrineTestMaxAgeDays)} days"));
        }

        var low = tsh.ReferenceLow ?? options.ThyrotropinNormalFrom;
        var high = tsh.ReferenceHigh ?? options.ThyrotropinNormalTo;
        var range = Invariant.Format($"reference {Invariant.Number(low)}–{Invariant.Number(high)} mIU/L{(tsh.ReferenceHigh is null ? ", default range: from memory" : ", laboratory range")}");
        var normal = tsh.Value >= low && tsh.Value <= high;
        return new SiadhCriterion(name, normal ? CriterionStatus.Met : CriterionStatus.NotMet, Cite.Result(tsh, context.Display) + "; " + range);
    }

    private static SiadhCriterion Adrenal(DecisionContext context, WorkupOptions options)
    {
        const string name = "Normal adrenal function";
        var cortisol = Recent(context, Analyte.Cortisol, options);
        if (cortisol is null)
        {
            return NotMeasured(context, name, Analyte.Cortisol, Invariant.Format($"no cortisol within {Invariant.Number(options.EndocrineTestMaxAgeDays)} days"));
        }

        var low = cortisol.ReferenceLow ?? options.CortisolNormalFrom;
        var source = cortisol.ReferenceLow is null ? "default lower limit: from memory" : "laboratory lower limit";
        var normal = cortisol.Value >= low;
        var caveat = normal ? "; a single value in range does not fully exclude adrenal insufficiency (timing matters; a stimulation test settles doubt)" : string.Empty;
        return new SiadhCriterion(name, normal ? CriterionStatus.Met : CriterionStatus.NotMet,
            Invariant.Format($"{Cite.Result(cortisol, context.Display)}; lower limit {Invariant.Number(low)} nmol/L ({source}){caveat}"));
    }

    private static SiadhCriterion Diuretics(DecisionContext context, UrineStudies urine)
    {
        const string name = "No recent diuretic use";
        Guard.NotNull(urine, nameof(urine));

        // A negative criterion: met only when diuretics are absent after a real look; an unreadable medicine makes it unknown.
        return DiureticExposure.Observe(context).Match(
            found => new SiadhCriterion(name, CriterionStatus.NotMet, string.Join("; ", found.Select(d => d.Describe(context.Display)))),
            found => new SiadhCriterion(name, CriterionStatus.NotMet, string.Join("; ", found.Select(d => d.Describe(context.Display)))),
            unread => new SiadhCriterion(name, CriterionStatus.CouldNotBeRead, unread.CouldNotBeReadText!),
            looked => new SiadhCriterion(name, CriterionStatus.Met, Markdown.Escape(looked) + " (confirm with the patient)"));
    }

    /// <summary>A urine criterion ("above the threshold") with no usable measurement: judged on a bound when one decides it, else unknown or could not be read.</summary>
    private static SiadhCriterion Urine(DecisionContext context, string name, Analyte analyte, DateTimeOffset? from, double threshold, string absentText)
    {
        var observed = context.Request.Facts.Observe(analyte, from);
        var status = observed.Judge(r => r.Value > threshold, r => Bounds.IsAbove(r, threshold));
        return observed.Match(
            usable => new SiadhCriterion(name, status, Cite.Result(usable, context.Display)),
            bound => new SiadhCriterion(name, status, Invariant.Format(
                $"{AnalyteUnits.DisplayName(analyte)} {Bounds.Describe(bound)} {bound.Unit} at {context.Display.Time(bound.EffectiveAt)} ({Markdown.Escape(bound.Reference)}; a bound{(status == CriterionStatus.Unknown ? " that does not decide this criterion" : string.Empty)})")),
            unread => new SiadhCriterion(name, CriterionStatus.CouldNotBeRead, unread.CouldNotBeReadText!),
            _ => new SiadhCriterion(name, CriterionStatus.Unknown, absentText));
    }

    /// <summary>
    /// A criterion with no usable measurement: could not be read when the only results were set aside or another
    /// patient's (or only a bound that does not decide it); otherwise unknown for lack of data.
    /// </summary>
    private static SiadhCriterion NotMeasured(DecisionContext context, string name, Analyte analyte, string absentText)
    {
        var from = context.Request.Now.AddDays(-context.Options.Workup.EndocrineTestMaxAgeDays);
        return context.Request.Facts.Observe(analyte, from).Match(
            usable => new SiadhCriterion(name, CriterionStatus.Unknown, absentText),
            bound => new SiadhCriterion(name, CriterionStatus.Unknown, Invariant.Format(
                $"{AnalyteUnits.DisplayName(analyte)} {Bounds.Describe(bound)} {bound.Unit} ({Markdown.Escape(bound.Reference)}) is a bound, not a measurement; it does not decide this criterion")),
            unread => new SiadhCriterion(name, CriterionStatus.CouldNotBeRead, unread.CouldNotBeReadText!),
            _ => new SiadhCriterion(name, CriterionStatus.Unknown, absentText));
    }

    private static LabResult? Recent(DecisionContext context, Analyte analyte, WorkupOptions options)
        => WorkupData.NewestSince(context.Request.Facts, analyte, context.Request.Now.AddDays(-options.EndocrineTestMaxAgeDays));
}
