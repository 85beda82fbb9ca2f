using CdsNatremia.Core.Cards;
using CdsNatremia.Core.Engine;
using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Tests.Support;
using CdsNatremia.Core.Workup;
using static CdsNatremia.Core.Tests.Workup.WorkupTestData;

namespace CdsNatremia.Core.Tests.Workup;

public class WorkupRulesTests
{
    private static PatientFacts Facts(IEnumerable<LabResult> labs, IReadOnlyList<MedicationFact>? meds = null, IReadOnlyList<ConditionFact>? conditions = null)
        => new() { PatientId = Some.PatientId, Labs = [.. labs], Medications = meds ?? [], Conditions = conditions ?? [] };

    [Fact]
    public void Decide_RulesRegisteredInReasoningOrder()
    {
        var card = Card(Facts(Hypotonic()));
        var order = new[] { "sodium.severity", "workup.tonicity", "workup.onset", "workup.urine", "workup.volume-clues", "workup.siadh", "workup.missing-tests" };
        Assert.Equal(order, card.RuleIds.Where(order.Contains).ToArray());
    }

    [Fact]
    public void Tonicity_Measured_HypotonicWithMethodAndEffective()
    {
        var card = Card(Facts(Hypotonic()));
        Assert.Contains("**hypotonic**", card.Report, StringComparison.Ordinal);
        Assert.Contains("measured osmolality, the preferred method", card.Report, StringComparison.Ordinal);
        Assert.Contains("262 − urea 3.6 = 258.4 mOsm/kg", card.Report, StringComparison.Ordinal);
    }

    [Fact]
    public void Tonicity_OnlyCalculated_SaysItCannotExcludeArtefactAndRecommendsMeasured()
    {
        var card = Card(Facts([Some.Sodium(124), Lab(Analyte.Glucose, 5.8), Lab(Analyte.Urea, 5.7)]));
        Assert.Contains("259.5 mOsm/kg (SI units: 2 × 124 + glucose 5.8 + urea 5.7 mmol/L", card.Report, StringComparison.Ordinal);
        Assert.Contains("cannot exclude a falsely low sodium", card.Report, StringComparison.Ordinal);
        Assert.True(Suggestion(card, "2692-2").IsRecommended); // LOINC 2692-2 serum osmolality (reference sheet)
    }

    [Fact]
    public void Tonicity_GlucoseOutsidePairingWindow_NotUsed()
    {
        var card = Card(Facts([Some.Sodium(124, hoursAgo: 1), Lab(Analyte.Glucose, 5.8, hoursAgo: 13.1), Lab(Analyte.Urea, 5.7, hoursAgo: 1)]));
        Assert.Contains("**unknown**", card.Report, StringComparison.Ordinal);
        Assert.True(Suggestion(card, "2345-7").IsRecommended); // LOINC 2345-7 glucose (reference sheet)
    }

    [Fact]
    public void Hypertonic_HighGlucose_BothCorrectionsShownAndSummarySaysNotHypotonic()
    {
        // Scenario-05-like patient: Na 128, glucose 650 mg/dL, measured osmolality 305 → Katz 136.8, Hillier 141.2 (Katz 1973; Hillier 1999).
        var card = Card(Facts([Some.Sodium(128), Lab(Analyte.SerumOsmolality, 305), Lab(Analyte.Glucose, 650 / 18.016), Lab(Analyte.Urea, 28 / 2.8014)]));
        Assert.Contains("**hypertonic**", card.Report, StringComparison.Ordinal);
        Assert.Contains("**136.8 mmol/L**", card.Report, StringComparison.Ordinal);
        Assert.Contains("**141.2 mmol/L**", card.Report, StringComparison.Ordinal);
        Assert.Contains("not hypotonic hyponatremia", card.Report, StringComparison.Ordinal);
        Assert.Contains("corrected sodium 141.2 mmol/L (Hillier)", card.Summary, StringComparison.Ordinal);
        Assert.Equal(CardIndicator.Warning, card.Indicator); // band indicator kept (moderate → warning)
        Assert.DoesNotContain("**SIADH essential criteria**", card.Report, StringComparison.Ordinal);
    }

