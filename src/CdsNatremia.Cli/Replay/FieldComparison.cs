namespace CdsNatremia.Cli.Replay;

/// <summary>One manifest field of one scenario compared with what the service answered.</summary>
/// <param name="Scenario">The scenario id.</param>
/// <param name="Field">The manifest field (under <c>expect</c>), e.g. "mentions".</param>
/// <param name="Expected">The manifest's value, as text.</param>
/// <param name="Seen">What the answer shows for it, as text.</param>
/// <param name="Result">pass, fail, or not-applicable (nothing to read: no card expected and none sent, or prose).</param>
internal sealed record FieldComparison(string Scenario, string Field, string Expected, string Seen, FieldResult Result);
