namespace CdsNatremia.Core.Facts;

/// <summary>
/// A piece of data the service received but did not use, with the reason. Cards list these so a clinician
/// never mistakes silence for a normal result.
/// </summary>
/// <param name="Reference">"Observation/na-9", or a prefetch key such as "prefetch 'sodium'".</param>
/// <param name="What">A short description for a person, e.g. "Sodium 131 mg/dL".</param>
/// <param name="Reason">Why it was not used, in plain words.</param>
/// <param name="Analyte">The analyte it would have been, when known.</param>
/// <param name="At">The result's time, when known.</param>
/// <param name="State">
/// Why it is not used, as a <see cref="FactState"/>: <see cref="FactState.Unreadable"/> (the default),
/// <see cref="FactState.Superseded"/>, <see cref="FactState.NotThisPatient"/> (then only counted: the reader keeps no
/// value, id or time) or <see cref="FactState.Absent"/> (withdrawn by the laboratory, or no result yet).
/// </param>
public sealed record SetAsideItem(string Reference, string What, string Reason, Analyte? Analyte = null, DateTimeOffset? At = null, FactState State = FactState.Unreadable)
{
    /// <summary>An item about another patient: counted only, with nothing that identifies it or its values.</summary>
    public static SetAsideItem AboutAnotherPatient(string resourceType, Analyte? analyte = null)
        => new(string.Empty, resourceType, "it is about another patient", analyte, null, FactState.NotThisPatient);
}
