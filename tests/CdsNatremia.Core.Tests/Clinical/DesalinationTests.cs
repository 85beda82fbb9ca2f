using CdsNatremia.Core.Cards;
using CdsNatremia.Core.CorrectionRate;
using CdsNatremia.Core.Engine;
using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Findings;
using CdsNatremia.Core.Tests.Support;

namespace CdsNatremia.Core.Tests.Clinical;

/// <summary>
/// Issue 13 (7): Adrogué–Madias assumes no urine losses. Urine more concentrated than the infusate (osmolality, or
/// sodium + potassium) means sodium can fall on near-isotonic saline (Steele et al., Ann Intern Med 1997;126:20).
/// </summary>
public class DesalinationTests
{
    private static Card InfusionCard(params LabResult[] urine)
    {
        // 60 kg woman of 55 at 124 mmol/L; 1000 mL 0.9% saline (154 mmol/L, reference sheet): Adrogué–Madias predicts
        // (154 − 124) / (30 + 1) = +1 mmol/L per litre (TBW 0.5 × 60, reference sheet).
        var facts = SomeClinical.Woman(55, [Some.Sodium(124, 3), Some.Lab(Analyte.BodyWeight, 60, 3), .. urine]);
        var cards = SomeClinical.Decide(facts, HookKind.OrderSign, [SomeClinical.Draft("ns", "sodium chloride 0.9% 1000 mL", 1000, "intravenous")]);
        return Assert.Single(cards, c => c.Topic == InfusionPredictionCardProducer.Topic);
    }

    [Fact]
    public void Produce_SalineWithUrineOsmolality640_WarnsSodiumMayFallInsteadOfWithinAllowance()
    {
        // Issue 13's case: urine 640 mOsm/kg above 0.9% saline's 308 (2 × 154; from memory the stated 308): desalination.
        var card = InfusionCard(Some.Lab(Analyte.UrineOsmolality, 640, 3, id: "uosm"));
        Assert.Equal(CardIndicator.Warning, card.Indicator);
        Assert.Contains("sodium may fall", card.Summary, StringComparison.Ordinal);
        Assert.DoesNotContain("within the", card.Summary, StringComparison.Ordinal);
        Assert.Equal(FindingKind.RateInfusionSummaryMayFallPredicted, card.Content!.Summary.Kind);
        Assert.Contains(card.Content.Reasons, f => f.Kind == FindingKind.RateInfusionUrineMayFall);
        Assert.Contains("sodium may fall", card.Report, StringComparison.Ordinal); // the weightiest reason, on the short card
        Assert.Contains("urine osmolality 640 mOsm/kg", card.Report, StringComparison.Ordinal);
        Assert.Contains("the fluid's 308 mOsm/kg", card.Report, StringComparison.Ordinal);
        Assert.Contains("Ann Intern Med 1997;126:20", card.Report, StringComparison.Ordinal);
        Assert.Contains("Observation/uosm", card.ResourcesUsed);
    }

    [Theory]
    [InlineData(308, false)] // equal to the fluid's osmolality: not more concentrated (Steele et al. 1997: "above")
    [InlineData(308.5, true)]
    [InlineData(250, false)]
    public void Produce_UrineOsmolalityAroundTheFluids_MayFallOnlyAbove(double urineOsmolality, bool mayFall)
        => Assert.Equal(mayFall, InfusionCard(Some.Lab(Analyte.UrineOsmolality, urineOsmolality, 3)).Summary.Contains("sodium may fall", StringComparison.Ordinal));

    [Theory]
    [InlineData(120, 34, false)] // 154 = 154: not above the fluid's sodium + potassium (Steele et al. 1997)
    [InlineData(120, 35, true)]  // 155 > 154
    [InlineData(80, 30, false)]
    public void Produce_UrineSodiumPlusPotassiumAroundTheFluids_MayFallOnlyAbove(double urineSodium, double urinePotassium, bool mayFall)
    {
        var card = InfusionCard(Some.Lab(Analyte.UrineSodium, urineSodium, 3), Some.Lab(Analyte.UrinePotassium, urinePotassium, 3));
        Assert.Equal(mayFall, card.Summary.Contains("sodium may fall", StringComparison.Ordinal));
        Assert.Contains(FormattableString.Invariant($"urine sodium + potassium = {urineSodium} + {urinePotassium}"), card.Report, StringComparison.Ordinal);
    }

    [Fact]
    public void Produce_UrineSodiumAloneAboveTheFluid_MayFallWithoutPotassium()
    {
        // 160 > 154 even before urine potassium is added (it can only raise the sum).
        var card = InfusionCard(Some.Lab(Analyte.UrineSodium, 160, 3));
        Assert.Contains("sodium may fall", card.Summary, StringComparison.Ordinal);
        Assert.Contains("urine potassium not available", card.Report, StringComparison.Ordinal);
    }

    [Fact]
    public void Produce_NoUrineData_SaysThePredictionAssumesNoUrineLosses()
    {
        var card = InfusionCard();
        Assert.Contains(card.Content!.Reasons, f => f.Kind == FindingKind.RateInfusionUrineNone);
        Assert.Contains("The prediction assumes no urine losses.", card.Report, StringComparison.Ordinal);
        Assert.Contains("predicted sodium change +1 mmol/L", card.Summary, StringComparison.Ordinal);
    }

    [Fact]
    public void Produce_HypertonicSalineWithConcentratedUrine_PredictionStillHolds()
    {
        // 3% saline is 1026 mOsm/kg (2 × 513, reference sheet sodium): urine 640 is below it.
        var facts = SomeClinical.Woman(55, Some.Sodium(118, 3), Some.Lab(Analyte.BodyWeight, 60, 3), Some.Lab(Analyte.UrineOsmolality, 640, 3));
        var card = Assert.Single(SomeClinical.Decide(facts, HookKind.OrderSign, [SomeClinical.Draft("h", "sodium chloride 3%", 150, "intravenous")]), c => c.Topic == InfusionPredictionCardProducer.Topic);
        Assert.DoesNotContain("sodium may fall", card.Summary, StringComparison.Ordinal);
        Assert.Contains("not above the fluid's 1026 mOsm/kg", card.Report, StringComparison.Ordinal);
    }

    [Fact]
    public void Compare_RingersLactate_UsesItsOsmolalityAndPotassium()
    {
        // Ringer's lactate: sodium 130 (reference sheet), potassium 4 and osmolality 273 (from memory, InfusionOptions).
        var infusate = Infusate.Of(InfusateKind.RingersLactate, new InfusionOptions());
        var urine = new UrineVersusInfusate(Some.Lab(Analyte.UrineOsmolality, 280), Some.Lab(Analyte.UrineSodium, 100), Some.Lab(Analyte.UrinePotassium, 30));
        var (mayFall, lines) = urine.Compare(infusate);
        Assert.True(mayFall); // 280 > 273 and 130 > 134 is false: one is enough
        Assert.Contains(lines, l => l.Kind == FindingKind.RateUrineOsmolalityAbove && l["fluid"] == new NumberValue(273, null));
        Assert.Contains(lines, l => l.Kind == FindingKind.RateUrineSumNotAbove && l["fluid"] == new NumberValue(134, null));
    }
}
