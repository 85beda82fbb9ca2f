using CdsNatremia.Core.Text;
using CdsNatremia.Core.Assessment;
using CdsNatremia.Core.Engine;
using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Workup;

namespace CdsNatremia.Core.CorrectionRate;

/// <summary>
/// The check the Adrogué–Madias prediction cannot make by itself: it assumes no urine losses. When the urine is more
/// concentrated than the infusate (urine osmolality above the infusate's, or urine sodium + potassium above the infusate's
/// sodium + potassium), the kidney excretes the infused salt in less water than came with it and keeps the rest as free
/// water, so the sodium can <b>fall</b> ("desalination": Steele et al., Ann Intern Med 1997;126:20). Pure.
/// </summary>
/// <param name="Osmolality">The urine osmolality compared, or null.</param>
/// <param name="Sodium">The urine sodium compared, or null.</param>
/// <param name="Potassium">The urine potassium paired with the urine sodium, or null.</param>
public sealed record UrineVersusInfusate(LabResult? Osmolality, LabResult? Sodium, LabResult? Potassium)
{
    /// <summary>The citation cards print.</summary>
    public const string Source = "Steele A, Gowrishankar M, Abrahamson S, et al. Postoperative hyponatremia despite near-isotonic saline infusion: a phenomenon of desalination. Ann Intern Med 1997;126:20";

    /// <summary>True when some urine data could be compared.</summary>
    public bool HasData => Osmolality is not null || Sodium is not null;

    /// <summary>
    /// The newest urine osmolality and urine sodium taken no more than the work-up's
    /// <see cref="WorkupOptions.UrineUsableBeforeSodiumHours"/> before <paramref name="at"/> (the serum sodium the prediction
    /// starts from, or now), and the urine potassium closest to the urine sodium within the pairing window.
    /// </summary>
    public static UrineVersusInfusate Find(DecisionContext context, DateTimeOffset at)
    {
        Guard.NotNull(context, nameof(context));
        var facts = context.Request.Facts;
        var options = context.Options.Workup;
        var from = at.AddHours(-options.UrineUsableBeforeSodiumHours);
        var sodium = WorkupData.NewestSince(facts, Analyte.UrineSodium, from);
        var potassium = sodium is null ? null : WorkupData.Paired(facts, Analyte.UrinePotassium, sodium.EffectiveAt, options.PairedWithinHours);
        return new UrineVersusInfusate(WorkupData.NewestSince(facts, Analyte.UrineOsmolality, from), sodium, potassium);
    }

    /// <summary>The comparison with one infusate: whether the prediction holds, and each comparison made, in words.</summary>
    public (bool MayFall, IReadOnlyList<string> Lines) Compare(Infusate infusate, TimeDisplay display)
    {
        Guard.NotNull(infusate, nameof(infusate));
        var lines = new List<string>();
        var mayFall = false;
        if (Osmolality is { } osm)
        {
            var above = osm.Value > infusate.Osmolality;
            mayFall |= above;
            lines.Add(Invariant.Format(
                $"urine osmolality {Invariant.Number(osm.Value)} mOsm/kg ({Cite.Result(osm, display)}) is {(above ? "**above**" : "not above")} the fluid's {Invariant.Number(infusate.Osmolality)} mOsm/kg"));
        }

        if (Sodium is { } una)
        {
            var fluid = infusate.Sodium + infusate.Potassium;
            if (Potassium is { } uk)
            {
                var sum = una.Value + uk.Value;
                var above = sum > fluid;
                mayFall |= above;
                lines.Add(Invariant.Format(
                    $"urine sodium + potassium = {Invariant.Number(una.Value)} + {Invariant.Number(uk.Value)} = {Invariant.Number(sum)} mmol/L ({Cite.Result(una, display)}; {Cite.Result(uk, display)}) is {(above ? "**above**" : "not above")} the fluid's sodium + potassium of {Invariant.Number(fluid)} mmol/L"));
            }
            else if (una.Value > fluid)
            {
                mayFall = true;
                lines.Add(Invariant.Format(
                    $"urine sodium alone, {Invariant.Number(una.Value)} mmol/L ({Cite.Result(una, display)}), is **above** the fluid's sodium + potassium of {Invariant.Number(fluid)} mmol/L (urine potassium not available; it would only add to the sum)"));
            }
            else
            {
                lines.Add(Invariant.Format(
                    $"urine sodium {Invariant.Number(una.Value)} mmol/L ({Cite.Result(una, display)}) is not above the fluid's {Invariant.Number(fluid)} mmol/L, but without a urine potassium the sum of urine sodium and potassium cannot be compared"));
            }
        }

        return (mayFall, lines);
    }
}
