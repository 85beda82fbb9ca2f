namespace CdsNatremia.Core.Findings;

/// <summary>
/// The kinds of finding, one constant per phrase of the catalogue (<c>src/CdsNatremia.Core/Phrases/*.resx</c>). Split by
/// area into partial files (<c>FindingKind.*.cs</c>); a test holds the constants and the catalogue's keys equal both
/// ways, so a kind never lacks its wording and no wording is left without a kind.
/// </summary>
public static partial class FindingKind
{
    /// <summary>A child: adult thresholds and limits may not apply (every card, full wording).</summary>
    public const string PaediatricCaution = "caution.paediatric";

    /// <summary>A child, short form for the card.</summary>
    public const string PaediatricCautionShort = "caution.paediatric.short";

    /// <summary>The already-reviewed note of a quiet card.</summary>
    public const string AlreadyReviewed = "card.already-reviewed";

    /// <summary>The already-reviewed summary prefix.</summary>
    public const string AlreadyReviewedSummary = "card.already-reviewed.summary";
}
