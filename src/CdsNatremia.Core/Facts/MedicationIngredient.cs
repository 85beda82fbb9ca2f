namespace CdsNatremia.Core.Facts;

/// <summary>One ingredient of a medication product: its codes, its name, and its strength as text when sent.</summary>
/// <param name="Codes">Codings of the ingredient (RxNorm ingredient, ATC, SNOMED CT substance).</param>
/// <param name="Text">Ingredient name as sent.</param>
/// <param name="StrengthText">Strength as sent, e.g. "30 g/1000 mL"; used to recognise sodium chloride concentrations.</param>
public sealed record MedicationIngredient(IReadOnlyList<CodeRef> Codes, string? Text, string? StrengthText = null);
