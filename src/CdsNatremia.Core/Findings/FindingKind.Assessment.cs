namespace CdsNatremia.Core.Findings;

/// <summary>The assessment card's frame: summary, headline, the card without a usable sodium.</summary>
public static partial class FindingKind
{
    /// <summary>Summary of a low sodium.</summary>
    public const string SummaryLow = "assessment.summary";

    /// <summary>Summary of a low preliminary sodium.</summary>
    public const string SummaryLowPreliminary = "assessment.summary.preliminary";

    /// <summary>Summary of a low sodium shown not to be hypotonic.</summary>
    public const string SummaryNotHypotonic = "assessment.summary.not-hypotonic";

    /// <summary>Summary of a preliminary low sodium shown not to be hypotonic.</summary>
    public const string SummaryNotHypotonicPreliminary = "assessment.summary.not-hypotonic.preliminary";

    /// <summary>Headline of the assessment card.</summary>
    public const string HeadlineLow = "assessment.headline";

    /// <summary>Headline when not hypotonic.</summary>
    public const string HeadlineNotHypotonic = "assessment.headline.not-hypotonic";

    /// <summary>The default summary action.</summary>
    public const string ActionReview = "assessment.action.review";

    /// <summary>The sodium history could not be had (reason on the card).</summary>
    public const string HistoryUnavailable = "assessment.history-unavailable";

    /// <summary>The sodium history step (report).</summary>
    public const string HistoryUnavailableStep = "assessment.history-unavailable.step";

    /// <summary>No usable sodium: summary.</summary>
    public const string UnusableSummary = "assessment.unusable.summary";

    /// <summary>No usable sodium: headline.</summary>
    public const string UnusableHeadline = "assessment.unusable.headline";

    /// <summary>Only another patient's sodium: summary.</summary>
    public const string UnusableOnlyOthersSummary = "assessment.unusable.others.summary";

    /// <summary>Only another patient's sodium: headline.</summary>
    public const string UnusableOnlyOthersHeadline = "assessment.unusable.others.headline";

    /// <summary>No usable sodium: what to do.</summary>
    public const string UnusableNext = "assessment.unusable.next";
}
