using CdsNatremia.Core.Cards;

namespace CdsNatremia.Core.Assessment;

/// <summary>The tests the work-up may propose, with their LOINC codes (clinical reference sheet, verified).</summary>
public static class LabOrders
{
    /// <summary>The reason a draft order gives, worded from the catalogue (reasons carry no times).</summary>
    public static string Why(string kind, params Findings.Slot[] slots)
        => Rendering.PhraseCatalogue.Default.Render(Findings.Finding.Of(kind, slots), Text.TimeDisplay.Utc(DateTimeOffset.UnixEpoch));

    /// <summary>Sodium [Moles/volume] in Serum or Plasma, LOINC 2951-2.</summary>
    public static LabOrderProposal SerumSodium(string reason, double? withinHours = null)
        => new("2951-2", "Sodium, serum or plasma", reason, withinHours);

    /// <summary>Sodium [Moles/volume] in Blood, LOINC 2947-0: a blood-gas (direct ion-selective electrode) sodium.</summary>
    public static LabOrderProposal BloodSodium(string reason)
        => new("2947-0", "Sodium, blood (blood gas, direct ion-selective electrode)", reason);

    /// <summary>Osmolality of Serum or Plasma, LOINC 2692-2.</summary>
    public static LabOrderProposal SerumOsmolality(string reason) => new("2692-2", "Osmolality, serum or plasma", reason);

    /// <summary>Osmolality of Urine, LOINC 2695-5.</summary>
    public static LabOrderProposal UrineOsmolality(string reason) => new("2695-5", "Osmolality, urine", reason);

    /// <summary>Sodium [Moles/volume] in Urine, LOINC 2955-3.</summary>
    public static LabOrderProposal UrineSodium(string reason) => new("2955-3", "Sodium, urine (spot)", reason);

    /// <summary>Glucose [Mass/volume] in Serum or Plasma, LOINC 2345-7.</summary>
    public static LabOrderProposal Glucose(string reason) => new("2345-7", "Glucose, serum or plasma", reason);

    /// <summary>Thyrotropin [Units/volume] in Serum or Plasma, LOINC 3016-3 (LOINC prefers 11579-0 or 11580-8 for current assays; labs map).</summary>
    public static LabOrderProposal Thyrotropin(string reason) => new("3016-3", "TSH, serum or plasma", reason);

    /// <summary>Cortisol [Mass/volume] in Serum or Plasma, LOINC 2143-6.</summary>
    public static LabOrderProposal Cortisol(string reason) => new("2143-6", "Cortisol, serum or plasma", reason);

    /// <summary>Triglyceride [Mass/volume] in Serum or Plasma, LOINC 2571-8.</summary>
    public static LabOrderProposal Triglyceride(string reason) => new("2571-8", "Triglyceride, serum or plasma", reason);

    /// <summary>Protein [Mass/volume] in Serum or Plasma, LOINC 2885-2.</summary>
    public static LabOrderProposal TotalProtein(string reason) => new("2885-2", "Total protein, serum or plasma", reason);

    /// <summary>Potassium [Moles/volume] in Serum or Plasma, LOINC 2823-3.</summary>
    public static LabOrderProposal Potassium(string reason) => new("2823-3", "Potassium, serum or plasma", reason);

    /// <summary>A suggestion with one create action; recommended only when <paramref name="recommended"/>.</summary>
    public static Suggestion AsSuggestion(LabOrderProposal proposal, bool recommended)
        => new("Order " + proposal.Display, [SuggestedAction.Order(proposal)], recommended, "order-" + proposal.LoincCode);
}
