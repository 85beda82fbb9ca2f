using CdsNatremia.Core.Facts;
using Hl7.Fhir.Model;

namespace CdsNatremia.Fhir.Reading;

/// <summary>A resource as received, with where it came from.</summary>
/// <param name="Resource">The parsed resource.</param>
/// <param name="FullUrl">The Bundle entry's fullUrl, when it had one (for resolving references).</param>
/// <param name="Source">"prefetch 'sodium'", "context.draftOrders", …</param>
/// <param name="Origin">Prefetch, context or FHIR server.</param>
public sealed record ParsedResource(Resource Resource, string? FullUrl, string Source, DataOrigin Origin);
