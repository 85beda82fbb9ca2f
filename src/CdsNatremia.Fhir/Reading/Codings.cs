using CdsNatremia.Core.Facts;
using Hl7.Fhir.Model;

namespace CdsNatremia.Fhir.Reading;

/// <summary>Turns FHIR CodeableConcepts into the core's <see cref="CodeRef"/>s.</summary>
public static class Codings
{
    /// <summary>Every coding that has both a system and a code.</summary>
    public static IReadOnlyList<CodeRef> Of(CodeableConcept? concept)
        => concept?.Coding?
            .Where(c => c is not null && !string.IsNullOrWhiteSpace(c.System) && !string.IsNullOrWhiteSpace(c.Code))
            .Select(c => new CodeRef(c.System!, c.Code!.Trim(), c.Display))
            .ToList() ?? [];

    /// <summary>The concept's text, else its first display.</summary>
    public static string? TextOf(CodeableConcept? concept)
        => !string.IsNullOrWhiteSpace(concept?.Text) ? concept.Text : concept?.Coding?.FirstOrDefault(c => c is not null && !string.IsNullOrWhiteSpace(c.Display))?.Display;
}
