using CdsNatremia.Core.Findings;

namespace CdsNatremia.Core.CorrectionRate;

/// <summary>One reason the patient is at high risk of osmotic demyelination, as findings.</summary>
/// <param name="Kind">Short stable name, e.g. "nadir", "potassium", "alcohol", "malnutrition", "liver".</param>
/// <param name="Description">The factor with its value, unit, time and reference (e.g. "low potassium: 2.9 mmol/L at …").</param>
/// <param name="Name">The factor's short name for a card's caution (e.g. "low potassium").</param>
/// <param name="Reference">The FHIR resource that showed it, when there is one.</param>
public sealed record HighRiskFactor(string Kind, Finding Description, Finding Name, string? Reference);
