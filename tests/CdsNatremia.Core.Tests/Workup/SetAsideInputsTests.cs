using CdsNatremia.Core.Findings;
using CdsNatremia.Core.Rendering;
using CdsNatremia.Core.Text;
using CdsNatremia.Core.Engine;
using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Tests.Support;
using CdsNatremia.Core.Workup;

namespace CdsNatremia.Core.Tests.Workup;

/// <summary>
/// Set-aside inputs never read as absent: the SIADH criteria (essential criteria as listed after Schwartz–Bartter and
/// Janicic &amp; Verbalis, reference sheet) and the volume clues say "unknown (could not be read: …)".
/// </summary>
public class SetAsideInputsTests
{
    private static SiadhCriterion Criterion(PatientFacts facts, string startsWith)
    {
        var context = new DecisionContext(Some.Request(facts), new RuleOptions(), WorkupTestData.Knowledge);
        var criteria = SiadhChecklistRule.Evaluate(context, TonicityAssessment.From(context), UrineStudies.From(context));
        return criteria.Single(c => Said(c.Name).StartsWith(startsWith, StringComparison.Ordinal));
    }

    private static string Said(Finding finding) => PhraseCatalogue.Default.Render(finding, TimeDisplay.Utc(Some.Now));

    private static PatientFacts Facts(params MedicationFact[] medications)
        => Some.Facts([.. WorkupTestData.Hypotonic()]) with { Medications = medications };

    private static MedicationFact Stopped(double daysAgo, bool dated = true)
        => WorkupTestData.Hydrochlorothiazide(Some.Now.AddDays(-60)) with
        {
            Use = MedicationUse.Stopped,
            EndedAt = dated ? Some.Now.AddDays(-daysAgo) : null,
        };

    [Fact]
    public void Diuretics_NoMedicine_MetAfterARealLook()
        => Assert.Equal(CriterionStatus.Met, Criterion(Facts(), "No recent diuretic").Status);

    [Fact]
    public void Diuretics_MedicineWhoseProductCouldNotBeRead_CouldNotBeReadNamedByItsText()
    {
        var unreadable = new MedicationFact("MedicationStatement", "combo", [], [], "Blood-pressure combination tablet", MedicationUse.Active, null, null)
        {
            ProductUnreadable = "its Medication resource was not in the data received",
        };
        var criterion = Criterion(Facts(unreadable), "No recent diuretic");
        Assert.Equal(CriterionStatus.CouldNotBeRead, criterion.Status);
        Assert.Equal(FindingKind.SiadhStatusCouldNotBeRead, criterion.StatusKind);
        Assert.Equal(Certainty.CouldNotBeRead, criterion.Data.Certainty);
        Assert.Equal(new TextValue("Blood-pressure combination tablet", Escape: true), criterion.Data["text"]);
    }

    [Fact]
    public void Diuretics_SetAsideMedicationRecord_CouldNotBeRead()
    {
        var facts = Facts() with { SetAside = [new SetAsideItem("MedicationStatement/m9", "MedicationStatement", "a value in it could not be interpreted")] };
        Assert.Equal(CriterionStatus.CouldNotBeRead, Criterion(facts, "No recent diuretic").Status);
    }

    // Recently stopped look-back: default 14 days (from memory).
    [Theory]
    [InlineData(4.0, CriterionStatus.NotMet)]
    [InlineData(13.9, CriterionStatus.NotMet)]
    [InlineData(14.1, CriterionStatus.Met)]
    [InlineData(30.0, CriterionStatus.Met)]
    public void Diuretics_ThiazideStopped_CountsWithinTheLookBack(double daysAgo, CriterionStatus expected)
    {
        var facts = Facts() with { StoppedMedications = [Stopped(daysAgo)] };
        Assert.Equal(expected, Criterion(facts, "No recent diuretic").Status);
    }

    [Fact]
    public void Diuretics_ThiazideStoppedOnUnknownDate_CouldNotBeRead()
    {
        var facts = Facts() with { StoppedMedications = [Stopped(0, dated: false)] };
        Assert.Equal(CriterionStatus.CouldNotBeRead, Criterion(facts, "No recent diuretic").Status);
    }

