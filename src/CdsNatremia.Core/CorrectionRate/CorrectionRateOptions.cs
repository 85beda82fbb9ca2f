using System.ComponentModel.DataAnnotations;
using CdsNatremia.Core.Engine;

namespace CdsNatremia.Core.CorrectionRate;

/// <summary>
/// Thresholds of the correction-rate watch. Unless <see cref="Preset"/> is <see cref="CorrectionRatePreset.Custom"/>,
/// the preset's limits replace the limit numbers below; the other settings (approaching margin, look-back, high-risk
/// criteria) always apply.
/// <para>
/// Default preset: <see cref="CorrectionRatePreset.European2014"/>, the guideline the severity bands already follow, so
/// one source governs both. Its simple "10 then 8" reads the same to every prescriber. The stricter high-risk limit
/// (8 mmol/L in any 24 h) comes from the US expert panel in both presets, because the European guideline does not set a
/// separate one and the reference sheet names the panel's high-risk factors.
/// </para>
/// </summary>
public sealed class CorrectionRateOptions : IValidatableObject
{
    /// <summary>European 2014 first-24-h limit, mmol/L (Spasovski et al. 2014, reference sheet: secondary).</summary>
    public const double EuropeanFirstDay = 10;

    /// <summary>European 2014 limit for each 24 h after the first, mmol/L (same source).</summary>
    public const double EuropeanLaterDay = 8;

    /// <summary>US panel limit in 24 h, lower end of "10–12" (Verbalis et al. 2013, reference sheet: secondary).</summary>
    public const double UsPanelDay = 10;

    /// <summary>US panel limit in 48 h, mmol/L (same source).</summary>
    public const double UsPanelTwoDays = 18;

    /// <summary>US panel limit in any 24 h for high risk, mmol/L (same source).</summary>
    public const double UsPanelHighRiskDay = 8;

    /// <summary>US panel minimum daily goal, lower end of "4–8" (and of "4–6" for high risk), mmol/L (same source).</summary>
    public const double UsPanelMinimumGoal = 4;

    /// <summary>Which limit set to use. Default <see cref="CorrectionRatePreset.European2014"/>.</summary>
    [EnumDataType(typeof(CorrectionRatePreset))]
    public CorrectionRatePreset Preset { get; set; } = CorrectionRatePreset.European2014;

    /// <summary>Custom preset only: largest rise in the first 24 h, mmol/L. Default 10 (European 2014).</summary>
    [Range(1, 30)]
    public double FirstDayLimit { get; set; } = EuropeanFirstDay;

    /// <summary>Custom preset only: largest rise in each later 24 h, mmol/L. Default 8 (European 2014).</summary>
    [Range(1, 30)]
    public double LaterDayLimit { get; set; } = EuropeanLaterDay;

    /// <summary>Custom preset only: largest rise in 48 h, mmol/L. Default 18 (10 + 8, European 2014; the US panel's 48-h limit).</summary>
    [Range(1, 60)]
    public double TwoDayLimit { get; set; } = UsPanelTwoDays;

    /// <summary>Custom preset only: largest rise in any 24 h at high risk, mmol/L. Default 8 (US panel).</summary>
    [Range(1, 30)]
    public double HighRiskDayLimit { get; set; } = UsPanelHighRiskDay;

    /// <summary>Custom preset only: largest rise in 48 h at high risk, mmol/L. Default 16 (8 in each 24 h, derived from the US panel's 8 in any 24 h).</summary>
    [Range(1, 60)]
    public double HighRiskTwoDayLimit { get; set; } = 2 * UsPanelHighRiskDay;

    /// <summary>Custom preset only: minimum useful daily rise, mmol/L. Default 4 (US panel: 4–8 per day).</summary>
    [Range(0, 20)]
    public double MinimumDailyGoal { get; set; } = UsPanelMinimumGoal;

    /// <summary>Custom preset only: minimum useful daily rise at high risk, mmol/L. Default 4 (US panel: 4–6 per day).</summary>
    [Range(0, 20)]
    public double MinimumDailyGoalHighRisk { get; set; } = UsPanelMinimumGoal;

    /// <summary>Custom preset only: the citation cards print for the limits.</summary>
    public string CustomSource { get; set; } = "limits set by the operating organisation";

    /// <summary>
    /// A rise within this many mmol/L below a limit is "approaching" it and gets a warning card. Default 2 mmol/L
    /// (a design choice of this service, about the size of the difference between two sodium measurements; not from a guideline).
    /// </summary>
    [Range(0, 10)]
    public double ApproachingWithinMmolPerL { get; set; } = 2;

