using System.Text.Json;
using CdsNatremia.Core.Facts;

namespace CdsNatremia.Fhir.Reading;

/// <summary>
/// An Observation entry that could not be parsed as FHIR R4 (a value such as 1e400 or "NaN", a wrong JSON type), with
/// what can still be told from its raw JSON: its LOINC code, its time and whose it is. This lets the service say "the
/// newest sodium could not be read" instead of falling silent. Nothing here is used as a value.
/// </summary>
/// <param name="Reference">"Observation/{id}", or "entry N" when it had no id.</param>
/// <param name="Reason">Why it could not be read.</param>
/// <param name="LoincCode">The first LOINC code found in code.coding, when any.</param>
/// <param name="At">effectiveDateTime, effectiveInstant, effectivePeriod.start or issued, when readable.</param>
/// <param name="SubjectReference">subject.reference as sent.</param>
public sealed record UnreadableObservation(string Reference, string Reason, string? LoincCode, DateTimeOffset? At, string? SubjectReference)
{
    /// <summary>Reads what can be told from the raw JSON of an Observation that did not parse.</summary>
    public static UnreadableObservation From(JsonElement raw, string reference, string reason)
    {
        string? code = null;
        if (raw.TryGetProperty("code", out var concept) && concept.ValueKind == JsonValueKind.Object
            && concept.TryGetProperty("coding", out var codings) && codings.ValueKind == JsonValueKind.Array)
        {
            code = codings.EnumerateArray()
                .Where(c => c.ValueKind == JsonValueKind.Object && String(c, "system") == CodeSystems.Loinc)
                .Select(c => String(c, "code"))
                .FirstOrDefault(c => c is not null);
        }

        var at = FhirTime.From(String(raw, "effectiveDateTime") ?? String(raw, "effectiveInstant") ?? PeriodStart(raw) ?? String(raw, "issued"));
        var subject = raw.TryGetProperty("subject", out var s) && s.ValueKind == JsonValueKind.Object ? String(s, "reference") : null;
        return new UnreadableObservation(reference, reason, code, at, subject);
    }

    private static string? PeriodStart(JsonElement raw)
        => raw.TryGetProperty("effectivePeriod", out var p) && p.ValueKind == JsonValueKind.Object ? String(p, "start") : null;

    private static string? String(JsonElement element, string name)
        => element.TryGetProperty(name, out var v) && v.ValueKind == JsonValueKind.String ? v.GetString() : null;
}
