using CdsNatremia.Core.CorrectionRate;
using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Findings;
using CdsNatremia.Core.Rendering;
using CdsNatremia.Core.Sodium;
using CdsNatremia.Core.Tests.Support;
using CdsNatremia.Core.Text;

namespace CdsNatremia.Core.Tests.CorrectionRate;

/// <summary>The wording of the correction-rate findings: one worked case per phrase family, and the catalogue complete.</summary>
public class RatePhraseTests
{
    private static readonly TimeDisplay Utc = TimeDisplay.Utc(Some.Now);

    private static string Say(Finding finding) => PhraseCatalogue.Default.Render(finding, Utc);

    [Fact]
    public void Kinds_EveryRateConstant_HasItsPhraseAndEveryRatePhraseItsConstant()
    {
        var constants = typeof(FindingKind).GetFields()
            .Where(f => f.IsLiteral && f.FieldType == typeof(string))
            .Select(f => (string)f.GetRawConstantValue()!)
            .Where(k => k.StartsWith("rate.", StringComparison.Ordinal))
            .ToHashSet(StringComparer.Ordinal);
        var keys = PhraseCatalogue.Default.Keys.Where(k => k.StartsWith("rate.", StringComparison.Ordinal)).ToHashSet(StringComparer.Ordinal);
        Assert.Empty(constants.Except(keys));
        Assert.Empty(keys.Except(constants));
    }

    [Fact]
    public void Window_TwelveIn20HoursFromTheNadir_WordedWithItsInputs()
    {
        // 2014 European guideline (reference sheet): ≤ 10 mmol/L in the first 24 h after the nadir. 112 → 124 in 20 h is 12;
        // projected 12 / 20 h × 4 h more + 12 = 14.4 by the window's end.
        var options = new CorrectionRateOptions();
        var series = SodiumSeries.From(Some.Facts(Some.Sodium(112, 21, id: "nadir"), Some.Sodium(124, 1, id: "last")), Some.Now, new SodiumReadingOptions());
        var episode = CorrectionEpisode.Find(series, options)!;
        var day = RateWindows.Measure(episode, episode.Latest.EffectiveAt, 24, options.Resolve(), false, Some.Now, options);
        Assert.Equal(
            "**24-h window** (anchored at the nadir, 2026-03-09 15:00 UTC to 2026-03-10 15:00 UTC): rise = 124 (Observation/last, 2026-03-10 11:00 UTC) − 112 (Observation/nadir, 2026-03-09 15:00 UTC) = **12 mmol/L** over 20 h; limit (first 24 h after the nadir) 10 mmol/L; at or past the limit; 3 h left in the window (to 2026-03-10 15:00 UTC). Projection: 0.6 mmol/L per h (12 mmol/L / 20 h) × 4 h to the window's end + 12 mmol/L = **14.4 mmol/L** by 2026-03-10 15:00 UTC if the current rate goes on.",
            Say(RateText.Window(day, options)));
    }

    [Theory]
    [InlineData(1.94, "+1.9")]
    [InlineData(-0.44, "-0.4")]
    [InlineData(0.04, "0")] // rounds to 0: no sign
    [InlineData(12.75, "+12.8")] // half away from zero, as every computed result
    public void Signed_Change_SignOnlyWhenPositive(double change, string expected)
        => Assert.Equal(expected, Say(Finding.Of(FindingKind.RateSignedOther, RateText.Signed("value", change))));

