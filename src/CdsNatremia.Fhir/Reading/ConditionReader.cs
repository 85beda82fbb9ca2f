using System.Collections.Frozen;
using CdsNatremia.Core.Facts;
using Hl7.Fhir.Model;

namespace CdsNatremia.Fhir.Reading;

/// <summary>
/// Keeps a Condition that is this patient's, clinically active (active, recurrence, relapse, or not stated) and not
/// refuted or entered in error. Others are skipped silently: a resolved condition is not a clue.
/// </summary>
public static class ConditionReader
{
    private static readonly FrozenSet<string> ActiveStatuses = FrozenSet.Create(StringComparer.Ordinal, "active", "recurrence", "relapse");
    private static readonly FrozenSet<string> ExcludedVerification = FrozenSet.Create(StringComparer.Ordinal, "refuted", "entered-in-error");

    /// <summary>Reads one Condition, or returns null when it does not count.</summary>
    public static ConditionFact? Read(Condition condition, string patientId)
    {
        ArgumentNullException.ThrowIfNull(condition);
        if (string.IsNullOrEmpty(condition.Id) || !References.IsPatient(condition.Subject?.Reference, patientId))
        {
            return null;
        }

        var clinical = condition.ClinicalStatus?.Coding?.Select(c => c.Code).FirstOrDefault(c => c is not null);
        if (clinical is not null && !ActiveStatuses.Contains(clinical))
        {
            return null;
        }

        if (condition.VerificationStatus?.Coding?.Any(c => c.Code is not null && ExcludedVerification.Contains(c.Code)) == true)
        {
            return null;
        }

        var codes = Codings.Of(condition.Code);
        return codes.Count == 0 && string.IsNullOrWhiteSpace(condition.Code?.Text)
            ? null
            : new ConditionFact(condition.Id, codes, Codings.TextOf(condition.Code), FhirTime.From(condition.Onset));
    }
}
