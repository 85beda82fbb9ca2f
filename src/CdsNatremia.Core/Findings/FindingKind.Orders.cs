namespace CdsNatremia.Core.Findings;

/// <summary>The names of the tests the cards propose and the wording of their suggestions (plain text: labels and order reasons are not Markdown).</summary>
public static partial class FindingKind
{
    /// <summary>Suggestion label and action description: order a test.</summary>
    public const string OrderLabel = "order.label";

    /// <summary>Test name: LOINC 2951-2.</summary>
    public const string LabSerumSodium = "lab.sodium.serum";

    /// <summary>Test name: LOINC 2947-0.</summary>
    public const string LabBloodSodium = "lab.sodium.blood";

    /// <summary>Test name: LOINC 2692-2.</summary>
    public const string LabSerumOsmolality = "lab.osmolality.serum";

    /// <summary>Test name: LOINC 2695-5.</summary>
    public const string LabUrineOsmolality = "lab.osmolality.urine";

    /// <summary>Test name: LOINC 2955-3.</summary>
    public const string LabUrineSodium = "lab.sodium.urine";

    /// <summary>Test name: LOINC 2345-7.</summary>
    public const string LabGlucose = "lab.glucose";

    /// <summary>Test name: LOINC 3016-3.</summary>
    public const string LabThyrotropin = "lab.thyrotropin";

    /// <summary>Test name: LOINC 2143-6.</summary>
    public const string LabCortisol = "lab.cortisol";

    /// <summary>Test name: LOINC 2571-8.</summary>
    public const string LabTriglyceride = "lab.triglyceride";

    /// <summary>Test name: LOINC 2885-2.</summary>
    public const string LabTotalProtein = "lab.total-protein";

    /// <summary>Test name: LOINC 2823-3.</summary>
    public const string LabPotassium = "lab.potassium";
}
