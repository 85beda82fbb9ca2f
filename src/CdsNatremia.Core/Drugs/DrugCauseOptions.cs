using System.ComponentModel.DataAnnotations;

namespace CdsNatremia.Core.Drugs;

/// <summary>
/// Thresholds of the drug-cause reasoning (<see cref="DrugCauseRule"/>) and the prescribing warning
/// (<see cref="DrugOrderWarningProducer"/>). Bound from "Natremia:Rules:DrugCause".
/// </summary>
public sealed class DrugCauseOptions
{
    /// <summary>
    /// The smallest drop in sodium, mmol/L, that counts as a fall. Default 4: larger than the usual analytical and
    /// day-to-day variation of serum sodium, about 2–3 mmol/L (common practice; the variation figure is from memory).
    /// Used twice: to find the result before the fall (<see cref="SodiumFall"/>) and to call a normal sodium "falling".
    /// </summary>
    [Range(1, 20)]
    public double MeaningfulDropMmolPerL { get; set; } = 4;

    /// <summary>
    /// How far back from the latest result, in hours, a higher result makes the sodium "falling" on the order hooks.
    /// Default 168 (7 days; common practice: thiazide and SSRI effects on sodium usually appear within days to weeks).
    /// </summary>
    [Range(1, 2160)]
    public double FallingWindowHours { get; set; } = 168;

    /// <summary>When true (default), ordering a drug that can lower sodium for an older patient with no recent sodium gives a warning.</summary>
    public bool WarnWhenSodiumAbsent { get; set; } = true;

    /// <summary>
    /// Age in years from which a missing sodium matters. Default 65: older age is a recognised risk factor for
    /// drug-induced hyponatremia (common practice).
    /// </summary>
    [Range(0, 130)]
    public int AbsentSodiumMinimumAgeYears { get; set; } = 65;

    /// <summary>
    /// A sodium older than this many days does not count as a recent baseline for the absent-sodium warning.
    /// Default 180 (six months; common practice, no single source).
    /// </summary>
    [Range(1, 3650)]
    public double RecentSodiumDays { get; set; } = 180;

    /// <summary>
    /// The recheck proposed when a drug that can lower sodium is kept, in hours. Default 168 (within a week;
    /// common practice: sodium is usually rechecked within the first one to two weeks of a thiazide or SSRI).
    /// </summary>
    [Range(1, 2160)]
    public double RecheckWithinHours { get; set; } = 168;

    /// <summary>The recheck proposed when the latest sodium is profound, in hours. Default 24 (common practice).</summary>
    [Range(1, 2160)]
    public double ProfoundRecheckWithinHours { get; set; } = 24;

    /// <summary>
    /// A medicine recorded as stopped or completed counts as "recently stopped" when it ended within this many days before
    /// the assessment: a possible contributor (never "likely" once stopped), and it fails the SIADH "no recent diuretic
    /// use" criterion. Default 14 days (from memory: the effect of a thiazide on sodium can outlast the last dose by about
    /// one to two weeks). Filtered here, in code, because prefetch tokens cannot express dates.
    /// </summary>
    [Range(0, 365)]
    public double RecentlyStoppedWithinDays { get; set; } = 14;

    /// <summary>When true (default), drugs of the secondary tier ("other known contributors") also raise the order warning.</summary>
    public bool WarnOnSecondaryTier { get; set; } = true;
}