    /// <summary>
    /// A projection of the current rate to the end of the window counts as "approaching" only after this many hours of
    /// measured rise, so that one early pair of results does not raise an alarm. Default 4 h (design choice).
    /// </summary>
    [Range(0, 24)]
    public double ProjectAfterHours { get; set; } = 4;

    /// <summary>
    /// The nadir that starts the current episode is the lowest sodium within this many hours before the latest result.
    /// Default 72 h (design choice: three days covers the windows the limits speak of, and an old low from an earlier
    /// admission does not start today's episode).
    /// </summary>
    [Range(24, 24 * 14)]
    public double EpisodeLookbackHours { get; set; } = 72;

    /// <summary>
    /// No rate is computed between two results less than this many hours apart: over a shorter span the difference is
    /// mostly measurement and specimen variation (and often a preliminary beside its correction), and a per-day rate
    /// extrapolated from it is meaningless. Default 2 h (common practice: sodium is usually rechecked every 2–6 h during
    /// active correction).
    /// </summary>
    [Range(0, 24)]
    public double MinimumRateSpanHours { get; set; } = 2;

    /// <summary>A nadir at or below this, mmol/L, puts the patient at high risk. Default 105 (US panel, Verbalis et al. 2013; secondary).</summary>
    [Range(90, 130)]
    public double HighRiskNadirAtOrBelow { get; set; } = 105;

    /// <summary>
    /// Potassium below this, mmol/L, counts as low when the laboratory sent no lower reference limit. Default 3.5
    /// (common practice: the usual lower reference limit of serum potassium).
    /// </summary>
    [Range(2, 5)]
    public double LowPotassiumBelow { get; set; } = 3.5;

    /// <summary>The effective limits after applying <see cref="Preset"/>.</summary>
    public CorrectionLimits Resolve() => Preset switch
    {
        CorrectionRatePreset.European2014 => new CorrectionLimits(
            "2014 European guideline",
            EuropeanFirstDay,
            EuropeanLaterDay,
            EuropeanFirstDay + EuropeanLaterDay,
            UsPanelHighRiskDay,
            2 * UsPanelHighRiskDay,
            UsPanelMinimumGoal,
            UsPanelMinimumGoal,
            "2014 European clinical practice guideline on hyponatraemia (Spasovski et al., Eur J Endocrinol 2014;170:G1): ≤ 10 mmol/L in the first 24 h, ≤ 8 mmol/L in each 24 h after; high-risk limit and minimum goal from the US expert panel (Verbalis et al., Am J Med 2013;126:S1)"),
        CorrectionRatePreset.UsExpertPanel2013 => new CorrectionLimits(
            "US expert panel 2013",
            UsPanelDay,
            UsPanelDay,
            UsPanelTwoDays,
            UsPanelHighRiskDay,
            2 * UsPanelHighRiskDay,
            UsPanelMinimumGoal,
            UsPanelMinimumGoal,
            "US expert panel (Verbalis et al., Am J Med 2013;126:S1): 10–12 mmol/L in any 24 h (the lower end is used) or 18 mmol/L in 48 h; 8 mmol/L in any 24 h at high risk; minimum goal 4–8 mmol/L per day (4–6 at high risk)"),
        _ => new CorrectionLimits(
            "local limits",
            FirstDayLimit,
            LaterDayLimit,
            TwoDayLimit,
            HighRiskDayLimit,
            HighRiskTwoDayLimit,
            MinimumDailyGoal,
            MinimumDailyGoalHighRisk,
            CustomSource),
    };

    /// <summary>Checks across settings: no high-risk limit above the usual one, no 24-h limit above the 48-h limit.</summary>
    public IEnumerable<ValidationResult> Validate(ValidationContext validationContext)
    {
        var limits = Resolve();
        if (!(limits.HighRiskDay <= Math.Min(limits.FirstDay, limits.LaterDay) && limits.HighRiskTwoDays <= limits.TwoDays
            && Math.Max(limits.FirstDay, limits.LaterDay) <= limits.TwoDays))
        {
            yield return new ValidationResult($"{OptionsPath.Of(validationContext)}: high-risk limits must not exceed the usual ones, and no 24-h limit may exceed the 48-h limit.", [nameof(HighRiskDayLimit)]);
        }
    }
}
