namespace CdsNatremia.Core.CorrectionRate;

/// <summary>
/// Resolved correction limits, all in mmol/L of rise in serum sodium. Immutable. A rise equal to a limit counts as
/// reaching it ("at or past" the limit).
/// </summary>
/// <param name="Name">Short name of the limit set for cards, e.g. "2014 European guideline".</param>
/// <param name="FirstDay">Largest rise in the first 24 h after the nadir.</param>
/// <param name="LaterDay">Largest rise in any later 24 h.</param>
/// <param name="TwoDays">Largest rise in the first 48 h after the nadir (or any later 48 h).</param>
/// <param name="HighRiskDay">Largest rise in any 24 h for a patient at high risk of osmotic demyelination.</param>
/// <param name="HighRiskTwoDays">Largest rise in 48 h for a patient at high risk.</param>
/// <param name="MinimumDailyGoal">Smallest daily rise that is a useful correction of profound hyponatremia.</param>
/// <param name="MinimumDailyGoalHighRisk">The same for a patient at high risk.</param>
/// <param name="Source">Citation printed on cards.</param>
public sealed record CorrectionLimits(
    string Name,
    double FirstDay,
    double LaterDay,
    double TwoDays,
    double HighRiskDay,
    double HighRiskTwoDays,
    double MinimumDailyGoal,
    double MinimumDailyGoalHighRisk,
    string Source)
{
    /// <summary>The 24-h limit for a window that starts at the nadir (first day) or later, for a risk level.</summary>
    public double Day(bool firstDay, bool highRisk) => highRisk ? HighRiskDay : firstDay ? FirstDay : LaterDay;

    /// <summary>The 48-h limit for a risk level.</summary>
    public double TwoDay(bool highRisk) => highRisk ? HighRiskTwoDays : TwoDays;

    /// <summary>The minimum daily goal for a risk level.</summary>
    public double MinimumGoal(bool highRisk) => highRisk ? MinimumDailyGoalHighRisk : MinimumDailyGoal;
}
