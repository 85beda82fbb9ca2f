namespace CdsNatremia.Core.Drugs;

/// <summary>The verdict on a drug's timing and the sentence that shows the evidence (Markdown, escaped).</summary>
/// <param name="Verdict">Likely, possible or unlikely.</param>
/// <param name="Text">The evidence, e.g. "started 2026-02-17 (effectivePeriod.start), after sodium 138 mmol/L at …".</param>
public sealed record TimingEvidence(TimingVerdict Verdict, string Text)
{
    /// <summary>"likely contributor", "possible contributor" or "unlikely to have caused the fall".</summary>
    public string VerdictText => Verdict switch
    {
        TimingVerdict.Likely => "likely contributor",
        TimingVerdict.Possible => "possible contributor",
        _ => "unlikely to have caused the fall",
    };
}
