using System.Text.RegularExpressions;
using CdsNatremia.Core.Facts;

namespace CdsNatremia.Core.Workup;

/// <summary>
/// Medicines and fluids in the record that carry an osmole able to make a low sodium hypertonic or isotonic: mannitol,
/// glycine or sorbitol irrigation fluids and iodinated contrast (common practice; the agent names are generic names, from
/// memory). Matched by whole word in the medication's text, its ingredients' text and its codings' display, since these
/// agents are rarely coded in a way the knowledge files cover. Pure.
/// </summary>
public static class OsmoleAgents
{
    /// <summary>The generic names looked for, with the word a card uses.</summary>
    public static IReadOnlyList<(string Name, string Label)> Names { get; } =
    [
        ("mannitol", "mannitol"),
        ("glycine", "glycine irrigation fluid"),
        ("sorbitol", "sorbitol irrigation fluid"),
        ("iohexol", "iodinated contrast (iohexol)"),
        ("iodixanol", "iodinated contrast (iodixanol)"),
        ("iopamidol", "iodinated contrast (iopamidol)"),
        ("contrast", "contrast medium"),
    ];

    /// <summary>Each medication in the record that names one of the agents, with the agent's label; in reference order.</summary>
    public static IReadOnlyList<(MedicationFact Medication, string Label)> InRecord(PatientFacts facts)
    {
        Guard.NotNull(facts, nameof(facts));
        var found = new List<(MedicationFact, string)>();
        foreach (var medication in facts.Medications.OrderBy(m => m.Reference, StringComparer.Ordinal))
        {
            var texts = new[] { medication.Text }
                .Concat(medication.Ingredients.Select(i => i.Text))
                .Concat(medication.ProductCodes.Select(c => c.Display))
                .Concat(medication.Ingredients.SelectMany(i => i.Codes).Select(c => c.Display))
                .OfType<string>()
                .ToList();
            foreach (var (name, label) in Names)
            {
                if (texts.Any(t => Word(name).IsMatch(t)))
                {
                    found.Add((medication, label));
                    break;
                }
            }
        }

        return found;
    }

    private static Regex Word(string name) => new(@"\b" + Regex.Escape(name) + @"\b", RegexOptions.IgnoreCase | RegexOptions.CultureInvariant, TimeSpan.FromMilliseconds(100));
}
