using CdsNatremia.Core.Cards;
using CdsNatremia.Core.Findings;
using CdsNatremia.Core.Rendering;

namespace CdsNatremia.Core.Assessment;

/// <summary>
/// The tests the work-up may propose, with their LOINC codes (clinical reference sheet, verified). Their names are in the
/// phrase catalogue (<c>Phrases/Orders.resx</c>).
/// </summary>
public static class LabOrders
{
    /// <summary>The reason a draft order gives, worded from the catalogue (reasons carry no times).</summary>
    public static string Why(string kind, params Findings.Slot[] slots)
        => Rendering.PhraseCatalogue.Default.Render(Findings.Finding.Of(kind, slots), Text.TimeDisplay.Utc(DateTimeOffset.UnixEpoch));

    /// <summary>Sodium [Moles/volume] in Serum or Plasma, LOINC 2951-2.</summary>
    public static LabOrderProposal SerumSodium(string reason, double? withinHours = null)
        => new("2951-2", Name(FindingKind.LabSerumSodium), reason, withinHours);

    /// <summary>Sodium [Moles/volume] in Blood, LOINC 2947-0: a blood-gas (direct ion-selective electrode) sodium.</summary>
    public static LabOrderProposal BloodSodium(string reason)
        => new("2947-0", Name(FindingKind.LabBloodSodium), reason);

    /// <summary>Osmolality of Serum or Plasma, LOINC 2692-2.</summary>
    public static LabOrderProposal SerumOsmolality(string reason) => new("2692-2", Name(FindingKind.LabSerumOsmolality), reason);

    /// <summary>Osmolality of Urine, LOINC 2695-5.</summary>
    public static LabOrderProposal UrineOsmolality(string reason) => new("2695-5", Name(FindingKind.LabUrineOsmolality), reason);

    /// <summary>Sodium [Moles/volume] in Urine, LOINC 2955-3.</summary>
    public static LabOrderProposal UrineSodium(string reason) => new("2955-3", Name(FindingKind.LabUrineSodium), reason);

    /// <summary>Glucose [Mass/volume] in Serum or Plasma, LOINC 2345-7.</summary>
    public static LabOrderProposal Glucose(string reason) => new("2345-7", Name(FindingKind.LabGlucose), reason);

    /// <summary>Thyrotropin [Units/volume] in Serum or Plasma, LOINC 3016-3 (LOINC prefers 11579-0 or 11580-8 for current assays; labs map).</summary>
    public static LabOrderProposal Thyrotropin(string reason) => new("3016-3", Name(FindingKind.LabThyrotropin), reason);

    /// <summary>Cortisol [Mass/volume] in Serum or Plasma, LOINC 2143-6.</summary>
    public static LabOrderProposal Cortisol(string reason) => new("2143-6", Name(FindingKind.LabCortisol), reason);

    /// <summary>Triglyceride [Mass/volume] in Serum or Plasma, LOINC 2571-8.</summary>
    public static LabOrderProposal Triglyceride(string reason) => new("2571-8", Name(FindingKind.LabTriglyceride), reason);

    /// <summary>Protein [Mass/volume] in Serum or Plasma, LOINC 2885-2.</summary>
    public static LabOrderProposal TotalProtein(string reason) => new("2885-2", Name(FindingKind.LabTotalProtein), reason);

    /// <summary>Potassium [Moles/volume] in Serum or Plasma, LOINC 2823-3.</summary>
    public static LabOrderProposal Potassium(string reason) => new("2823-3", Name(FindingKind.LabPotassium), reason);

    /// <summary>A suggestion with one create action; recommended only when <paramref name="recommended"/>.</summary>
    public static Suggestion AsSuggestion(LabOrderProposal proposal, bool recommended)
        => new(SuggestedAction.OrderLabel(Guard.NotNull(proposal, nameof(proposal))), [SuggestedAction.Order(proposal)], recommended, "order-" + proposal.LoincCode);

    /// <summary>A test's name from the phrase catalogue (plain text).</summary>
    private static string Name(string kind) => PhraseCatalogue.Default.Text(kind);
}