    [Fact]
    public void Hypertonic_KatzConfigured_SummaryUsesKatz()
    {
        var options = new RuleOptions { Workup = new WorkupOptions { GlucoseCorrection = GlucoseCorrectionMethod.Katz } };
        var card = Card(Facts([Some.Sodium(128), Lab(Analyte.SerumOsmolality, 305), Lab(Analyte.Glucose, 650 / 18.016), Lab(Analyte.Urea, 10)]), options);
        Assert.Contains("corrected sodium 136.8 mmol/L (Katz)", card.Summary, StringComparison.Ordinal);
    }

    [Fact]
    public void Hypertonic_NormalGlucose_OtherOsmolesNamed()
    {
        var card = Card(Facts([Some.Sodium(128), Lab(Analyte.SerumOsmolality, 310), Lab(Analyte.Glucose, 5.5), Lab(Analyte.Urea, 5)]));
        Assert.Contains("**mannitol**", card.Report, StringComparison.Ordinal);
        // Issue 13 (11): a hypertonic low sodium opens with "Not hypotonic" and asks for another osmole (common practice).
        Assert.StartsWith("Not hypotonic: sodium 128 mmol/L (moderate range", card.Summary, StringComparison.Ordinal);
        Assert.Contains("look for another osmole", card.Summary, StringComparison.Ordinal);
    }

    [Fact]
    public void Isotonic_HighTriglyceride_PseudohyponatremiaWithDirectSodiumAndNoTreatment()
    {
        var card = Card(Facts([Some.Sodium(129), Lab(Analyte.SerumOsmolality, 288), Lab(Analyte.Glucose, 6.1), Lab(Analyte.Urea, 5), Lab(Analyte.Triglyceride, 39.5)]));
        Assert.Contains("**isotonic**", card.Report, StringComparison.Ordinal);
        Assert.Contains("**pseudohyponatremia** with very high triglycerides", card.Report, StringComparison.Ordinal);
        Assert.Contains("no sodium treatment is indicated", card.Report, StringComparison.Ordinal);
        Assert.True(Suggestion(card, "2947-0").IsRecommended); // LOINC 2947-0 sodium in blood (reference sheet)
        Assert.False(Suggestion(card, "2885-2").IsRecommended); // total protein missing: offered, not recommended
        Assert.DoesNotContain(card.Suggestions, s => s.Actions[0].Create!.LoincCode == "2955-3"); // urine studies not read when isotonic
    }

    [Theory]
    // A blood-gas sodium is a direct ion-selective electrode value, undisturbed by lipids or proteins (common practice).
    [InlineData(138, true)]
    [InlineData(128, false)]
    public void Isotonic_PairedBloodGasSodium_DecidesArtefactOrReal(double bloodGasSodium, bool artefact)
    {
        var bloodGas = Some.Sodium(bloodGasSodium, hoursAgo: 2.5, specimen: SpecimenKind.ArterialBlood);
        var card = Card(Facts([Some.Sodium(129), bloodGas, Lab(Analyte.SerumOsmolality, 288), Lab(Analyte.Glucose, 6.1), Lab(Analyte.Urea, 5)]));
        Assert.Equal(artefact, card.Report.Contains("which supports an artefact", StringComparison.Ordinal));
        Assert.Equal(!artefact, card.Report.Contains("the low sodium is **real**", StringComparison.Ordinal));
        Assert.DoesNotContain(card.Suggestions, s => s.Actions[0].Create!.LoincCode == "2947-0"); // already measured: not offered again
    }

