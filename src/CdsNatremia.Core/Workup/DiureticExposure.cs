using CdsNatremia.Core.Drugs;
using CdsNatremia.Core.Engine;
using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Knowledge;
using CdsNatremia.Core.Text;

using CdsNatremia.Core.Findings;

namespace CdsNatremia.Core.Workup;

/// <summary>
/// The diuretics the patient takes (active or intended, not draft orders), with when they started. The work-up needs only
/// presence and timing: a diuretic makes urine sodium hard to read and fails the SIADH "no recent diuretic" criterion.
/// Drug-cause reasoning is not done here.
/// </summary>
/// <param name="Medication">The medication record.</param>
/// <param name="Match">Why it counts as a diuretic.</param>
public sealed record DiureticExposure(MedicationFact Medication, MedicationMatch Match)
{
    /// <summary>
    /// Knowledge sets read as diuretics: thiazides and loop diuretics, plus any set whose id names a diuretic (so a
    /// potassium-sparing set added later is picked up without a code change).
    /// </summary>
    public static IEnumerable<CodeSet> DiureticSets(KnowledgeBase knowledge)
        => Guard.NotNull(knowledge, nameof(knowledge)).WithIdPrefix("drug-")
            .Where(s => s.Id == "drug-thiazide" || s.Id.Contains("diuretic", StringComparison.Ordinal));

    /// <summary>Every diuretic in the record (statements and orders that are active or intended).</summary>
    public static IReadOnlyList<DiureticExposure> Find(DecisionContext context)
    {
        Guard.NotNull(context, nameof(context));
        var sets = DiureticSets(context.Knowledge).ToList();
        return context.Request.Facts.Medications
            .Where(m => m.Use is MedicationUse.Active or MedicationUse.Intended)
            .Select(m => sets.Select(s => MedicationMatching.Match(s, m)).OfType<MedicationMatch>().Select(match => new DiureticExposure(m, match)).FirstOrDefault())
            .OfType<DiureticExposure>()
            .OrderBy(d => d.Medication.Reference, StringComparer.Ordinal)
            .ToList();
    }

    /// <summary>
    /// Diuretics recorded as stopped or completed within the look-back (<see cref="DrugCauseOptions.RecentlyStoppedWithinDays"/>),
    /// dated or not (<see cref="RecentlyStopped"/>).
    /// </summary>
    public static IReadOnlyList<DiureticExposure> FindRecentlyStopped(DecisionContext context)
    {
        Guard.NotNull(context, nameof(context));
        var sets = DiureticSets(context.Knowledge).ToList();
        return RecentlyStopped.Find(context.Request.Facts, context.Request.Now, context.Options.DrugCause)
            .Select(m => sets.Select(s => MedicationMatching.Match(s, m)).OfType<MedicationMatch>().Select(match => new DiureticExposure(m, match)).FirstOrDefault())
            .OfType<DiureticExposure>()
            .ToList();
    }

