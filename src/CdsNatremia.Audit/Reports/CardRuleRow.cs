namespace CdsNatremia.Audit.Reports;

/// <summary>A card and one rule that produced it, as the store reads them for the report.</summary>
/// <param name="Card">The card uuid.</param>
/// <param name="IssuedAt">When it was issued.</param>
/// <param name="RuleId">The rule id.</param>
public sealed record CardRuleRow(Guid Card, DateTimeOffset IssuedAt, string RuleId);