    [Theory]
    // 2014 European guideline: acute when documented < 48 h; chronic when ≥ 48 h or unknown (reference sheet, verified).
    [InlineData(47.9, true)]
    [InlineData(48, false)]
    [InlineData(60, false)]
    public void Onset_NormalSodiumBeforeTheLowOne_AcuteOnlyWithin48Hours(double hoursBetween, bool acute)
    {
        // The low value is 2 h old; the normal one is hoursBetween before now, so less than that before the low value.
        var card = Card(Facts([.. Hypotonic(), Some.Sodium(140, hoursAgo: hoursBetween)]));
        Assert.Equal(acute, card.Report.Contains("**acute**", StringComparison.Ordinal));
        Assert.Equal(!acute, card.Report.Contains("**chronic or of unknown duration**", StringComparison.Ordinal));
    }

    [Fact]
    public void Onset_FallWithin48HoursButNormalValueOlderThan48HoursNow_Chronic()
    {
        // 2014 European guideline: chronic when it has lasted ≥ 48 h (reference sheet). Normal 30 h before the low value,
        // but the low value is 20 h old: the low sodium may have lasted 50 h by now.
        var card = Card(Facts([.. Hypotonic(hoursAgo: 20), Some.Sodium(140, hoursAgo: 50)]));
        Assert.Contains("**chronic or of unknown duration**", card.Report, StringComparison.Ordinal);
        Assert.Contains("before this assessment", card.Report, StringComparison.Ordinal);
    }

    [Theory]
    // A normal blood-gas sodium just before a low laboratory one is a method question, not a fall; 13 h earlier it counts.
    [InlineData(0.5, false)]
    [InlineData(13, true)]
    public void Onset_NormalBloodGasBesideLowLaboratoryValue_NotReadAsAFallWithinPairingWindow(double hoursBefore, bool acute)
    {
        var card = Card(Facts([.. Hypotonic(), Some.Sodium(139, hoursAgo: 2 + hoursBefore, specimen: SpecimenKind.VenousBlood)]));
        Assert.Equal(acute, card.Report.Contains("so **acute** hyponatremia", StringComparison.Ordinal));
    }

    [Fact]
    public void Onset_AcuteMild_IndicatorRaisedToWarning()
    {
        var card = Card(Facts([.. Hypotonic(132), Some.Sodium(139, hoursAgo: 20)]));
        Assert.Equal(CardIndicator.Warning, card.Indicator); // mild alone is info; acute raises to warning (option default)
    }

    [Fact]
    public void Onset_LowValueBetween_UsesTheLastNormal()
    {
        var card = Card(Facts([.. Hypotonic(), Some.Sodium(131, hoursAgo: 20), Some.Sodium(140, hoursAgo: 70)]));
        Assert.Contains("**chronic or of unknown duration**", card.Report, StringComparison.Ordinal); // last normal 68 h before
    }

    [Theory]
    // Urine osmolality ≤ 100 mOsm/kg: relative excess water intake (2014 European guideline; reference sheet, verified).
    [InlineData(100, true)]
    [InlineData(100.1, false)]
    public void Urine_OsmolalityBoundary(double urineOsmolality, bool dilute)
    {
        var card = Card(Facts([.. Hypotonic(), Lab(Analyte.UrineOsmolality, urineOsmolality), Lab(Analyte.UrineSodium, 50)]));
        Assert.Equal(dilute, card.Report.Contains("**relative excess water intake**", StringComparison.Ordinal));
        Assert.Equal(!dilute, card.Report.Contains("is above 30 mmol/L", StringComparison.Ordinal)); // urine sodium read only when not dilute
    }