    [Fact]
    public void Thyroid_OnlyTshSetAside_CouldNotBeReadNotUnknown()
    {
        var facts = Facts() with { SetAside = [new SetAsideItem("Observation/tsh-1", "TSH 2 mg", "unit 'mg' is not accepted", Analyte.Thyrotropin, Some.Now.AddHours(-3))] };
        var criterion = Criterion(facts, "Normal thyroid");
        Assert.Equal(CriterionStatus.CouldNotBeRead, criterion.Status);
        Assert.Contains("Observation/tsh-1", Said(criterion.Data), StringComparison.Ordinal);
    }

    // 2014 European guideline: urine sodium > 30 mmol/L; a report of "< 20" decides "not above 30".
    [Theory]
    [InlineData(ValueComparator.LessThan, 20.0, CriterionStatus.NotMet)]
    [InlineData(ValueComparator.GreaterThan, 40.0, CriterionStatus.Met)]
    [InlineData(ValueComparator.LessThan, 60.0, CriterionStatus.Unknown)]
    public void UrineSodium_Bound_DecidesOnlyWhenItCan(ValueComparator comparator, double value, CriterionStatus expected)
    {
        var facts = Facts() with { BoundedLabs = [Some.Lab(Analyte.UrineSodium, value, 1) with { Comparator = comparator }] };
        Assert.Equal(expected, Criterion(facts, "Urine sodium").Status);
    }

    [Fact]
    public void SiadhVerdict_UnreadableDiureticWithEverythingElseMet_NeverConsistentWithSiadh()
    {
        var unreadable = new MedicationFact("MedicationStatement", "combo", [], [], "combination tablet", MedicationUse.Active, null, null) { ProductUnreadable = "not resolved" };
        var labs = WorkupTestData.Hypotonic().Concat(
        [
            Some.Lab(Analyte.UrineOsmolality, 410, 1), Some.Lab(Analyte.UrineSodium, 52, 1),
            Some.Lab(Analyte.Thyrotropin, 2.1, 2), Some.Lab(Analyte.Cortisol, 420, 2),
        ]);
        var card = WorkupTestData.Card(Some.Facts([.. labs]) with { Medications = [unreadable] });
        Assert.DoesNotContain("consistent with SIADH", card.Report, StringComparison.Ordinal);
        Assert.Contains("diuretic use: **unknown** (could not be read", card.Report, StringComparison.Ordinal);
        // The SIADH line says once that the criterion could not be read, then names the item.
        Assert.Contains("No recent diuretic use: **unknown (could not be read)**: MedicationStatement/combo", card.Report, StringComparison.Ordinal);
        Assert.DoesNotContain("could not be read)**: could not be read", card.Report, StringComparison.Ordinal);
    }

    [Fact]
    public void Card_UrineOsmolalitySetAside_StepSaysUnknownCouldNotBeReadNotJustMissing()
    {
        var facts = Facts() with { SetAside = [new SetAsideItem("Observation/uosm-9", "Urine osmolality 400 mg", "unit 'mg' is not accepted", Analyte.UrineOsmolality, Some.Now.AddHours(-1))] };
        var card = WorkupTestData.Card(facts);
        Assert.Contains("**Urine osmolality**: **unknown** (could not be read: urine osmolality Observation/uosm-9", card.Report, StringComparison.Ordinal);
        Assert.Contains("(2) Urine osmolality > 100 mOsm/kg: **unknown (could not be read)**", card.Report, StringComparison.Ordinal);
    }

    [Fact]
    public void Card_ThiazideStoppedFourDaysAgo_ListedRecentlyStoppedAsPossibleNeverLikely()
    {
        var card = WorkupTestData.Card(Facts() with { StoppedMedications = [Stopped(4)] });
        Assert.Contains("diuretic recently stopped", card.Report, StringComparison.Ordinal);
        Assert.DoesNotContain("likely contributor", card.Report, StringComparison.Ordinal);
    }
}
