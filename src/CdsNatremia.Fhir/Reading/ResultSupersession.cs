using CdsNatremia.Core.Facts;
using Hl7.Fhir.Model;

namespace CdsNatremia.Fhir.Reading;

/// <summary>
/// Finds results that a later version of the same result replaces, so that a preliminary value corrected an hour later
/// never drives a rate alarm. A result supersedes another of the same LOINC code when its status ranks higher
/// (amended or corrected over final over preliminary; FHIR R4 observation-status: "amended: subsequent to being final,
/// the observation has been modified"; "corrected" is a kind of amended) and they are the same specimen, which the
/// service accepts only on one of:
/// <list type="bullet">
/// <item>the same effective time (to the second): the same collection;</item>
/// <item>a shared identifier (system and value);</item>
/// <item>the newer one's <c>derivedFrom</c> names the older Observation;</item>
/// <item>the same <c>specimen</c> reference.</item>
/// </list>
/// A shared <c>basedOn</c> alone is not enough: one standing order (sodium every 6 h) covers several collections; with
/// the same time it is already covered by the first rule. Two results of equal rank never supersede each other (two
/// measurements at the same minute are handled by the correction-rate rules). Pure.
/// </summary>
public static class ResultSupersession
{
    /// <summary>Splits the results into those that stand and those superseded (as set-aside items naming their correction).</summary>
    public static (IReadOnlyList<LabResult> Current, IReadOnlyList<SetAsideItem> Superseded) Apply(IReadOnlyList<(Observation Observation, LabResult Result)> results)
    {
        ArgumentNullException.ThrowIfNull(results);
        var superseded = new Dictionary<LabResult, (LabResult By, Observation ByObservation, string How)>(ReferenceEqualityComparer.Instance);
        foreach (var (newer, newerResult) in results)
        {
            var rank = Rank(newer);
            if (rank == 0)
            {
                continue;
            }

            foreach (var (older, olderResult) in results)
            {
                if (ReferenceEquals(older, newer) || olderResult.Analyte != newerResult.Analyte
                    || !string.Equals(olderResult.LoincCode, newerResult.LoincCode, StringComparison.Ordinal) || Rank(older) >= rank)
                {
                    continue;
                }

                if (SameSpecimen(newer, newerResult, older, olderResult) is { } how && !superseded.ContainsKey(olderResult))
                {
                    superseded[olderResult] = (newerResult, newer, how);
                }
            }
        }

        var current = results.Select(r => r.Result).Where(r => !superseded.ContainsKey(r)).ToList();
        var items = superseded
            .Select(kv => new SetAsideItem(
                kv.Key.Reference,
                AnalyteUnits.DisplayName(kv.Key.Analyte) + " " + Bounds.Describe(kv.Key) + " " + kv.Key.Unit + (kv.Key.IsPreliminary ? " (preliminary)" : string.Empty),
                $"superseded by {kv.Value.By.Reference} ({StatusText(kv.Value.ByObservation)}, {kv.Value.How}); the correction is used",
                kv.Key.Analyte,
                kv.Key.EffectiveAt,
                FactState.Superseded))
            .OrderBy(i => i.Reference, StringComparer.Ordinal)
            .ToList();
        return (current, items);
    }

    /// <summary>0 preliminary, 1 final, 2 amended or corrected.</summary>
    private static int Rank(Observation observation) => observation.Status switch
    {
        ObservationStatus.Amended or ObservationStatus.Corrected => 2,
        ObservationStatus.Final => 1,
        _ => 0,
    };

    private static string? SameSpecimen(Observation newer, LabResult newerResult, Observation older, LabResult olderResult)
    {
        if (newerResult.EffectiveAt == olderResult.EffectiveAt)
        {
            return "same collection time";
        }

        if (newerResult.Identifiers.Intersect(olderResult.Identifiers, StringComparer.Ordinal).Any())
        {
            return "same identifier";
        }

        if (newer.DerivedFrom?.Any(d => References.IdOf(d?.Reference, "Observation") is { } id && id == older.Id) == true)
        {
            return "derivedFrom names it";
        }

        var specimen = newer.Specimen?.Reference;
        return !string.IsNullOrEmpty(specimen) && string.Equals(specimen, older.Specimen?.Reference, StringComparison.Ordinal)
            ? "same specimen"
            : null;
    }

    private static string StatusText(Observation observation) => observation.StatusElement?.JsonValue as string ?? "final";
}