    [Theory]
    // Urine sodium ≤ 30 mmol/L: low effective arterial blood volume (2014 European guideline; reference sheet, verified).
    [InlineData(30, true)]
    [InlineData(30.1, false)]
    public void Urine_SodiumBoundary(double urineSodium, bool low)
    {
        var card = Card(Facts([.. Hypotonic(), Lab(Analyte.UrineOsmolality, 400), Lab(Analyte.UrineSodium, urineSodium)]));
        Assert.Equal(low, card.Report.Contains("**low effective arterial blood volume**", StringComparison.Ordinal));
        Assert.Equal(!low, card.Report.Contains("SIADH, adrenal insufficiency, hypothyroidism, cerebral or renal salt wasting", StringComparison.Ordinal));
    }

    [Theory]
    // Urine taken more than 12 h (default) from the serum sodium is labelled.
    [InlineData(12, false)]
    [InlineData(12.5, true)]
    public void Urine_TakenLongAfterSerumSodium_Labelled(double hoursAfter, bool labelled)
    {
        var labs = Hypotonic().Select(l => l with { EffectiveAt = Some.Now.AddHours(-20) }).ToList();
        var card = Card(Facts([.. labs, Lab(Analyte.UrineOsmolality, 400, hoursAgo: 20 - hoursAfter), Lab(Analyte.UrineSodium, 50, hoursAgo: 20 - hoursAfter)]));
        Assert.Equal(labelled, card.Report.Contains("the serum sodium**, more than 12 h apart", StringComparison.Ordinal));
    }

    [Fact]
    public void Urine_TakenAfterDiureticStarted_LabelledAndNotReadAsSiadh()
    {
        var card = Card(Facts([.. Hypotonic(), Lab(Analyte.UrineOsmolality, 400), Lab(Analyte.UrineSodium, 50)], [Hydrochlorothiazide(Some.Now.AddDays(-21))]));
        Assert.Contains("**taken while a diuretic was in use**: hydrochlorothiazide", card.Report, StringComparison.Ordinal);
        Assert.Contains("**cannot be read**", card.Report, StringComparison.Ordinal);
        Assert.Contains("(7) No recent diuretic use: **not met**", card.Report, StringComparison.Ordinal);
    }

    [Fact]
    public void Urine_TakenBeforeDiureticStarted_NotLabelled()
    {
        var card = Card(Facts([.. Hypotonic(), Lab(Analyte.UrineOsmolality, 400), Lab(Analyte.UrineSodium, 50)], [Hydrochlorothiazide(Some.Now.AddHours(-1))]));
        Assert.DoesNotContain("taken while a diuretic was in use", card.Report, StringComparison.Ordinal);
    }

    [Fact]
    public void VolumeClues_ConditionAndDiureticListed_NoVolumeStatusClaimed()
    {
        var card = Card(Facts(Hypotonic(), [Hydrochlorothiazide(Some.Now.AddDays(-30))], [HeartFailure()]));
        Assert.Contains("heart failure (Condition/hf", card.Report, StringComparison.Ordinal);
        Assert.Contains("diuretic in use: hydrochlorothiazide", card.Report, StringComparison.Ordinal);
        Assert.Contains("does **not** decide the volume status", card.Report, StringComparison.Ordinal);
        Assert.Contains("If **high volume**", card.Report, StringComparison.Ordinal);
        Assert.DoesNotContain("patient is hypervolaemic", card.Report, StringComparison.OrdinalIgnoreCase);
    }

    [Fact]
    public void Siadh_AllDataNormal_ConsistentWithSiadhAndEuvolaemiaLeftToClinician()
    {
        var card = Card(Facts([.. Hypotonic(), Lab(Analyte.UrineOsmolality, 480), Lab(Analyte.UrineSodium, 62),
            Lab(Analyte.Thyrotropin, 2.1, hoursAgo: 28), Lab(Analyte.Cortisol, 408, hoursAgo: 28)]));
        Assert.Contains("6 met, 0 not met, 0 unknown", card.Report, StringComparison.Ordinal);
        Assert.Contains("**consistent with SIADH**", card.Report, StringComparison.Ordinal);
        Assert.Contains("(4) Clinical euvolaemia: **for the clinician to assess**", card.Report, StringComparison.Ordinal);
        Assert.DoesNotContain(card.Suggestions, s => s.Actions[0].Create!.LoincCode is "3016-3" or "2143-6");
    }

