using CdsNatremia.Core.Findings;

namespace CdsNatremia.Core.Drugs;

/// <summary>The verdict on a drug's timing and the evidence for it, as a finding (worded by the phrase catalogue).</summary>
/// <param name="Verdict">Likely, possible or unlikely.</param>
/// <param name="Evidence">The evidence, e.g. "started 2026-02-17 (effectivePeriod.start), after sodium 138 mmol/L at …".</param>
public sealed record TimingEvidence(TimingVerdict Verdict, Finding Evidence)
{
    /// <summary>The verdict as a finding: "likely contributor", "possible contributor" or "unlikely to have caused the fall".</summary>
    public Finding VerdictFinding => Finding.Of(Verdict switch
    {
        TimingVerdict.Likely => FindingKind.DrugVerdictLikely,
        TimingVerdict.Possible => FindingKind.DrugVerdictPossible,
        _ => FindingKind.DrugVerdictUnlikely,
    }).With(Certainty);

    /// <summary>How certain the verdict makes the drug as a cause.</summary>
    public Certainty Certainty => Verdict switch
    {
        TimingVerdict.Likely => Certainty.Likely,
        _ => Certainty.Possible,
    };
}
