namespace CdsNatremia.Audit.Records;

/// <summary>What recording one feedback request came to. Nothing is written unless the result is <see cref="Stored"/>.</summary>
public abstract record FeedbackResult
{
    /// <summary>All entries stored (or already present).</summary>
    /// <param name="Added">Entries newly stored.</param>
    /// <param name="Duplicates">Entries that were already stored (same identity).</param>
    public sealed record Stored(int Added, int Duplicates) : FeedbackResult;

    /// <summary>At least one entry names a card this service never issued (HTTP 404); nothing stored.</summary>
    /// <param name="Problems">One line per problem.</param>
    public sealed record UnknownCard(IReadOnlyList<string> Problems) : FeedbackResult;

    /// <summary>
    /// An entry names a card of another service, or a suggestion that is not on its card (HTTP 422); nothing stored.
    /// </summary>
    /// <param name="Problems">One line per problem.</param>
    public sealed record Mismatch(IReadOnlyList<string> Problems) : FeedbackResult;
}
