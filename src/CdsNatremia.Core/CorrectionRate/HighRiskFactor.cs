namespace CdsNatremia.Core.CorrectionRate;

/// <summary>One reason the patient is at high risk of osmotic demyelination, as a card prints it.</summary>
/// <param name="Kind">Short stable name, e.g. "nadir", "potassium", "alcohol", "malnutrition", "liver".</param>
/// <param name="Description">Plain text with the value, unit, time and reference, already Markdown-safe.</param>
/// <param name="Reference">The FHIR resource that showed it, when there is one.</param>
public sealed record HighRiskFactor(string Kind, string Description, string? Reference);