    [Fact]
    public void Siadh_EndocrineTestsUsed_ListedAmongResourcesUsed()
    {
        var card = Card(Facts([.. Hypotonic(), Lab(Analyte.Thyrotropin, 2.1, id: "tsh"), Lab(Analyte.Cortisol, 408, id: "cort")]));
        Assert.Contains("Observation/tsh", card.ResourcesUsed);
        Assert.Contains("Observation/cort", card.ResourcesUsed);
    }

    [Fact]
    public void Tonicity_MgPerDlUnitWithoutOriginalValue_FallsBackToSiForm()
    {
        var glucose = Lab(Analyte.Glucose, 5.8) with { OriginalUnit = "mg/dL", LoincCode = "2345-7" };
        var bun = Lab(Analyte.Urea, 5.7) with { OriginalUnit = "mg/dL", LoincCode = "3094-0" };
        var card = Card(Facts([Some.Sodium(124), glucose, bun]));
        Assert.Contains("(SI units: 2 × 124", card.Report, StringComparison.Ordinal);
    }

    [Theory]
    // TSH outside the laboratory's range fails "normal thyroid function" (SIADH criteria, reference sheet).
    [InlineData(4.0, "met")]
    [InlineData(4.1, "not met")]
    [InlineData(0.39, "not met")]
    public void Siadh_ThyrotropinBoundary(double tsh, string status)
    {
        var card = Card(Facts([.. Hypotonic(), Lab(Analyte.Thyrotropin, tsh, referenceLow: 0.4, referenceHigh: 4.0)]));
        Assert.Contains($"(5) Normal thyroid function: **{status}**", card.Report, StringComparison.Ordinal);
    }

    [Fact]
    public void Siadh_ConcentratedUrineHighSodiumNoEndocrineTests_TshAndCortisolRecommended()
    {
        var card = Card(Facts([.. Hypotonic(), Lab(Analyte.UrineOsmolality, 480), Lab(Analyte.UrineSodium, 62)]));
        Assert.True(Suggestion(card, "3016-3").IsRecommended);
        Assert.True(Suggestion(card, "2143-6").IsRecommended);
    }

    [Fact]
    public void MissingTests_OnlySodium_WorkUpTestsOfferedWithAnySelection()
    {
        var card = Card(Some.Facts(Some.Sodium(127)));
        // Chart opening: the two most useful missing tests recommended, the next offered, three in all (SuggestionPolicy,
        // a local choice); LOINC codes from the reference sheet.
        Assert.True(Suggestion(card, "2692-2").IsRecommended);
        Assert.True(Suggestion(card, "2345-7").IsRecommended);
        Assert.False(Suggestion(card, "2695-5").IsRecommended);
        Assert.Equal(3, card.Suggestions.Count);
        Assert.DoesNotContain(card.Suggestions, s => s.Actions[0].Create?.LoincCode == "3016-3"); // TSH: not recommended, left for the report
        Assert.Equal(SelectionBehavior.Any, card.SelectionBehavior);
        Assert.All(card.Suggestions, s => Assert.Equal(ActionKind.Create, s.Actions[0].Kind));
    }

    [Fact]
    public void MissingTests_NormalSodium_NoCardSoNothingRecommended()
        => Assert.Empty(Some.Engine(null, WorkupTestData.Knowledge).Decide(Some.Request(Some.Facts(Some.Sodium(135)))));

