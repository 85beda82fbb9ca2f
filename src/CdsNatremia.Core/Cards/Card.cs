using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Findings;

namespace CdsNatremia.Core.Cards;

/// <summary>
/// A decision-support card before it becomes CDS Hooks JSON. The host gives it a uuid and a source label.
/// Rule ids and used resources travel with the card for audit; they are not sent to the EHR.
/// </summary>
public sealed record Card
{
    /// <summary>
    /// What the card found, as data (<see cref="CardContent"/>); the engine renders <see cref="Summary"/>,
    /// <see cref="Detail"/> and <see cref="Report"/> from it once.
    /// </summary>
    public CardContent? Content { get; init; }

    /// <summary>One sentence, under 140 characters (rendered from <see cref="Content"/>).</summary>
    public string Summary { get; init; } = string.Empty;

    /// <summary>info, warning or critical.</summary>
    public required CardIndicator Indicator { get; init; }

    /// <summary>The short card in GitHub-flavoured Markdown, at most <see cref="Rendering.CardRenderer.DetailBudget"/> characters.</summary>
    public string Detail { get; init; } = string.Empty;

    /// <summary>
    /// The full report behind the card's link (Markdown): reasoning with the data each step used, data set aside, data not
    /// obtained, cautions and sources.
    /// </summary>
    public string Report { get; init; } = string.Empty;

    /// <summary>Topic code in our own card-topic CodeSystem, e.g. "sodium-assessment".</summary>
    public required string Topic { get; init; }

    /// <summary>The rules that produced the card, e.g. ["sodium.severity", "workup.tonicity"].</summary>
    public required IReadOnlyList<string> RuleIds { get; init; }

    /// <summary>Relative references of the FHIR resources the card's reasoning used.</summary>
    public IReadOnlyList<string> ResourcesUsed { get; init; } = [];

    /// <summary>Suggestions; when non-empty, <see cref="SelectionBehavior"/> is sent.</summary>
    public IReadOnlyList<Suggestion> Suggestions { get; init; } = [];

    /// <summary>How many suggestions a clinician may accept.</summary>
    public SelectionBehavior SelectionBehavior { get; init; } = SelectionBehavior.Any;

    /// <summary>Reasons a clinician may give for overriding the card (codes with display).</summary>
    public IReadOnlyList<CodeRef> OverrideReasons { get; init; } = [];

    /// <summary>The findings fingerprint (<see cref="FindingsFingerprint"/>), set by the engine; empty until then.</summary>
    public string Fingerprint { get; init; } = string.Empty;
}
