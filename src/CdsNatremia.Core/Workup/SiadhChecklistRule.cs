using CdsNatremia.Core.Assessment;
using CdsNatremia.Core.Engine;
using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Text;

using CdsNatremia.Core.Findings;

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
            ? FindingKind.SiadhVerdictNotMet
            : unknown > 0 ? FindingKind.SiadhVerdictUnknown : FindingKind.SiadhVerdictConsistent;
        card.Steps.Add(Finding.Of(
            FindingKind.SiadhStep,
            Slot.Count("met", met),
            Slot.Count("notMet", notMet),
            Slot.Count("unknown", unknown),
            Slot.Phrase("verdict", Finding.Of(verdict)),
            Slot.List("lines", criteria.Select((c, i) => (SlotValue)new PhraseValue(c.Line(i + 1))), " ")));
        if (notMet == 0 && unknown == 0)
        {
            card.Findings.Add(Finding.Of(FindingKind.SiadhFinding).With(Certainty.Likely).Weighted(Weights.Cause));
            card.NextSteps.Add(Finding.Of(FindingKind.SiadhNext, Slot.Phrase("restriction", FurstRatio.RestrictionClause(context))));
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

        var hypo = Finding.Of(FindingKind.SiadhNameEffective, Slot.Number("threshold", options.HypotonicBelow));
        list.Add(tonicity.Effective is { } effective
            ? new SiadhCriterion(hypo, effective < options.HypotonicBelow ? CriterionStatus.Met : CriterionStatus.NotMet,
                tonicity.Method == OsmolalityMethod.Measured
                    ? Finding.Of(FindingKind.SiadhDataEffectiveMeasured, Slot.Number("value", effective), Slot.Result("result", tonicity.Measured!)).RestingOn(tonicity.Measured!.Reference)
                    : Finding.Of(FindingKind.SiadhDataEffectiveCalculated, Slot.Number("value", effective)))
            : context.Request.Facts.Observe(Analyte.SerumOsmolality) is { CouldNotBeRead: true } unreadOsm
                ? new SiadhCriterion(hypo, CriterionStatus.CouldNotBeRead, Unread(unreadOsm.Reason, unreadOsm.ItemText))
                : new SiadhCriterion(hypo, CriterionStatus.Unknown, Finding.Of(FindingKind.SiadhDataNoSerumOsmolality)));

        var uosmName = Finding.Of(FindingKind.SiadhNameUrineOsmolality, Slot.Number("threshold", options.DiluteUrineAtOrBelow));
        var urineFrom = context.Sodium.Latest is { } assessed ? assessed.EffectiveAt.AddHours(-options.UrineUsableBeforeSodiumHours) : (DateTimeOffset?)null;
        list.Add(urine.Osmolality is { } uosm
            ? new SiadhCriterion(uosmName, uosm.Value > options.DiluteUrineAtOrBelow ? CriterionStatus.Met : CriterionStatus.NotMet, Cited(uosm))
            : Urine(context, uosmName, Analyte.UrineOsmolality, urineFrom, options.DiluteUrineAtOrBelow, FindingKind.SiadhDataNoUrineOsmolality));

        var unaName = Finding.Of(FindingKind.SiadhNameUrineSodium, Slot.Number("threshold", options.LowUrineSodiumAtOrBelow));
        list.Add(urine.Sodium is { } una
            ? new SiadhCriterion(unaName, una.Value > options.LowUrineSodiumAtOrBelow ? CriterionStatus.Met : CriterionStatus.NotMet, Cited(una))
            : Urine(context, unaName, Analyte.UrineSodium, urineFrom, options.LowUrineSodiumAtOrBelow, FindingKind.SiadhDataNoUrineSodium));

        list.Add(new SiadhCriterion(Finding.Of(FindingKind.SiadhNameEuvolaemia), CriterionStatus.ClinicianToAssess, Finding.Of(FindingKind.SiadhDataEuvolaemia)));
        list.Add(Thyroid(context, options));
        list.Add(Adrenal(context, options));
        list.Add(Diuretics(context, urine));
        return list;
    }

    private static Finding Cited(LabResult result) => Finding.Of(FindingKind.SiadhDataResult, Slot.Result("result", result)).RestingOn(result.Reference);

    private static Finding Unread(string? reason, string? text) => text is { Length: > 0 }
        ? Finding.Of(FindingKind.SiadhDataUnreadNamed, Slot.Text("reason", reason ?? string.Empty), Slot.Text("text", text)).With(Certainty.CouldNotBeRead)
        : Finding.Of(FindingKind.SiadhDataUnread, Slot.Text("reason", reason ?? string.Empty)).With(Certainty.CouldNotBeRead);

    private static SiadhCriterion Thyroid(DecisionContext context, WorkupOptions options)
    {
        var name = Finding.Of(FindingKind.SiadhNameThyroid);
        var tsh = Recent(context, Analyte.Thyrotropin, options);
        if (tsh is null)
        {
            return NotMeasured(context, name, Analyte.Thyrotropin, Finding.Of(FindingKind.SiadhDataNoTsh, Slot.Number("days", options.EndocrineTestMaxAgeDays)));
        }

        var low = tsh.ReferenceLow ?? options.ThyrotropinNormalFrom;
        var high = tsh.ReferenceHigh ?? options.ThyrotropinNormalTo;
        var normal = tsh.Value >= low && tsh.Value <= high;
        return new SiadhCriterion(name, normal ? CriterionStatus.Met : CriterionStatus.NotMet, Finding.Of(
            tsh.ReferenceHigh is null ? FindingKind.SiadhDataTshDefault : FindingKind.SiadhDataTsh,
            Slot.Result("result", tsh),
            Slot.Number("low", low),
            Slot.Number("high", high)).RestingOn(tsh.Reference));
    }

    private static SiadhCriterion Adrenal(DecisionContext context, WorkupOptions options)
    {
        var name = Finding.Of(FindingKind.SiadhNameAdrenal);
        var cortisol = Recent(context, Analyte.Cortisol, options);
        if (cortisol is null)
        {
            return NotMeasured(context, name, Analyte.Cortisol, Finding.Of(FindingKind.SiadhDataNoCortisol, Slot.Number("days", options.EndocrineTestMaxAgeDays)));
        }

        var low = cortisol.ReferenceLow ?? options.CortisolNormalFrom;
        var normal = cortisol.Value >= low;
        var data = Finding.Of(cortisol.ReferenceLow is null ? FindingKind.SiadhDataCortisolDefault : FindingKind.SiadhDataCortisol, Slot.Result("result", cortisol), Slot.Number("low", low))
            .RestingOn(cortisol.Reference);
        return new SiadhCriterion(name, normal ? CriterionStatus.Met : CriterionStatus.NotMet,
            normal ? Finding.Of(FindingKind.SiadhDataCortisolCaveat, Slot.Phrase("cortisol", data)).RestingOn(cortisol.Reference) : data);
    }

    private static SiadhCriterion Diuretics(DecisionContext context, UrineStudies urine)
    {
        var name = Finding.Of(FindingKind.SiadhNameDiuretics);
        Guard.NotNull(urine, nameof(urine));

        // A negative criterion: met only when diuretics are absent after a real look; an unreadable medicine makes it unknown.
        var observed = DiureticExposure.Observe(context);
        Finding Found(IReadOnlyList<DiureticExposure> found) => Finding.Of(
            FindingKind.SiadhDataDiureticsFound,
            Slot.List("drugs", found.Select(d => (SlotValue)new PhraseValue(d.Describe())), "; "));
        return observed.Match(
            found => new SiadhCriterion(name, CriterionStatus.NotMet, Found(found)),
            found => new SiadhCriterion(name, CriterionStatus.NotMet, Found(found)),
            _ => new SiadhCriterion(name, CriterionStatus.CouldNotBeRead, Unread(observed.Reason, observed.ItemText)),
            looked => new SiadhCriterion(name, CriterionStatus.Met, Finding.Of(FindingKind.SiadhDataDiureticsLooked, Slot.Text("looked", looked))));
    }

    /// <summary>A urine criterion ("above the threshold") with no usable measurement: judged on a bound when one decides it, else unknown or could not be read.</summary>
    private static SiadhCriterion Urine(DecisionContext context, Finding name, Analyte analyte, DateTimeOffset? from, double threshold, string absentKind)
    {
        var observed = context.Request.Facts.Observe(analyte, from);
        var status = observed.Judge(r => r.Value > threshold, r => Bounds.IsAbove(r, threshold));
        return observed.Match(
            usable => new SiadhCriterion(name, status, Cited(usable)),
            bound => new SiadhCriterion(name, status, Finding.Of(
                status == CriterionStatus.Unknown ? FindingKind.SiadhDataBoundUndecided : FindingKind.SiadhDataBound,
                Slot.Verbatim("analyte", AnalyteUnits.DisplayName(analyte)),
                Slot.Verbatim("bound", Bounds.Describe(bound)),
                Slot.Text("unit", bound.Unit),
                Slot.Time("time", bound.EffectiveAt),
                Slot.Text("reference", bound.Reference)).RestingOn(bound.Reference)),
            _ => new SiadhCriterion(name, CriterionStatus.CouldNotBeRead, Unread(observed.Reason, observed.ItemText)),
            _ => new SiadhCriterion(name, CriterionStatus.Unknown, Finding.Of(absentKind)));
    }

    /// <summary>
    /// A criterion with no usable measurement: could not be read when the only results were set aside or another
    /// patient's (or only a bound that does not decide it); otherwise unknown for lack of data.
    /// </summary>
    private static SiadhCriterion NotMeasured(DecisionContext context, Finding name, Analyte analyte, Finding absent)
    {
        var from = context.Request.Now.AddDays(-context.Options.Workup.EndocrineTestMaxAgeDays);
        var observed = context.Request.Facts.Observe(analyte, from);
        return observed.Match(
            usable => new SiadhCriterion(name, CriterionStatus.Unknown, absent),
            bound => new SiadhCriterion(name, CriterionStatus.Unknown, Finding.Of(
                FindingKind.SiadhDataBoundNotMeasured,
                Slot.Verbatim("analyte", AnalyteUnits.DisplayName(analyte)),
                Slot.Verbatim("bound", Bounds.Describe(bound)),
                Slot.Text("unit", bound.Unit),
                Slot.Text("reference", bound.Reference)).RestingOn(bound.Reference)),
            _ => new SiadhCriterion(name, CriterionStatus.CouldNotBeRead, Unread(observed.Reason, observed.ItemText)),
            _ => new SiadhCriterion(name, CriterionStatus.Unknown, absent));
    }

    private static LabResult? Recent(DecisionContext context, Analyte analyte, WorkupOptions options)
        => WorkupData.NewestSince(context.Request.Facts, analyte, context.Request.Now.AddDays(-options.EndocrineTestMaxAgeDays));
}
