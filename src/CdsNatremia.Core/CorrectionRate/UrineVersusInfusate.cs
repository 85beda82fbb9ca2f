using CdsNatremia.Core.Engine;
using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Findings;
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

    /// <summary>The comparison with one infusate: whether the prediction holds, and each comparison made, as findings.</summary>
    public (bool MayFall, IReadOnlyList<Finding> Lines) Compare(Infusate infusate)
    {
        Guard.NotNull(infusate, nameof(infusate));
        var lines = new List<Finding>();
        var mayFall = false;
        if (Osmolality is { } osm)
        {
            var above = osm.Value > infusate.Osmolality;
            mayFall |= above;
            lines.Add(Finding.Of(
                above ? FindingKind.RateUrineOsmolalityAbove : FindingKind.RateUrineOsmolalityNotAbove,
                Slot.Number("osmolality", osm.Value),
                Slot.Text("ref", osm.Reference),
                Slot.Time("time", osm.EffectiveAt),
                Slot.Number("fluid", infusate.Osmolality)).RestingOn(osm.Reference));
        }

        if (Sodium is { } una)
        {
            var fluid = Slot.Number("fluid", infusate.Sodium + infusate.Potassium);
            var fluidSum = infusate.Sodium + infusate.Potassium;
            if (Potassium is { } uk)
            {
                var sum = una.Value + uk.Value;
                var above = sum > fluidSum;
                mayFall |= above;
                lines.Add(Finding.Of(
                    above ? FindingKind.RateUrineSumAbove : FindingKind.RateUrineSumNotAbove,
                    Slot.Number("sodium", una.Value),
                    Slot.Number("potassium", uk.Value),
                    Slot.Number("sum", sum),
                    Slot.Text("sodiumRef", una.Reference),
                    Slot.Text("potassiumRef", uk.Reference),
                    fluid).RestingOn(una.Reference, uk.Reference));
            }
            else
            {
                var above = una.Value > fluidSum;
                mayFall |= above;
                lines.Add(Finding.Of(
                    above ? FindingKind.RateUrineSodiumAloneAbove : FindingKind.RateUrineSodiumAloneNotAbove,
                    Slot.Number("sodium", una.Value),
                    Slot.Text("ref", una.Reference),
                    Slot.Time("time", una.EffectiveAt),
                    fluid).RestingOn(una.Reference));
            }
        }

        return (mayFall, lines);
    }
}
