using CdsNatremia.Core.Findings;

namespace CdsNatremia.Core.Tests.CorrectionRate;

/// <summary>Reads findings in the rate tests: the first of a kind, and a number slot's value.</summary>
internal static class RateFindings
{
    public static Finding Of(IEnumerable<Finding> findings, string kind) => Assert.Single(findings, f => f.Kind == kind);

    public static bool Has(IEnumerable<Finding> findings, string kind) => findings.Any(f => f.Kind == kind);

    public static double Number(Finding finding, string slot)
        => Assert.IsType<NumberValue>(finding[slot]).Value;

    public static Finding Phrase(Finding finding, string slot)
        => Assert.IsType<PhraseValue>(finding[slot]).Finding;
}
