namespace CdsNatremia.Core.Findings;

/// <summary>
/// Everything a card says, as findings, before it is worded. The renderers (<see cref="Rendering.CardRenderer"/> for the
/// short card, <see cref="Rendering.ReportRenderer"/> for the full report) turn the same content into text, so the card
/// and the report can never disagree. Producers fill it; it holds no sentences.
/// </summary>
public sealed record CardContent
{
    /// <summary>The summary line: the main finding and the culprit or action (one phrase, under 140 characters).</summary>
    public required Finding Summary { get; init; }

    /// <summary>The main finding, the short card's first line.</summary>
    public required Finding Headline { get; init; }

    /// <summary>The patient-specific reasons; the short card shows the three with the highest weight.</summary>
    public IReadOnlyList<Finding> Reasons { get; init; } = [];

    /// <summary>The reasoning steps, each naming the data it used (full report).</summary>
    public IReadOnlyList<Finding> Steps { get; init; } = [];

    /// <summary>Possible causes to consider (full report).</summary>
    public IReadOnlyList<Finding> Causes { get; init; } = [];

    /// <summary>What clinicians usually consider next; the short card shows the first.</summary>
    public IReadOnlyList<Finding> NextSteps { get; init; } = [];

    /// <summary>Cautions that depend on this patient (high risk, acute, stale, child); all shown on the short card.</summary>
    public IReadOnlyList<Finding> Cautions { get; init; } = [];

    /// <summary>Sources cited (bibliographic data, full report).</summary>
    public IReadOnlyList<string> Sources { get; init; } = [];

    /// <summary>
    /// True when the card's footer names the patient-level cautions of the request (a child) itself; false for cards that
    /// speak about another thing (none today).
    /// </summary>
    public bool Footer { get; init; } = true;

    /// <summary>Every finding of the content, in card order (summary, headline, reasons, steps, causes, next, cautions).</summary>
    public IEnumerable<Finding> All()
    {
        yield return Summary;
        yield return Headline;
        foreach (var list in new[] { Reasons, Steps, Causes, NextSteps, Cautions })
        {
            foreach (var finding in list)
            {
                yield return finding;
            }
        }
    }
}
