using CdsNatremia.Core.Facts;

namespace CdsNatremia.Core.Knowledge;

/// <summary>Why a medication matched a code set: which ingredient, and by which code or name.</summary>
/// <param name="Set">The code set that matched.</param>
/// <param name="Ingredient">The matching ingredient's name when known (e.g. "hydrochlorothiazide"), else the product text.</param>
/// <param name="By">How it matched, for the card: "RxNorm 5487", "ATC C09BA03", "name in text".</param>
/// <param name="ByName">True when only the free-text name matched (no code did).</param>
public sealed record MedicationMatch(CodeSet Set, string Ingredient, string By, bool ByName);
