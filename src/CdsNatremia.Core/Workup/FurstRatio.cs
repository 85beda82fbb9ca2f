using CdsNatremia.Core.Engine;
using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Text;

using CdsNatremia.Core.Findings;

namespace CdsNatremia.Core.Workup;

/// <summary>What a Furst ratio implies for fluid restriction.</summary>
public enum FluidRestrictionOutlook
{
    /// <summary>Ratio below <see cref="WorkupOptions.FurstStricterRestrictionFrom"/>: the usual restriction can be expected to work.</summary>
    UsualRestriction,
    /// <summary>Ratio from <see cref="WorkupOptions.FurstStricterRestrictionFrom"/> to <see cref="WorkupOptions.FurstRestrictionUnlikelyAbove"/>: a stricter restriction is needed.</summary>
    StricterRestriction,
    /// <summary>Ratio above <see cref="WorkupOptions.FurstRestrictionUnlikelyAbove"/>: restriction is unlikely to work.</summary>
    RestrictionUnlikelyToWork,
}

/// <summary>
/// The urine-to-serum electrolyte ratio (Furst et al., Am J Med Sci 2000;319:240; reference sheet, secondary):
/// (urine sodium + urine potassium) / serum sodium. The urine's electrolytes against the serum's say how much free water
/// the kidney can still excrete: above 1 none, so restricting water cannot raise the sodium. The ratio is rounded to two
/// decimals and the rounded value, the one a card shows, is the one banded. Pure.
/// </summary>
/// <param name="UrineSodium">The urine sodium.</param>
/// <param name="UrinePotassium">The urine potassium paired with it, or null (then only a lower bound is known).</param>
/// <param name="SerumSodium">The serum sodium.</param>
public sealed record FurstRatio(LabResult UrineSodium, LabResult? UrinePotassium, LabResult SerumSodium)
{
    /// <summary>The citation cards print.</summary>
    public const string Source = "Furst H, Hallows KR, Post J, et al. The urine/plasma electrolyte ratio: a predictive guide to water restriction. Am J Med Sci 2000;319:240 (bands as commonly taught; from memory)";

    /// <summary>(U_Na + U_K) / S_Na, unrounded; all in mmol/L.</summary>
    public static double Compute(double urineSodium, double urinePotassium, double serumSodium)
    {
        Guard.Finite(urineSodium, nameof(urineSodium));
        Guard.Finite(urinePotassium, nameof(urinePotassium));
        if (!(serumSodium > 0) || !double.IsFinite(serumSodium))
        {
            throw new ArgumentOutOfRangeException(nameof(serumSodium), serumSodium, "Serum sodium must be a positive number.");
        }

        return (urineSodium + urinePotassium) / serumSodium;
    }

    /// <summary>The band for a ratio (already rounded as shown).</summary>
    public static FluidRestrictionOutlook Band(double ratio, WorkupOptions options)
    {
        Guard.NotNull(options, nameof(options));
        return ratio > options.FurstRestrictionUnlikelyAbove ? FluidRestrictionOutlook.RestrictionUnlikelyToWork
            : ratio >= options.FurstStricterRestrictionFrom ? FluidRestrictionOutlook.StricterRestriction
            : FluidRestrictionOutlook.UsualRestriction;
    }

    /// <summary>The ratio as shown and used: rounded to two decimals (urine potassium counted as 0 when missing, a lower bound).</summary>
    public double Value => Math.Round(Compute(UrineSodium.Value, UrinePotassium?.Value ?? 0, SerumSodium.Value), 2, MidpointRounding.AwayFromZero);

    /// <summary>
    /// The outlook, or null when urine potassium is missing and the lower bound does not already pass the "unlikely" edge
    /// (a missing potassium can only raise the ratio).
    /// </summary>
    public FluidRestrictionOutlook? Outlook(WorkupOptions options)
    {
        Guard.NotNull(options, nameof(options));
        var band = Band(Value, options);
        return UrinePotassium is not null || band == FluidRestrictionOutlook.RestrictionUnlikelyToWork ? band : null;
    }

    /// <summary>The ratio for the context's latest sodium, or null without a usable (non-dilute) urine sodium.</summary>
    public static FurstRatio? For(DecisionContext context)
    {
        Guard.NotNull(context, nameof(context));
        if (context.Sodium.Latest is not { } serum)
        {
            return null;
        }

        var urine = UrineStudies.From(context);
        if (urine.IsDilute || urine.Sodium is not { } una)
        {
            return null;
        }

        var potassium = WorkupData.Paired(context.Request.Facts, Analyte.UrinePotassium, una.EffectiveAt, context.Options.Workup.PairedWithinHours);
        return new FurstRatio(una, potassium, serum);
    }

    /// <summary>The computation with every input as used.</summary>
    public Finding Computation()
        => UrinePotassium is { } uk
            ? Finding.Of(FindingKind.FurstComputation, Slot.Number("urineSodium", UrineSodium.Value), Slot.Number("urinePotassium", uk.Value), Slot.Number("serumSodium", SerumSodium.Value), Slot.Number("value", Value))
            : Finding.Of(FindingKind.FurstComputationNoPotassium, Slot.Number("urineSodium", UrineSodium.Value), Slot.Number("serumSodium", SerumSodium.Value), Slot.Number("value", Value));

    /// <summary>What the outlook means.</summary>
    public static Finding Meaning(FluidRestrictionOutlook outlook, WorkupOptions options)
    {
        Guard.NotNull(options, nameof(options));
        var above = Slot.Number("above", options.FurstRestrictionUnlikelyAbove);
        var from = Slot.Number("from", options.FurstStricterRestrictionFrom);
        return outlook switch
        {
            FluidRestrictionOutlook.RestrictionUnlikelyToWork => Finding.Of(FindingKind.FurstMeaningUnlikely, above),
            FluidRestrictionOutlook.StricterRestriction => Finding.Of(FindingKind.FurstMeaningStricter, from, above),
            _ => Finding.Of(FindingKind.FurstMeaningUsual, from),
        };
    }

    /// <summary>
    /// The fluid-restriction clause of the SIADH advice: what the Furst ratio says when it can be computed, otherwise that
    /// restriction is the usual first step unless the urine electrolytes show it cannot work.
    /// </summary>
    public static Finding RestrictionClause(DecisionContext context)
    {
        Guard.NotNull(context, nameof(context));
        var options = context.Options.Workup;
        return For(context) is { } ratio && ratio.Outlook(options) is { } outlook
            ? Finding.Of(FindingKind.FurstRestriction, Slot.Number("value", ratio.Value), Slot.Phrase("meaning", Meaning(outlook, options)))
            : Finding.Of(FindingKind.FurstRestrictionUnknown);
    }
}
