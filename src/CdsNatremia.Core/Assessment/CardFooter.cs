using CdsNatremia.Core.Cards;
using CdsNatremia.Core.Engine;
using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Text;

namespace CdsNatremia.Core.Assessment;

/// <summary>
/// The closing sections every card shares: data set aside, data notes, cautions and sources. Kept in one place so no
/// card can forget the cautions or hide what the service could not use.
/// </summary>
public static class CardFooter
{
    private const int MaxSetAsideShown = 20;

    /// <summary>Writes the shared closing sections.</summary>
    public static void Write(DetailWriter detail, PatientFacts facts, IEnumerable<string> sources, TimeDisplay display)
        => Write(detail, facts, sources, [], display);

    /// <summary>
    /// Writes the shared closing sections with the cautions that depend on the request: for a patient under the adult age,
    /// that adult thresholds and correction limits may not apply (<see cref="SafetyCautions.Paediatric"/>).
    /// </summary>
    public static void Write(DetailWriter detail, DecisionContext context, IEnumerable<string> sources)
    {
        Guard.NotNull(context, nameof(context));
        var age = context.Request.Facts.AgeAt(context.Request.Now);
        var adultFrom = context.Options.Severity.AdultFromAgeYears;
        Write(detail, context.Request.Facts, sources, age < adultFrom ? [Rendering.PhraseCatalogue.Default.Render(SafetyCautions.Paediatric(age.Value, adultFrom), context.Display)] : [], context.Display);
    }

    private static void Write(DetailWriter detail, PatientFacts facts, IEnumerable<string> sources, IReadOnlyList<string> requestCautions, TimeDisplay display)
    {
        Guard.NotNull(detail, nameof(detail));
        Guard.NotNull(facts, nameof(facts));
        var setAside = facts.SetAside.Where(s => s.State != FactState.NotThisPatient).Select(s => Cite.SetAside(s, display)).ToList();
        if (setAside.Count > MaxSetAsideShown)
        {
            var more = setAside.Count - MaxSetAsideShown;
            setAside = [.. setAside.Take(MaxSetAsideShown), Invariant.Format($"…and {more} more.")];
        }

        // Another patient's data: a count only, never values, ids or times (privacy), and never a reason for a conclusion.
        if (facts.AboutAnotherPatientCount is var others and > 0)
        {
            setAside.Add(Invariant.Format(
                $"{others} {(others == 1 ? "resource" : "resources")} about another patient {(others == 1 ? "was" : "were")} ignored (not shown, not used); check how the EHR selects this patient's data."));
        }

        detail.Bullets("Data set aside (not used, with the reason)", setAside);
        detail.Bullets(
            "Data the service could not use",
            facts.Unavailable.OrderBy(kv => kv.Key, StringComparer.Ordinal).Select(kv => $"{Markdown.Escape(kv.Key)}: {Markdown.Escape(kv.Value)}"));
        detail.Bullets("Data notes", facts.DataNotes.Select(Markdown.Escape));
        detail.Bullets(SafetyCautions.Heading, [.. requestCautions, .. SafetyCautions.All]);
        detail.Bullets("Sources", sources);
    }
}
