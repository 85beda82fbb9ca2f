using System.Text.Json.Nodes;

namespace CdsNatremia.Cli.Population;

/// <summary>One synthetic patient: the Bundle and a short description of what was generated.</summary>
/// <param name="Id">The Patient id, e.g. "pop-42-00007".</param>
/// <param name="Bundle">A collection Bundle of the patient's data.</param>
/// <param name="LatestSodium">The newest sodium written (mmol/L).</param>
/// <param name="Band">"normal", "mild", "moderate" or "profound" by the 2014 European bands (Spasovski et al.).</param>
/// <param name="Medications">Ingredient names of the active medications.</param>
/// <param name="Conditions">Names of the active conditions.</param>
internal sealed record GeneratedPatient(string Id, JsonObject Bundle, double LatestSodium, string Band, IReadOnlyList<string> Medications, IReadOnlyList<string> Conditions);
