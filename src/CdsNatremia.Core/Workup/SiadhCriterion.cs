using CdsNatremia.Core.Findings;

namespace CdsNatremia.Core.Workup;

/// <summary>One SIADH essential criterion with its state and the data behind it, as findings.</summary>
/// <param name="Name">The criterion (its kind names it, e.g. <see cref="FindingKind.SiadhNameEffective"/>, with its threshold).</param>
/// <param name="Status">Met, not met, unknown, could not be read, or for the clinician.</param>
/// <param name="Data">The data it rests on (a result, a bound, what could not be read and why, or what is missing).</param>
public sealed record SiadhCriterion(Finding Name, CriterionStatus Status, Finding Data)
{
    /// <summary>The state as a phrase kind.</summary>
    public string StatusKind => Status switch
    {
        CriterionStatus.Met => FindingKind.SiadhStatusMet,
        CriterionStatus.NotMet => FindingKind.SiadhStatusNotMet,
        CriterionStatus.Unknown => FindingKind.SiadhStatusUnknown,
        CriterionStatus.CouldNotBeRead => FindingKind.SiadhStatusCouldNotBeRead,
        _ => FindingKind.SiadhStatusClinician,
    };

    /// <summary>The criterion's line in the checklist, numbered from 1.</summary>
    public Finding Line(int number) => Finding.Of(
        FindingKind.SiadhLine,
        Slot.Count("index", number),
        Slot.Phrase("name", Name),
        Slot.Phrase("status", Finding.Of(StatusKind)),
        Slot.Phrase("data", Data)) with
    {
        Certainty = Status switch
        {
            CriterionStatus.Met or CriterionStatus.NotMet => Certainty.Established,
            CriterionStatus.CouldNotBeRead => Certainty.CouldNotBeRead,
            _ => Certainty.Unknown,
        },
        Evidence = Data.Evidence,
    };
}
