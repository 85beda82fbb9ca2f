using CdsNatremia.Core.Cards;

namespace CdsNatremia.Service.Hooks;

/// <summary>A card as it was sent: its uuid and the uuids given to its suggestions (for audit and feedback).</summary>
/// <param name="Uuid">The card uuid.</param>
/// <param name="Card">The card.</param>
/// <param name="SuggestionUuids">Suggestion uuid by suggestion key.</param>
public sealed record IssuedCard(Guid Uuid, Card Card, IReadOnlyDictionary<string, Guid> SuggestionUuids)
{
    /// <summary>The id of the card's full report link, when it has one.</summary>
    public string? ReportId { get; init; }
}
