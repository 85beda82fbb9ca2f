using System.Text.Json.Nodes;

namespace CdsNatremia.Service.Tests.Support;

/// <summary>
/// Everything a card says in words: its short detail and the full report its findings extension carries (the same text
/// the card's report link shows). Tests of wording that moved from the card to the report read both.
/// </summary>
internal static class CardTextExtensions
{
    public static string CardText(this JsonNode? card)
    {
        ArgumentNullException.ThrowIfNull(card);
        var detail = (string?)card["detail"] ?? string.Empty;
        var report = (string?)card["extension"]?["cdsnatremia-findings"]?["report"] ?? string.Empty;
        return detail + "\n\n" + report;
    }
}
