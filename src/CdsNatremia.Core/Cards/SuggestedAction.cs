namespace CdsNatremia.Core.Cards;

/// <summary>One action of a suggestion. Create carries a <see cref="LabOrderProposal"/>; delete names a draft resource.</summary>
/// <param name="Kind">create, update or delete.</param>
/// <param name="Description">What the action does, for a person.</param>
/// <param name="Create">For create: the test to order.</param>
/// <param name="ResourceId">For delete: the relative reference of the draft, e.g. "MedicationRequest/draft-1".</param>
public sealed record SuggestedAction(ActionKind Kind, string Description, LabOrderProposal? Create = null, string? ResourceId = null)
{
    /// <summary>An action that creates a draft laboratory order.</summary>
    public static SuggestedAction Order(LabOrderProposal proposal)
        => new(ActionKind.Create, OrderLabel(Guard.NotNull(proposal, nameof(proposal))), proposal);

    /// <summary>"Order Sodium, serum or plasma": the label and description of an order (plain text, from the catalogue).</summary>
    public static string OrderLabel(LabOrderProposal proposal)
        => Rendering.PhraseCatalogue.Default.Render(
            Findings.Finding.Of(Findings.FindingKind.OrderLabel, Findings.Slot.Verbatim("test", Guard.NotNull(proposal, nameof(proposal)).Display)),
            Text.TimeDisplay.Utc(default));

    /// <summary>An action that removes a draft order from the prescriber's basket.</summary>
    public static SuggestedAction Remove(string resourceReference, string description)
        => new(ActionKind.Delete, description, ResourceId: resourceReference);
}
