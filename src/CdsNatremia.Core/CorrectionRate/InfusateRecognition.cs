using CdsNatremia.Core.Findings;

namespace CdsNatremia.Core.CorrectionRate;

/// <summary>What the service made of a draft order that looks like an intravenous sodium-containing fluid.</summary>
/// <param name="Infusate">The fluid, or null when it is a sodium chloride fluid whose concentration could not be read.</param>
/// <param name="How">How it was recognised, as a phrase (e.g. "ingredient strength 30 mg/mL" or "RxNorm 313002").</param>
/// <param name="RouteStated">False when the order gives no route (intravenous is then assumed and the card says so).</param>
public sealed record InfusateRecognition(Infusate? Infusate, Finding How, bool RouteStated);
