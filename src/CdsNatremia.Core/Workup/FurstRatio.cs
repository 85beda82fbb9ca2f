using CdsNatremia.Core.Engine;
using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Text;

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

    /// <summary>The computation as a card prints it, with every input as used.</summary>
    public string Computation()
        => UrinePotassium is { } uk
            ? Invariant.Format($"(urine sodium {Invariant.Number(UrineSodium.Value)} + urine potassium {Invariant.Number(uk.Value)}) / serum sodium {Invariant.Number(SerumSodium.Value)} = **{Invariant.Number(Value)}**")
            : Invariant.Format($"urine sodium {Invariant.Number(UrineSodium.Value)} / serum sodium {Invariant.Number(SerumSodium.Value)} = **{Invariant.Number(Value)}** without urine potassium (not available), so the ratio is at least this");

    /// <summary>What the outlook means, in words.</summary>
    public static string Meaning(FluidRestrictionOutlook outlook, WorkupOptions options)
    {
        Guard.NotNull(options, nameof(options));
        return outlook switch
        {
            FluidRestrictionOutlook.RestrictionUnlikelyToWork => Invariant.Format(
                $"above {Invariant.Number(options.FurstRestrictionUnlikelyAbove)}: **fluid restriction is unlikely to work** (the kidney excretes no free water), so other treatment is usually needed, chosen with a senior clinician under local protocol"),
            FluidRestrictionOutlook.StricterRestriction => Invariant.Format(
                $"from {Invariant.Number(options.FurstStricterRestrictionFrom)} to {Invariant.Number(options.FurstRestrictionUnlikelyAbove)}: a **stricter fluid restriction** than usual is needed, and it may still fail"),
            _ => Invariant.Format(
                $"below {Invariant.Number(options.FurstStricterRestrictionFrom)}: the **usual fluid restriction** can be expected to work"),
        };
    }

    /// <summary>
    /// The fluid-restriction clause of the SIADH advice: what the Furst ratio says when it can be computed, otherwise that
    /// restriction is the usual first step unless the urine electrolytes show it cannot work.
    /// </summary>
    public static string RestrictionClause(DecisionContext context)
    {
        Guard.NotNull(context, nameof(context));
        var options = context.Options.Workup;
        return For(context) is { } ratio && ratio.Outlook(options) is { } outlook
            ? Invariant.Format($"the Furst ratio of {Invariant.Number(ratio.Value)} says whether fluid restriction will work ({Meaning(outlook, options)})")
            : "fluid restriction is the usual first step unless the urine electrolytes show it cannot work (the Furst ratio needs urine sodium and potassium)";
    }
}