    /// <summary>
    /// Recent diuretic use as a fact with its state: usable (the diuretics in use, intended, or stopped within the
    /// look-back with a date); could not be read (a medicine record whose product could not be read and that did not
    /// match a diuretic, a diuretic stopped on an unknown date, or a medication list that could not be obtained), naming
    /// the item by its own text; absent only after a real look at a readable list.
    /// </summary>
    public static Observed<IReadOnlyList<DiureticExposure>> Observe(DecisionContext context)
    {
        Guard.NotNull(context, nameof(context));
        var facts = context.Request.Facts;
        var stopped = FindRecentlyStopped(context);
        var found = Find(context).Concat(stopped.Where(d => RecentlyStopped.IsDated(d.Medication))).ToList();
        if (found.Count > 0)
        {
            return Observed<IReadOnlyList<DiureticExposure>>.Usable(found);
        }

        if (stopped.FirstOrDefault() is { } undated)
        {
            return Observed<IReadOnlyList<DiureticExposure>>.Unreadable(
                Phrases.Render(Finding.Of("cite.diuretic.stopped-undated", Slot.Verbatim("reference", undated.Medication.Reference)), Utc), undated.Medication.Text ?? undated.Match.Ingredient);
        }

        var recentStopped = RecentlyStopped.Find(facts, context.Request.Now, context.Options.DrugCause);
        var unreadable = facts.Medications.Where(m => m.Use is MedicationUse.Active or MedicationUse.Intended)
            .Concat(recentStopped)
            .Where(m => m.ProductUnreadable is not null)
            .OrderBy(m => m.Reference, StringComparer.Ordinal)
            .ToList();
        if (unreadable.FirstOrDefault() is { } medicine)
        {
            var first = Phrases.Render(Finding.Of("cite.diuretic.unreadable", Slot.Verbatim("reference", medicine.Reference), Slot.Verbatim("reason", medicine.ProductUnreadable!)), Utc);
            return Observed<IReadOnlyList<DiureticExposure>>.Unreadable(
                unreadable.Count > 1 ? Phrases.Render(Finding.Of("cite.diuretic.more-unreadable", Slot.Verbatim("first", first), Slot.Count("count", unreadable.Count - 1)), Utc) : first,
                medicine.Text);
        }

        var setAside = facts.SetAside.FirstOrDefault(i => i.State == FactState.Unreadable
            && (i.Reference.StartsWith("MedicationStatement/", StringComparison.Ordinal) || i.Reference.StartsWith("MedicationRequest/", StringComparison.Ordinal)));
        if (setAside is not null)
        {
            return Observed<IReadOnlyList<DiureticExposure>>.Unreadable(Phrases.Render(Finding.Of("cite.diuretic.unreadable", Slot.Verbatim("reference", setAside.Reference), Slot.Verbatim("reason", setAside.Reason)), Utc), setAside.What);
        }

        return WorkupData.MedicationsUnreadable(facts)
            ? Observed<IReadOnlyList<DiureticExposure>>.Unreadable(Phrases.Text("cite.diuretic.list-unavailable"))
            : Observed<IReadOnlyList<DiureticExposure>>.Absent(Phrases.Render(
                Finding.Of("cite.diuretic.none", Slot.Number("days", context.Options.DrugCause.RecentlyStoppedWithinDays)), Utc));
    }

    private static Rendering.PhraseCatalogue Phrases => Rendering.PhraseCatalogue.Default;

    private static TimeDisplay Utc => TimeDisplay.Utc(DateTimeOffset.UnixEpoch);

    /// <summary>True when the diuretic was (or may have been) in use at <paramref name="at"/>: started before it, or start unknown.</summary>
    public bool InUseAt(DateTimeOffset at) => Medication.Use == MedicationUse.Active && (Medication.StartedAt is not { } start || start <= at);

    /// <summary>"metolazone (thiazide or thiazide-like diuretic, MedicationStatement/s07-mtz, since 2026-02-24 00:00 UTC)".</summary>
    public Finding Describe()
    {
        var drug = Slot.Text("drug", Match.Ingredient);
        var set = Slot.Text("set", Match.Set.Label);
        if (Medication.Use == MedicationUse.Stopped)
        {
            return Finding.Of(FindingKind.DiureticDescribeStopped, drug, set, Slot.Phrase("when", RecentlyStopped.Stopped(Medication))).RestingOn(Medication.Reference);
        }

        var since = Medication.StartedAt is { } start
            ? Finding.Of(FindingKind.DiureticSince, Slot.Time("time", start))
            : Finding.Of(FindingKind.DiureticSinceUnknown);
        return Finding.Of(
            Medication.Use == MedicationUse.Intended ? FindingKind.DiureticDescribeIntended : FindingKind.DiureticDescribe,
            drug,
            set,
            Slot.Text("reference", Medication.Reference),
            Slot.Phrase("since", since)).RestingOn(Medication.Reference);
    }
}
