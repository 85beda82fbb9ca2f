namespace CdsNatremia.Core.Text;

/// <summary>A duration as a clinician reads it: whole days from 48 h on when the hours make whole days, else hours.</summary>
public static class ClinicalDuration
{
    /// <summary>"7 days" for 168, "2 days" for 48, "24 h" for 24, "36 h" for 36, "50 h" for 50.</summary>
    public static string Hours(double hours)
        => hours >= 48 && hours % 24 == 0
            ? Invariant.Format($"{Invariant.Number(hours / 24)} days")
            : Invariant.Format($"{Invariant.Number(hours)} h");
}