    [Fact]
    public void SiAndUsUnits_SamePatient_SameAssessment()
    {
        // The same invented patient reported in SI units and in US units (glucose 650 mg/dL = 36.08 mmol/L at 18.016 mg/dL per
        // mmol/L; urea nitrogen 28 mg/dL = 10.0 mmol/L urea at 2.8014): same tonicity, corrections, summary and suggestions.
        var us = Facts([Some.Sodium(128, id: "na"), Lab(Analyte.SerumOsmolality, 305, id: "osm"),
            Lab(Analyte.Glucose, 650 / 18.016, id: "glu") with { OriginalValue = 650, OriginalUnit = "mg/dL", LoincCode = "2345-7" },
            Lab(Analyte.Urea, 28 / 2.8014, id: "bun") with { OriginalValue = 28, OriginalUnit = "mg/dL", LoincCode = "3094-0" }]);
        var si = Facts([Some.Sodium(128, id: "na"), Lab(Analyte.SerumOsmolality, 305, id: "osm"),
            Lab(Analyte.Glucose, 36.1, id: "glu") with { LoincCode = "14749-6" }, Lab(Analyte.Urea, 10.0, id: "bun") with { LoincCode = "22664-7" }]);

        var usCard = Card(us);
        var siCard = Card(si);

        Assert.Equal(siCard.Summary, usCard.Summary);
        Assert.Equal(siCard.Indicator, usCard.Indicator);
        Assert.Equal(siCard.RuleIds, usCard.RuleIds);
        Assert.Equal(siCard.Suggestions.Select(s => s.Key), usCard.Suggestions.Select(s => s.Key));
        foreach (var text in new[] { "**hypertonic**", "**136.8 mmol/L**", "**141.2 mmol/L**", "Osmolal gap** 2.9 mOsm/kg", "= 295 mOsm/kg" })
        {
            Assert.Contains(text, usCard.Report, StringComparison.Ordinal);
            Assert.Contains(text, siCard.Report, StringComparison.Ordinal);
        }
    }

    [Fact]
    public void SiAndUsUnits_CalculatedOsmolality_SameNumbers()
    {
        // Glucose 104 mg/dL = 5.77 mmol/L; urea nitrogen 16 mg/dL = 5.71 mmol/L urea (factors 18.016 and 2.8014, reference sheet).
        // US form 2 × 124 + 104/18 + 16/2.8 and SI form 2 × 124 + 5.8 + 5.7 both give 259.5 mOsm/kg.
        var us = Facts([Some.Sodium(124, id: "na"),
            Lab(Analyte.Glucose, 104 / 18.016, id: "glu") with { OriginalValue = 104, OriginalUnit = "mg/dL", LoincCode = "2345-7" },
            Lab(Analyte.Urea, 16 / 2.8014, id: "bun") with { OriginalValue = 16, OriginalUnit = "mg/dL", LoincCode = "3094-0" }]);
        var si = Facts([Some.Sodium(124, id: "na"), Lab(Analyte.Glucose, 5.8, id: "glu"), Lab(Analyte.Urea, 5.7, id: "bun")]);

        var usCard = Card(us);
        var siCard = Card(si);

        Assert.Equal(siCard.Summary, usCard.Summary);
        Assert.Equal(siCard.Suggestions.Select(s => s.Key), usCard.Suggestions.Select(s => s.Key));
        Assert.Contains("259.5 mOsm/kg (US units as reported: 2 × 124 + glucose 104 mg/dL ÷ 18 + urea nitrogen 16 mg/dL ÷ 2.8", usCard.Report, StringComparison.Ordinal);
        Assert.Contains("259.5 mOsm/kg (SI units: 2 × 124 + glucose 5.8 + urea 5.7 mmol/L", siCard.Report, StringComparison.Ordinal);
        Assert.Contains("**met**: 253.8 mOsm/kg (calculated)", usCard.Report, StringComparison.Ordinal);
        Assert.Contains("**met**: 253.8 mOsm/kg (calculated)", siCard.Report, StringComparison.Ordinal);
    }

    private static Suggestion Suggestion(Card card, string loinc)
        => Assert.Single(card.Suggestions, s => s.Actions[0].Create?.LoincCode == loinc);
}
