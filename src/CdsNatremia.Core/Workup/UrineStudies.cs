using CdsNatremia.Core.Text;
using CdsNatremia.Core.Assessment;
using CdsNatremia.Core.Engine;
using CdsNatremia.Core.Facts;

using CdsNatremia.Core.Findings;

namespace CdsNatremia.Core.Workup;

/// <summary>
/// The spot urine osmolality and sodium that go with the assessed sodium: the newest of each taken no more than
/// <see cref="WorkupOptions.UrineUsableBeforeSodiumHours"/> before it, each with the labels a reader needs (taken long
/// before or after the serum sodium; taken while a diuretic was in use).
/// </summary>
public sealed record UrineStudies
{
    /// <summary>Urine osmolality, or null.</summary>
    public LabResult? Osmolality { get; init; }

    /// <summary>Urine sodium, or null.</summary>
    public LabResult? Sodium { get; init; }

    /// <summary>Diuretics in the record.</summary>
    public IReadOnlyList<DiureticExposure> Diuretics { get; init; } = [];

    /// <summary>True when urine osmolality is at or below the dilute cut-off.</summary>
    public bool IsDilute { get; init; }

    /// <summary>Diuretics in use when the urine sodium was taken (or whose start time is unknown).</summary>
    public IReadOnlyList<DiureticExposure> DiureticsAtUrineSodium { get; init; } = [];

    /// <summary>Finds the urine studies for the context's latest sodium.</summary>
    public static UrineStudies From(DecisionContext context)
    {
        Guard.NotNull(context, nameof(context));
        var options = context.Options.Workup;
        var sodium = context.Sodium.Latest ?? throw new InvalidOperationException("The work-up needs a sodium result.");
        var from = sodium.EffectiveAt.AddHours(-options.UrineUsableBeforeSodiumHours);
        var facts = context.Request.Facts;
        var osmolality = WorkupData.NewestSince(facts, Analyte.UrineOsmolality, from);
        var urineSodium = WorkupData.NewestSince(facts, Analyte.UrineSodium, from);
        var diuretics = DiureticExposure.Find(context);
        return new UrineStudies
        {
            Osmolality = osmolality,
            Sodium = urineSodium,
            Diuretics = diuretics,
            IsDilute = osmolality is not null && osmolality.Value <= options.DiluteUrineAtOrBelow,
            DiureticsAtUrineSodium = urineSodium is null ? [] : diuretics.Where(d => d.InUseAt(urineSodium.EffectiveAt)).ToList(),
        };
    }

    /// <summary>The result cited with its labels (timing against the serum sodium, diuretic in use).</summary>
    public Finding CiteWithLabels(LabResult urine, LabResult serumSodium, WorkupOptions options)
    {
        Guard.NotNull(urine, nameof(urine));
        Guard.NotNull(serumSodium, nameof(serumSodium));
        Guard.NotNull(options, nameof(options));
        var labels = new List<SlotValue>();
        var apart = (urine.EffectiveAt - serumSodium.EffectiveAt).TotalHours;
        if (Math.Abs(apart) > options.UrineLabelAfterHours)
        {
            var offset = Math.Abs(apart) < 0.05
                ? Finding.Of(FindingKind.UrineOffsetSame)
                : Finding.Of(apart > 0 ? FindingKind.UrineOffsetAfter : FindingKind.UrineOffsetBefore, Slot.Hours("hours", Math.Abs(apart)));
            labels.Add(new PhraseValue(Finding.Of(FindingKind.UrineLabelApart, Slot.Phrase("offset", offset), Slot.Number("hours", options.UrineLabelAfterHours))));
        }

        var onDiuretic = Diuretics.Where(d => d.InUseAt(urine.EffectiveAt)).ToList();
        if (onDiuretic.Count > 0)
        {
            labels.Add(new PhraseValue(Finding.Of(FindingKind.UrineLabelDiuretic, Slot.List("drugs", onDiuretic.Select(d => (SlotValue)new PhraseValue(d.Describe())), "; "))));
        }

        return labels.Count == 0
            ? Finding.Of(FindingKind.UrineCite, Slot.Result("result", urine)).RestingOn(urine.Reference)
            : Finding.Of(FindingKind.UrineCiteLabelled, Slot.Result("result", urine), Slot.List("labels", labels, "; ")).RestingOn(urine.Reference);
    }
}
