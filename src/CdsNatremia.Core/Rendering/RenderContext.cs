using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Text;

namespace CdsNatremia.Core.Rendering;

/// <summary>What the renderers need besides the findings: the patient's facts (for the data not used) and the display.</summary>
public sealed record RenderContext(PatientFacts Facts, TimeDisplay Display)
{
    /// <summary>The catalogue used (the built-in one unless a test passes another).</summary>
    public PhraseCatalogue Phrases { get; init; } = PhraseCatalogue.Default;
}