    [Fact]
    public void OrderStep_ThreePerCentSalineFor60KgWoman_WordsTheAdrogueMadiasComputation()
    {
        // Adrogué–Madias: (513 + 0 − 118) / (30 + 1) = 12.74 → +12.7 per litre; × 150 / 1000 = 1.91 → +1.9 mmol/L.
        var prediction = Finding.Of(
            FindingKind.RateInfusionPredictionVolume,
            Slot.Number("sodium", 513),
            Slot.Number("potassium", 0),
            Slot.Number("serum", 118),
            Slot.Number("litres", 30),
            RateText.Signed("perLitre", 395.0 / 31),
            Slot.Number("ml", 150),
            RateText.Signed("change", 395.0 / 31 * 0.15));
        var step = Finding.Of(
            FindingKind.RateInfusionStepOrder,
            Slot.Text("name", "NaCl 3%"),
            Slot.Text("ref", "MedicationRequest/h"),
            Slot.Phrase("route", Finding.Of(FindingKind.RateInfusionRouteNotStated)),
            Slot.Phrase("volume", Finding.Of(FindingKind.RateInfusionVolume, Slot.Number("ml", 150))),
            Slot.Phrase("fluid", Infusate.Of(InfusateKind.Saline3, new InfusionOptions()).Name),
            Slot.Phrase("how", Finding.Of(FindingKind.RateHowConcentration)),
            Slot.Number("sodium", 513),
            Slot.Number("potassium", 0),
            Slot.Phrase("prediction", prediction));
        Assert.Equal(
            "**NaCl 3%** (MedicationRequest/h; route not stated (intravenous assumed); 150 mL) read as sodium chloride 3% (concentration in the order text): infusate sodium 513 + potassium 0 mmol/L. **Per litre** = (513 + 0 − 118) / (30 + 1) = **+12.7 mmol/L**; **for 150 mL** = +12.7 × 150 / 1000 = **+1.9 mmol/L**.",
            Say(step));
    }

    [Fact]
    public void HighRiskCaution_TwoFactors_NamesBothAndTheStricterLimit()
    {
        // US expert panel (Verbalis et al. 2013): sodium ≤ 105 mmol/L and low potassium are high-risk factors; 8 mmol/L in any 24 h.
        var facts = Some.Facts(Some.Sodium(104, 2), Some.Lab(Analyte.Potassium, 3.1, 2));
        var options = new CorrectionRateOptions();
        var factors = HighRiskFactors.Find(facts, facts.Labs[0], CdsNatremia.Core.Knowledge.KnowledgeBase.Empty, options);
        Assert.Equal(
            "High risk of osmotic demyelination (sodium ≤ 105 mmol/L, low potassium): ≤ 8 mmol/L in any 24 h.",
            Say(RateText.HighRiskCaution(factors, options.Resolve())!));
    }

    [Fact]
    public void HighRiskCaution_ThreeFactors_CountedToStayShort()
    {
        // US expert panel (Verbalis et al. 2013): sodium ≤ 105, low potassium and advanced liver disease (ICD-10 K74, from memory).
        var facts = Some.Facts(Some.Sodium(104, 2), Some.Lab(Analyte.Potassium, 3.1, 2)) with { Conditions = [SomeClinical.Condition("c", "K74.6", "Cirrhosis")] };
        var options = new CorrectionRateOptions();
        var factors = HighRiskFactors.Find(facts, facts.Labs[0], SomeClinical.Knowledge, options);
        Assert.Equal(3, factors.Count);
        Assert.Equal("High risk of osmotic demyelination (3 factors): ≤ 8 mmol/L in any 24 h.", Say(RateText.HighRiskCaution(factors, options.Resolve())!));
    }

    [Fact]
    public void UrineComparison_SumAboveTheFluid_SaysAbove()
    {
        // Steele et al. 1997: urine sodium + potassium above the fluid's sodium + potassium (0.9% saline, 154 + 0) → may fall.
        var urine = new UrineVersusInfusate(null, Some.Lab(Analyte.UrineSodium, 120, 3, id: "una"), Some.Lab(Analyte.UrinePotassium, 40, 3, id: "uk"));
        var (mayFall, lines) = urine.Compare(Infusate.Of(InfusateKind.Saline09, new InfusionOptions()));
        Assert.True(mayFall);
        Assert.Equal(
            "urine sodium + potassium = 120 + 40 = 160 mmol/L (Observation/una; Observation/uk) is **above** the fluid's sodium + potassium of 154 mmol/L",
            Say(Assert.Single(lines)));
    }
}
