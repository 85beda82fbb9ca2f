using CdsNatremia.Core.Findings;
using CdsNatremia.Core.Engine;
using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Sodium;
using CdsNatremia.Core.Tests.Support;

namespace CdsNatremia.Core.Tests.Clinical;

/// <summary>Issue 13 (13): the 2014 European guideline covers adults; a child's cards say adult limits may not apply.</summary>
public class PaediatricTests
{
    private const string ChildCaution = "the thresholds, correction limits and formulas on this card are for adults";

    [Theory]
    [InlineData(17, true)] // under 18: a child (SeverityOptions.AdultFromAgeYears default; common practice)
    [InlineData(18, false)]
    [InlineData(40, false)]
    public void Apply_AgeAroundTheAdultEdge_ChildCautionOnlyUnder18(int age, bool child)
    {
        var card = SomeClinical.Assessment(SomeClinical.Woman(age, Some.Sodium(127, 2)));
        Assert.Equal(child, card.Report.Contains(ChildCaution, StringComparison.Ordinal));
        Assert.Equal(child, card.Summary.Contains("adult limits may not apply", StringComparison.Ordinal));
    }

    [Fact]
    public void Apply_ChildCautionIsTheFirstCautionOnTheShortCard()
    {
        // A decision, not wording: the child caution leads the card's patient-specific cautions (added by the engine, so
        // every card kind carries it) and the report keeps the full adult-guideline caveat.
        var card = SomeClinical.Assessment(SomeClinical.Woman(9, Some.Sodium(122, 2)));
        var caution = card.Content!.Cautions[0];
        Assert.Equal(FindingKind.PaediatricCautionShort, caution.Kind);
        Assert.Equal(new NumberValue(9, 0), caution["age"]);
        Assert.Contains("**Caution:** Child (9 years)", card.Detail, StringComparison.Ordinal);
        Assert.Contains(card.Content.Steps, f => f.Kind == FindingKind.PaediatricCaution);
    }

    [Fact]
    public void Apply_AdultAgeConfiguredAt16_SeventeenIsAnAdult()
    {
        var options = new RuleOptions { Severity = new SeverityOptions { AdultFromAgeYears = 16 } };
        Assert.DoesNotContain(ChildCaution, SomeClinical.Assessment(SomeClinical.Woman(17, Some.Sodium(127, 2)), options).Report, StringComparison.Ordinal);
    }

    [Fact]
    public void Apply_UnknownBirthDate_NoChildCaution()
        => Assert.DoesNotContain(ChildCaution, SomeClinical.Assessment(Some.Facts(Some.Sodium(127, 2))).Report, StringComparison.Ordinal);

    [Fact]
    public void Produce_ChildOnEveryCardKindThatGivesLimits_CautionInEachCard()
    {
        // A 10-year-old at 112 rising to 124 in 20 h (past the 10 mmol/L first-day limit), with a weight, a saline draft,
        // a tolvaptan draft and a citalopram draft: assessment, correction-rate, infusion, rate-caution and drug-order cards.
        var facts = SomeClinical.Woman(10, Some.Sodium(112, 21), Some.Sodium(124, 1), Some.Lab(Analyte.BodyWeight, 30, 3));
        var rate = SomeClinical.Decide(facts);
        var orders = SomeClinical.Decide(facts, HookKind.OrderSign,
        [
            SomeClinical.Draft("saline", "sodium chloride 0.9%", 500, "intravenous"),
            SomeClinical.Draft("tv", "tolvaptan 15 mg", codes: SomeDrugs.Atc("C03XA01")),
            SomeClinical.Draft("cit", "citalopram 10 mg", codes: SomeDrugs.RxNorm("2556")),
        ]);
        var topics = rate.Concat(orders).Select(c => c.Topic).ToHashSet();
        Assert.Superset(new HashSet<string> { "sodium-assessment", "correction-rate", "infusion-prediction", "rate-caution-order", "drug-order-warning" }, topics);
        Assert.All(rate.Concat(orders), c => Assert.Contains(ChildCaution, c.Report, StringComparison.Ordinal));
    }
}
