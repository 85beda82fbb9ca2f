namespace CdsNatremia.Core.Cards;

/// <summary>A CDS Hooks suggestion: a label and the actions the EHR performs if the clinician accepts it.</summary>
/// <param name="Label">Short text for the button.</param>
/// <param name="Actions">The actions, in order.</param>
/// <param name="IsRecommended">True when the service recommends this suggestion; never for a normal sodium.</param>
/// <param name="Key">A stable key of our own for the suggestion (e.g. "order-serum-osmolality"), for audit and feedback.</param>
public sealed record Suggestion(string Label, IReadOnlyList<SuggestedAction> Actions, bool? IsRecommended, string Key);
