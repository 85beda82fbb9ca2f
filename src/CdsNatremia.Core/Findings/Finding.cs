namespace CdsNatremia.Core.Findings;

/// <summary>
/// What a rule concluded, as data: its kind (the key of its wording in the phrase catalogue), the values it used
/// (typed slots: numbers with their precision, results, times, names), how certain it is, the resources it rests on
/// and the rule that said it. Rules build findings and never sentences; cards, the full report, the audit record and
/// the toolkit render or compare the same findings. Immutable.
/// </summary>
public sealed record Finding
{
    /// <summary>The kind: a key of the phrase catalogue, e.g. "workup.onset.acute" (see <see cref="FindingKind"/>).</summary>
    public required string Kind { get; init; }

    /// <summary>The values the finding used, by name; the catalogue's wording refers to them as {name}.</summary>
    public IReadOnlyList<Slot> Slots { get; init; } = [];

    /// <summary>How certain the finding is; "could not be read" is never judged met or not met.</summary>
    public Certainty Certainty { get; init; } = Certainty.Established;

    /// <summary>Relative references of the resources the finding rests on.</summary>
    public IReadOnlyList<string> Evidence { get; init; } = [];

    /// <summary>How much the finding matters to the short card: higher first (0 = report only unless nothing else).</summary>
    public int Weight { get; init; }

    /// <summary>A finding of <paramref name="kind"/> with <paramref name="slots"/>.</summary>
    public static Finding Of(string kind, params Slot[] slots) => new() { Kind = kind, Slots = slots };

    /// <summary>The value of the slot named <paramref name="name"/>, or null.</summary>
    public SlotValue? this[string name] => Find(name);

    /// <summary>The value of the slot named <paramref name="name"/>, or null (for renderers reading names out of a phrase).</summary>
    public SlotValue? Find(ReadOnlySpan<char> name)
    {
        // An indexed loop: foreach over the interface would allocate an enumerator on every look-up.
        for (var i = 0; i < Slots.Count; i++)
        {
            if (name.SequenceEqual(Slots[i].Name))
            {
                return Slots[i].Value;
            }
        }

        return null;
    }

    /// <summary>The same finding with a weight for the short card.</summary>
    public Finding Weighted(int weight) => this with { Weight = weight };

    /// <summary>The same finding resting on <paramref name="references"/>.</summary>
    public Finding RestingOn(params string[] references) => this with { Evidence = [.. Evidence, .. references] };

    /// <summary>The same finding with a certainty.</summary>
    public Finding With(Certainty certainty) => this with { Certainty = certainty };
}
